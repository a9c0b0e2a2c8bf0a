import { Foundation1764650000000 } from './1764650000000-foundation';
import { Accounts1764700000000 } from './1764700000000-accounts';
import { UnitSystem1796203834000 } from './1796203834000-unit-system';
import { Quizzes1796300000000 } from './1796300000000-quizzes';
import { GradebookStanding1796400000000 } from './1796400000000-gradebook-standing';
import { Notifications1796500000000 } from './1796500000000-notifications';
import { AttemptAnswersVersion1796600000000 } from './1796600000000-attempt-answers-version';
import { StandingSortIndex1796700000000 } from './1796700000000-standing-sort-index';
import { Seats1796800000000 } from './1796800000000-seats';
import { SeatInvitations1796900000000 } from './1796900000000-seat-invitations';

/** Every migration, oldest first. Schema changes happen only here. */
export const migrations = [Foundation1764650000000, Accounts1764700000000, UnitSystem1796203834000, Quizzes1796300000000, GradebookStanding1796400000000, Notifications1796500000000, AttemptAnswersVersion1796600000000, StandingSortIndex1796700000000, Seats1796800000000, SeatInvitations1796900000000];

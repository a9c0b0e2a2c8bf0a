import { User } from '../accounts/user.entity';
import { AuditEntry } from '../admin/audit-entry.entity';
import { AccountToken } from '../auth/account-token.entity';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { LearnerStanding, QuizStanding } from '../gradebook/standing.entity';
import { OutboxMessage } from '../mail/outbox-message.entity';
import { Notification } from '../notifications/notification.entity';
import { LearningRecord } from '../progress/learning-record.entity';
import { LessonProgress } from '../progress/lesson-progress.entity';
import { QuestionVersion } from '../quizzes/question-version.entity';
import { QuizAttempt } from '../quizzes/quiz-attempt.entity';
import { QuizResponse } from '../quizzes/quiz-response.entity';
import { PaymentEvent } from '../seats/payment-event.entity';
import { SeatInvitation } from '../seats/seat-invitation.entity';
import { SeatOrder } from '../seats/seat-order.entity';
import { SeatPool } from '../seats/seat-pool.entity';
import { SeatRefund } from '../seats/seat-refund.entity';
import { Seat } from '../seats/seat.entity';
import { Shop } from '../shops/shop.entity';
import { SeedRun } from './seed-run.entity';

/** Every entity the DataSource knows; feature folders add theirs here. */
export const entities = [
  SeedRun, User, Shop, Cohort, CohortMember, AccountToken, OutboxMessage, AuditEntry,
  QuestionVersion, QuizAttempt, QuizResponse, LessonProgress, LearningRecord,
  QuizStanding, LearnerStanding, Notification,
  SeatPool, Seat, SeatOrder, PaymentEvent, SeatRefund, SeatInvitation,
];

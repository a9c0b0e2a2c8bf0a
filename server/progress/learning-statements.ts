import { randomUUID } from 'node:crypto';

import type { QuizAttempt } from '../quizzes/quiz-attempt.entity';
import type { QuizResponse } from '../quizzes/quiz-response.entity';

/** xAPI 1.0.3 verbs from ADL's registry. */
const VERBS = {
  attempted: 'http://adlnet.gov/expapi/verbs/attempted',
  answered: 'http://adlnet.gov/expapi/verbs/answered',
  passed: 'http://adlnet.gov/expapi/verbs/passed',
  failed: 'http://adlnet.gov/expapi/verbs/failed',
  completed: 'http://adlnet.gov/expapi/verbs/completed',
} as const;
export type LearningVerb = keyof typeof VERBS;

const ASSESSMENT = 'http://adlnet.gov/expapi/activities/assessment';
const INTERACTION = 'http://adlnet.gov/expapi/activities/cmi.interaction';

export interface StatementInput {
  baseUrl: string;
  user: { id: string; name: string };
  quiz: { slug: string; title: string };
  attempt: QuizAttempt;
  responses: readonly QuizResponse[];
}

/**
 * The xAPI statements of one graded attempt: attempted, one answered per question, passed or
 * failed, completed (with result.score.scaled, success and completion). The actor is the account
 * (homePage + id), never an e-mail address; the registration is the attempt's id.
 */
export function learningStatements({ baseUrl, user, quiz, attempt, responses }: StatementInput): Array<{ verb: LearningVerb; statement: Record<string, unknown> }> {
  const timestamp = (attempt.submittedAt ?? new Date()).toISOString();
  const actor = { objectType: 'Agent', name: user.name, account: { homePage: baseUrl, name: user.id } };
  const quizActivity = {
    objectType: 'Activity',
    id: `${baseUrl}/quizzes/${quiz.slug}`,
    definition: { type: ASSESSMENT, name: { 'en-US': quiz.title } },
  };
  const context = { registration: attempt.id, contextActivities: { parent: [{ objectType: 'Activity', id: `${baseUrl}/lessons/${quiz.slug}` }] } };
  const statement = (verb: LearningVerb, object: object, result?: object) => ({
    verb,
    statement: {
      id: randomUUID(),
      actor,
      verb: { id: VERBS[verb], display: { 'en-US': verb } },
      object,
      ...(result ? { result } : {}),
      context,
      timestamp,
    },
  });
  const points = attempt.points ?? 0;
  const max = attempt.maxPoints;
  const score = { scaled: max > 0 ? round4(points / max) : 0, raw: points, min: 0, max };
  const success = attempt.passed === true;
  return [
    statement('attempted', quizActivity),
    ...responses.map((r) =>
      statement(
        'answered',
        { objectType: 'Activity', id: `${baseUrl}/quizzes/${quiz.slug}/questions/${r.questionId}`, definition: { type: INTERACTION } },
        r.status === 'pending'
          ? { completion: r.answer !== null }
          : {
              score: { scaled: r.maxPoints > 0 ? round4((r.overridePoints ?? r.points ?? 0) / r.maxPoints) : 0, raw: r.overridePoints ?? r.points ?? 0, min: 0, max: r.maxPoints },
              success: r.status === 'correct',
              completion: r.answer !== null,
            },
      ),
    ),
    statement(success ? 'passed' : 'failed', quizActivity, { score, success, completion: true }),
    statement('completed', quizActivity, { score, success, completion: true }),
  ];
}

function round4(x: number): number {
  return Math.round(x * 10_000) / 10_000;
}

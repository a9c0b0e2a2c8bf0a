import type { DataSource, EntityManager } from 'typeorm';

import type {
  AttemptScore,
  CorrectedQuestion,
  GradedResponse,
  GradingAttempt,
  GradingQueue,
  GradingQueueItem,
  RegradeChange,
  RegradeResult,
} from '../../shared/api/grading';
import type { ResponseValue } from '../../shared/quiz/answers';
import type { FreshNumbersQuestion, QuestionDefinition, Quantity } from '../../shared/quiz/definition';
import { interpolateStem, isDrawnInput, runEngine } from '../../shared/quiz/draw';
import { gradeResponse } from '../../shared/quiz/grade';
import type { User } from '../accounts/user.entity';
import { recordAudit } from '../admin/audit-log';
import { HttpProblem } from '../http/problem';
import { isUuid } from '../http/uuid';
import type { Mailer } from '../mail/mailer';
import { answerGradedMail } from '../mail/templates/answer-graded';
import { notify } from '../notifications/notifications.service';
import { LearningRecord } from '../progress/learning-record.entity';
import { learningStatements } from '../progress/learning-statements';
import { rescoreAttempt, type AttemptsService } from './attempts.service';
import type { QuestionVersion } from './question-version.entity';
import { gradableApprentices, mayGradeAttemptsOf } from './quiz-access';
import { QuizAttempt } from './quiz-attempt.entity';
import type { QuizLibrary } from './quiz-library';
import { QuizResponse, type RubricMark } from './quiz-response.entity';

export interface GradingServiceOptions {
  readonly quizzes: () => QuizLibrary;
  readonly attempts: AttemptsService;
  readonly mailer: Mailer;
  /** The app's public address, for the link in the e-mail and xAPI ids. */
  readonly appBaseUrl: string;
  readonly now?: () => Date;
}

interface QueueRow {
  response_id: string;
  attempt_id: string;
  attempt_number: number;
  user_id: string;
  display_name: string;
  quiz_slug: string;
  question_id: string;
  position: number;
  version: number;
  submitted_at: Date;
  html: QuestionVersion['html'];
  definition: QuestionDefinition;
  answer: ResponseValue | null;
  max_points: number;
}

/**
 * The instructor's part of quizzes: the queue of written answers, rubric marks (with the e-mail
 * and the in-app notice), overrides of auto-graded answers (audited), and regrades of earlier
 * versions of a question after its key was corrected. Who may act on whose answers is decided in
 * `quiz-access.ts`; the routes admit instructors and admins only.
 */
export class GradingService {
  private readonly now: () => Date;

  constructor(
    private readonly dataSource: DataSource,
    private readonly options: GradingServiceOptions,
  ) {
    this.now = options.now ?? (() => new Date());
  }

  /** Written answers waiting for a grade from the viewer's apprentices, oldest submitted first. */
  async queue(viewer: User, limit: number): Promise<GradingQueue> {
    await this.options.attempts.gradeExpired();
    const scope = gradableApprentices(viewer, 'a.user_id', 1);
    const where = `r.status = 'pending' AND r.override_points IS NULL AND a.status = 'submitted' AND ${scope.sql}`;
    const rows: QueueRow[] = await this.dataSource.query(
      `SELECT r.id AS response_id, a.id AS attempt_id, a.number AS attempt_number, a.user_id, u.display_name,
              a.quiz_slug, r.question_id, r.position, v.version, a.submitted_at, v.html, v.definition, r.answer, r.max_points
         FROM quiz_response r
         JOIN quiz_attempt a ON a.id = r.attempt_id
         JOIN user_account u ON u.id = a.user_id
         JOIN question_version v ON v.id = r.question_version_id
        WHERE ${where}
        ORDER BY a.submitted_at ASC, a.id ASC, r.position ASC
        LIMIT $2`,
      [scope.param, limit],
    );
    const [{ total }] = await this.dataSource.query(
      `SELECT count(*)::int AS total FROM quiz_response r JOIN quiz_attempt a ON a.id = r.attempt_id WHERE ${where}`,
      [scope.param],
    );
    return { items: rows.map((row) => this.queueItem(row)), total };
  }

  private queueItem(row: QueueRow): GradingQueueItem {
    const question = row.definition;
    return {
      responseId: row.response_id,
      attemptId: row.attempt_id,
      attemptNumber: row.attempt_number,
      apprentice: { id: row.user_id, displayName: row.display_name },
      quiz: { slug: row.quiz_slug, title: this.quizTitle(row.quiz_slug) },
      questionId: row.question_id,
      questionNumber: row.position + 1,
      questionVersion: row.version,
      submittedAt: new Date(row.submitted_at).toISOString(),
      stemHtml: row.html.stem,
      answerText: row.answer && 'text' in row.answer ? row.answer.text : '',
      rubric: question.kind === 'written' ? question.rubric.map((c) => ({ criterion: c.criterion, points: c.points })) : [],
      maxPoints: row.max_points,
    };
  }

  /** A submitted attempt as its grader sees it: every answer, key and override. */
  async attempt(viewer: User, attemptId: string): Promise<GradingAttempt> {
    const attempt = isUuid(attemptId) ? await this.dataSource.getRepository(QuizAttempt).findOne({ where: { id: attemptId }, relations: { user: true } }) : null;
    if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
    if (!(await mayGradeAttemptsOf(this.dataSource, viewer, attempt.userId))) throw HttpProblem.forbidden('This apprentice is not in one of your cohorts.');
    const responses = await this.dataSource.getRepository(QuizResponse).find({ where: { attemptId }, relations: { questionVersion: true }, order: { position: 'ASC' } });
    return {
      id: attempt.id,
      number: attempt.number,
      apprentice: { id: attempt.userId, displayName: attempt.user?.displayName ?? '' },
      quiz: { slug: attempt.quizSlug, title: this.quizTitle(attempt.quizSlug) },
      submittedAt: attempt.submittedAt?.toISOString() ?? null,
      score: attempt.status === 'submitted' ? scoreOf(attempt) : null,
      responses: responses.map((r) => {
        const question = r.questionVersion!.definition;
        const html = r.questionVersion!.html;
        return {
          responseId: r.id,
          questionId: r.questionId,
          kind: question.kind,
          stemHtml: question.kind === 'fresh' && r.drawn ? interpolateStem(html.stem, r.drawn.shown) : html.stem,
          answerText: answerText(r.answer),
          keyText: keyText(question, r.key),
          status: r.status,
          points: r.points,
          maxPoints: r.maxPoints,
          override: overrideOf(r),
          overridable: attempt.status === 'submitted' && question.kind !== 'written',
        };
      }),
    };
  }

  /**
   * Rubric marks for a written answer (every criterion once, each within 0…its points) and a
   * comment; the attempt is scored again, the apprentice is told by e-mail, and the result view
   * shows the marks, the comment and when it was graded. Grading again replaces the marks.
   */
  async grade(viewer: User, responseId: string, body: { marks: Array<{ criterion: string; points: number }>; comment: string }): Promise<GradedResponse> {
    const found = await this.responseFor(viewer, responseId);
    const question = found.questionVersion!.definition;
    if (question.kind !== 'written') throw HttpProblem.conflict('Only written answers are graded with a rubric; change an automatic grade with an override.');
    const marks = checkMarks(question.rubric, body.marks);
    const points = roundPoints(marks.reduce((sum, m) => sum + m.points, 0));
    const max = found.maxPoints;
    const gradedAt = this.now();
    const { response, attempt } = await this.dataSource.transaction(async (manager) => {
      await lockSubmitted(manager, found.attemptId);
      await manager.update(
        QuizResponse,
        { id: found.id },
        {
          rubricMarks: marks,
          graderComment: body.comment === '' ? null : body.comment,
          gradedBy: viewer.id,
          gradedAt,
          points,
          status: points >= max ? 'correct' : points > 0 ? 'partial' : 'incorrect',
        },
      );
      const attempt = await rescoreAttempt(manager, found.attemptId);
      const response = (await manager.getRepository(QuizResponse).findOneBy({ id: found.id }))!;
      await this.recordAnswered(manager, attempt, response, gradedAt);
      await notify(manager, {
        userId: attempt.userId,
        kind: 'answer-graded',
        title: `Your written answer is graded: ${this.quizTitle(attempt.quizSlug)}`,
        body: `Question ${response.position + 1}: ${points} of ${max} points. ${scoreLine(attempt)}`,
        link: attemptPath(attempt),
      });
      return { response, attempt };
    });
    await this.notifyGraded(attempt, response);
    return gradedResponse(response, attempt);
  }

  /** A new number of points for an auto-graded answer, with the reason the apprentice will read; audited. */
  async override(viewer: User, responseId: string, body: { points: number; reason: string }): Promise<GradedResponse> {
    const found = await this.responseFor(viewer, responseId);
    const question = found.questionVersion!.definition;
    if (question.kind === 'written') throw HttpProblem.conflict('Written answers are graded with their rubric from the grading queue, not overridden.');
    if (body.points > found.maxPoints) {
      throw HttpProblem.badRequest(`This question is worth ${found.maxPoints} points at most.`, [{ field: 'points', message: `At most ${found.maxPoints} points.` }]);
    }
    const points = roundPoints(body.points);
    const at = this.now();
    const { response, attempt } = await this.dataSource.transaction(async (manager) => {
      const before = await lockSubmitted(manager, found.attemptId);
      await manager.update(QuizResponse, { id: found.id }, { overridePoints: points, overrideReason: body.reason, overrideBy: viewer.id, overrideAt: at });
      const attempt = await rescoreAttempt(manager, found.attemptId);
      await recordAudit(manager, {
        actorId: viewer.id,
        targetId: attempt.userId,
        action: 'quiz.answer-overridden',
        detail: {
          responseId: found.id,
          attemptId: attempt.id,
          quiz: attempt.quizSlug,
          question: found.questionId,
          automaticPoints: found.points,
          previousOverride: found.overridePoints,
          points,
          maxPoints: found.maxPoints,
          reason: body.reason,
          scoreBefore: before.scorePercent,
          scoreAfter: attempt.scorePercent,
        },
      });
      const response = (await manager.getRepository(QuizResponse).findOneBy({ id: found.id }))!;
      await notify(manager, {
        userId: attempt.userId,
        kind: 'answer-overridden',
        title: `Your instructor changed a mark: ${this.quizTitle(attempt.quizSlug)}`,
        body: `Question ${response.position + 1}: now ${points} of ${response.maxPoints} points. Reason: ${body.reason} ${scoreLine(attempt)}`,
        link: attemptPath(attempt),
      });
      return { response, attempt };
    });
    return gradedResponse(response, attempt);
  }

  /**
   * Grades the stored answers of earlier versions of a question again, against the question as
   * it is now: a numeric question's current key; a fresh-numbers question's key computed by the
   * current definition on the numbers each attempt was given; choices by the current correct set.
   * Affected attempts are scored again; the answer lists the apprentices whose score changed.
   * An instructor regrades the attempts of their cohorts' apprentices, an admin everyone's.
   */
  async regrade(viewer: User, quizSlug: string, questionId: string): Promise<RegradeResult> {
    const loaded = this.options.quizzes().quizzes.get(quizSlug);
    if (!loaded) throw HttpProblem.notFound(`There is no quiz "${quizSlug}".`);
    const current = loaded.definition.questions.find((q) => q.id === questionId);
    if (!current) throw HttpProblem.notFound(`Quiz "${quizSlug}" has no question "${questionId}".`);
    if (current.kind === 'written') throw HttpProblem.conflict('Written answers are graded by an instructor; there is no key to regrade against.');
    const currentVersionId = (await this.options.attempts.currentVersions(quizSlug)).get(questionId)!;
    const scope = gradableApprentices(viewer, 'a.user_id', 4);
    return this.dataSource.transaction(async (manager) => {
      const [{ version }] = await manager.query('SELECT version FROM question_version WHERE id = $1', [currentVersionId]);
      const rows: Array<{ id: string; attempt_id: string }> = await manager.query(
        `SELECT r.id, r.attempt_id FROM quiz_response r JOIN quiz_attempt a ON a.id = r.attempt_id
          WHERE a.quiz_slug = $1 AND r.question_id = $2 AND r.question_version_id <> $3 AND a.status = 'submitted' AND ${scope.sql}
          ORDER BY a.submitted_at, a.id`,
        [quizSlug, questionId, currentVersionId, scope.param],
      );
      const attemptIds = [...new Set(rows.map((r) => r.attempt_id))].sort();
      // Attempts locked in one order, so two regrades at once cannot deadlock.
      const before = new Map<string, QuizAttempt>();
      for (const id of attemptIds) before.set(id, await lockSubmitted(manager, id));
      const repo = manager.getRepository(QuizResponse);
      for (const { id } of rows) {
        const response = (await repo.findOne({ where: { id }, relations: { questionVersion: true } }))!;
        const stored = response.questionVersion!.definition;
        if (stored.kind !== current.kind) {
          throw HttpProblem.conflict(`Version ${response.questionVersion!.version} of "${questionId}" is a ${stored.kind} question and the current one a ${current.kind} question; such answers cannot be regraded.`);
        }
        let key: Quantity | undefined;
        let drawn = response.drawn;
        if (current.kind === 'numeric') key = current.key;
        if (current.kind === 'fresh') {
          if (!response.drawn) throw HttpProblem.conflict(`A stored answer to "${questionId}" has no drawn numbers to regrade on.`);
          const inputs = regradeInputs(stored.kind === 'fresh' ? stored.inputs : {}, current.inputs, response.drawn.inputs);
          const run = runEngine(current.calculator, inputs, current.output, current.answerUnit);
          if (!run.ok) throw HttpProblem.conflict(`The current "${questionId}" cannot be computed on the numbers an attempt was given: ${run.message}`);
          key = run.key;
          drawn = { ...response.drawn, steps: run.steps };
        }
        const graded = gradeResponse(current, (response.answer ?? undefined) as ResponseValue | undefined, key ? { key } : {});
        // The points the answer was worth when it was given (the attempt's total stays the same).
        const points = graded.maxPoints > 0 ? roundPoints((graded.points * response.maxPoints) / graded.maxPoints) : 0;
        await repo.update(
          { id },
          {
            points,
            status: graded.status,
            withinTolerance: graded.withinTolerance ?? null,
            answerInKeyUnit: graded.answerInKeyUnit ?? null,
            key: key ?? response.key,
            // jsonb: TypeORM's deep-partial type does not fit a Record of unknowns.
            drawn: drawn as never,
          },
        );
      }
      const changed: RegradeChange[] = [];
      for (const id of attemptIds) {
        const old = before.get(id)!;
        const now = await rescoreAttempt(manager, id);
        if (old.scorePercent !== now.scorePercent || old.passed !== now.passed) {
          const [{ display_name }] = await manager.query('SELECT display_name FROM user_account WHERE id = $1', [now.userId]);
          changed.push({
            apprentice: { id: now.userId, displayName: display_name as string },
            attemptId: id,
            attemptNumber: now.number,
            old: { percent: old.scorePercent ?? 0, passed: old.passed === true },
            new: { percent: now.scorePercent ?? 0, passed: now.passed === true },
          });
          await notify(manager, {
            userId: now.userId,
            kind: 'answer-regraded',
            title: `A corrected answer key changed your score: ${this.quizTitle(quizSlug)}`,
            body: `Attempt ${now.number} was ${percentText(old.scorePercent)} and is now ${percentText(now.scorePercent)}. ${scoreLine(now)}`,
            link: attemptPath(now),
          });
        }
      }
      await recordAudit(manager, {
        actorId: viewer.id,
        targetId: null,
        action: 'quiz.question-regraded',
        detail: { quiz: quizSlug, question: questionId, version, responses: rows.length, changed: changed.map((c) => ({ attemptId: c.attemptId, old: c.old.percent, new: c.new.percent })) },
      });
      changed.sort((a, b) => a.apprentice.displayName.localeCompare(b.apprentice.displayName) || a.attemptNumber - b.attemptNumber);
      return { quizSlug, questionId, currentVersion: version as number, responsesRegraded: rows.length, changed };
    });
  }

  /** Auto-graded questions with submitted answers (from the viewer's apprentices) to an earlier version than today's. */
  async corrections(viewer: User): Promise<CorrectedQuestion[]> {
    const current: Array<{ slug: string; title: string; questionId: string; number: number; versionId: string }> = [];
    for (const [slug, loaded] of this.options.quizzes().quizzes) {
      const versions = await this.options.attempts.currentVersions(slug);
      loaded.definition.questions.forEach((question, i) => {
        if (question.kind !== 'written') current.push({ slug, title: loaded.definition.title, questionId: question.id, number: i + 1, versionId: versions.get(question.id)! });
      });
    }
    if (current.length === 0) return [];
    const scope = gradableApprentices(viewer, 'a.user_id', 2);
    const rows: Array<{ slug: string; question_id: string; version: number; answers: number; regraded_at: Date | null }> = await this.dataSource.query(
      `SELECT c.slug, c.question_id, v.version, count(*)::int AS answers,
              (SELECT max(e.at) FROM audit_entry e
                WHERE e.action = 'quiz.question-regraded' AND e.detail->>'quiz' = c.slug AND e.detail->>'question' = c.question_id
                  AND (e.detail->>'version')::int = v.version) AS regraded_at
         FROM jsonb_to_recordset($1::jsonb) AS c(slug text, question_id text, version_id uuid)
         JOIN question_version v ON v.id = c.version_id
         -- Only the answers to earlier versions are read (by the responses' version index).
         JOIN question_version earlier ON earlier.quiz_slug = c.slug AND earlier.question_id = c.question_id AND earlier.id <> c.version_id
         JOIN quiz_response r ON r.question_version_id = earlier.id
         JOIN quiz_attempt a ON a.id = r.attempt_id AND a.status = 'submitted'
        WHERE ${scope.sql}
        GROUP BY c.slug, c.question_id, v.version`,
      [JSON.stringify(current.map((c) => ({ slug: c.slug, question_id: c.questionId, version_id: c.versionId }))), scope.param],
    );
    return rows
      .map((row) => {
        const question = current.find((c) => c.slug === row.slug && c.questionId === row.question_id)!;
        return {
          quiz: { slug: row.slug, title: question.title },
          questionId: row.question_id,
          questionNumber: question.number,
          currentVersion: row.version,
          earlierAnswers: row.answers,
          lastRegradedAt: row.regraded_at ? new Date(row.regraded_at).toISOString() : null,
        };
      })
      .sort((a, b) => a.quiz.title.localeCompare(b.quiz.title) || a.questionNumber - b.questionNumber);
  }

  /** The response, if the viewer may grade its apprentice: 404 for an unknown id, 403 for another instructor's apprentice. */
  private async responseFor(viewer: User, responseId: string): Promise<QuizResponse> {
    const response = isUuid(responseId)
      ? await this.dataSource.getRepository(QuizResponse).findOne({ where: { id: responseId }, relations: { questionVersion: true, attempt: true } })
      : null;
    if (!response) throw HttpProblem.notFound(`There is no answer "${responseId}".`);
    if (!(await mayGradeAttemptsOf(this.dataSource, viewer, response.attempt!.userId))) throw HttpProblem.forbidden('This apprentice is not in one of your cohorts.');
    if (response.attempt!.status !== 'submitted') throw HttpProblem.conflict('This attempt is not submitted yet; it is graded after its apprentice submits it.');
    return response;
  }

  /** An xAPI `answered` statement for the graded answer (the attempt's own statements stay as they were). */
  private async recordAnswered(manager: EntityManager, attempt: QuizAttempt, response: QuizResponse, at: Date): Promise<void> {
    const [user] = await manager.query('SELECT display_name FROM user_account WHERE id = $1', [attempt.userId]);
    const statements = learningStatements({
      baseUrl: this.options.appBaseUrl,
      user: { id: attempt.userId, name: user?.display_name ?? '' },
      quiz: { slug: attempt.quizSlug, title: this.quizTitle(attempt.quizSlug) },
      attempt,
      responses: [response],
    }).filter((s) => s.verb === 'answered');
    for (const { verb, statement } of statements) {
      await manager.save(manager.create(LearningRecord, { userId: attempt.userId, attemptId: attempt.id, verb, statement: { ...statement, timestamp: at.toISOString() }, storedAt: at }));
    }
  }

  private async notifyGraded(attempt: QuizAttempt, response: QuizResponse): Promise<void> {
    const [user] = await this.dataSource.query('SELECT email, display_name FROM user_account WHERE id = $1', [attempt.userId]);
    if (!user) return;
    const link = `${this.options.appBaseUrl}${attemptPath(attempt)}`;
    this.options.mailer.sendInBackground(
      { to: user.email as string, userId: attempt.userId },
      answerGradedMail({
        name: user.display_name as string,
        quizTitle: this.quizTitle(attempt.quizSlug),
        points: response.points ?? 0,
        maxPoints: response.maxPoints,
        scorePercent: attempt.scorePercent ?? 0,
        passed: attempt.passed === true,
        stillWaiting: attempt.pendingCount,
        link,
      }),
    );
  }

  private quizTitle(slug: string): string {
    return this.options.quizzes().quizzes.get(slug)?.definition.title ?? slug;
  }
}

/** Locks a submitted attempt (FOR UPDATE) for the change; an open one is refused. */
async function lockSubmitted(manager: EntityManager, attemptId: string): Promise<QuizAttempt> {
  const attempt = await manager.getRepository(QuizAttempt).findOne({ where: { id: attemptId }, lock: { mode: 'pessimistic_write' } });
  if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
  if (attempt.status !== 'submitted') throw HttpProblem.conflict('This attempt is not submitted yet.');
  return attempt;
}

/** Every criterion of the rubric once, by its words, within 0…its points; in the rubric's order. */
function checkMarks(rubric: ReadonlyArray<{ criterion: string; points: number }>, marks: ReadonlyArray<{ criterion: string; points: number }>): RubricMark[] {
  const errors: Array<{ field: string; message: string }> = [];
  marks.forEach((mark, i) => {
    const criterion = rubric.find((c) => c.criterion === mark.criterion);
    if (!criterion) errors.push({ field: `marks.${i}.criterion`, message: 'This is not a criterion of the rubric.' });
    else if (mark.points > criterion.points) errors.push({ field: `marks.${i}.points`, message: `At most ${criterion.points} points for this criterion.` });
    if (marks.findIndex((m) => m.criterion === mark.criterion) !== i) errors.push({ field: `marks.${i}.criterion`, message: 'This criterion is marked twice.' });
  });
  for (const criterion of rubric) {
    if (!marks.some((m) => m.criterion === criterion.criterion)) errors.push({ field: 'marks', message: `Give points for "${criterion.criterion}".` });
  }
  if (errors.length) throw HttpProblem.badRequest('Give points for every criterion of the rubric, each within its points.', errors);
  return rubric.map((c) => ({ criterion: c.criterion, points: roundPoints(marks.find((m) => m.criterion === c.criterion)!.points), maxPoints: c.points }));
}

type EngineInputs = Parameters<typeof runEngine>[1];

/**
 * The inputs a fresh-numbers answer is regraded on: the numbers the attempt was drawn (what the
 * apprentice read) and the current definition's fixed values (a corrected constant); an input
 * the current definition no longer names keeps the value the attempt was given.
 */
function regradeInputs(storedDefinition: FreshNumbersQuestion['inputs'], currentDefinition: FreshNumbersQuestion['inputs'], given: Record<string, unknown>): EngineInputs {
  const inputs: Record<string, unknown> = { ...given };
  for (const [name, value] of Object.entries(currentDefinition)) {
    const wasDrawn = storedDefinition[name] !== undefined && isDrawnInput(storedDefinition[name]!);
    if (!isDrawnInput(value) && !wasDrawn) inputs[name] = value;
  }
  return inputs as EngineInputs;
}

/** The attempt's result page in the app. */
function attemptPath(attempt: QuizAttempt): string {
  return `/course/${encodeURIComponent(attempt.quizSlug)}/quiz?attempt=${attempt.id}`;
}

/** The attempt's score in one sentence, for a notification. */
function scoreLine(attempt: QuizAttempt): string {
  const verdict = attempt.pendingCount > 0 ? `${attempt.pendingCount} more waiting for grading` : attempt.passed ? 'passed' : 'not passed yet';
  return `Attempt ${attempt.number} scores ${percentText(attempt.scorePercent)} (${verdict}).`;
}

function percentText(percent: number | null): string {
  return `${Math.round((percent ?? 0) * 10) / 10} %`;
}

function roundPoints(points: number): number {
  return Math.round(points * 100) / 100;
}

function scoreOf(attempt: QuizAttempt): AttemptScore {
  return { points: attempt.points ?? 0, maxPoints: attempt.maxPoints, percent: attempt.scorePercent ?? 0, passed: attempt.passed === true, pendingCount: attempt.pendingCount };
}

function overrideOf(r: QuizResponse): { points: number; reason: string; at: string } | null {
  return r.overridePoints !== null && r.overrideReason !== null ? { points: r.overridePoints, reason: r.overrideReason, at: r.overrideAt?.toISOString() ?? '' } : null;
}

function gradedResponse(r: QuizResponse, attempt: QuizAttempt): GradedResponse {
  return {
    responseId: r.id,
    attemptId: r.attemptId,
    questionId: r.questionId,
    status: r.status ?? 'unanswered',
    points: r.overridePoints ?? r.points ?? 0,
    maxPoints: r.maxPoints,
    ...(r.rubricMarks ? { rubric: r.rubricMarks, comment: r.graderComment } : {}),
    gradedAt: r.gradedAt?.toISOString() ?? null,
    override: overrideOf(r),
    attempt: scoreOf(attempt),
  };
}

function answerText(answer: ResponseValue | null): string | null {
  if (!answer) return null;
  if ('text' in answer) return answer.text;
  if ('choiceId' in answer) return answer.choiceId;
  if ('choiceIds' in answer) return answer.choiceIds.join(', ');
  if ('value' in answer) return `${answer.value} ${answer.unit}`;
  return null;
}

function keyText(question: QuestionDefinition, key: Quantity | null): string | null {
  if (question.kind === 'single' || question.kind === 'multiple') return question.choices.filter((c) => c.correct).map((c) => c.id).join(', ');
  if ((question.kind === 'numeric' || question.kind === 'fresh') && key) return `${Number(key.value.toPrecision(4))} ${key.unit}`;
  return null;
}

import { randomInt } from 'node:crypto';

import { In, type DataSource, type EntityManager } from 'typeorm';

import type { AnswerValue, AttemptQuestion, AttemptView, QuestionResult, QuizSummary } from '../../shared/api/quizzes';
import { answerUnits, validateResponse, type ResponseValue } from '../../shared/quiz/answers';
import type { Step } from '../../shared/airflow';
import type { NumericQuestion, QuestionDefinition, QuizDefinition } from '../../shared/quiz/definition';
import { choiceOrder, drawFresh, interpolateStem, questionSeed, runCheck } from '../../shared/quiz/draw';
import { gradeResponse, toleranceText } from '../../shared/quiz/grade';
import type { User } from '../accounts/user.entity';
import { HttpProblem } from '../http/problem';
import { isUuid } from '../http/uuid';
import { learningStatements } from '../progress/learning-statements';
import { QuestionVersion, type QuestionHtml } from './question-version.entity';
import { mayTakeQuiz, mayViewAttemptsOf } from './quiz-access';
import { QuizAttempt } from './quiz-attempt.entity';
import type { LoadedQuiz, QuizLibrary } from './quiz-library';
import { QuizResponse, type DrawnNumbers } from './quiz-response.entity';

export interface AttemptsServiceOptions {
  /** The quizzes as loaded now (re-read in development). */
  readonly quizzes: () => QuizLibrary;
  readonly now?: () => Date;
  /** A new attempt's seed (tests may fix it); a random 31-bit integer by default. */
  readonly newSeed?: () => number;
  /** The app's public address: xAPI activity ids are made from it. */
  readonly appBaseUrl: string;
}

const MAX_CACHED_VERSIONS = 10_000;

/**
 * Attempts at quizzes: start (draw the numbers, shuffle the choices, keep them), autosave per
 * question, submit (graded once, under a row lock) and the result. The deadline is the server's:
 * an answer saved after it is refused, and an attempt past it is graded on what was saved.
 */
export class AttemptsService {
  private readonly versionIds = new Map<string, string>();
  /** Stored question versions by id: a version never changes once written, so it is read once. */
  private readonly versions = new Map<string, QuestionVersion>();
  private readonly now: () => Date;
  private readonly newSeed: () => number;

  constructor(
    private readonly dataSource: DataSource,
    private readonly options: AttemptsServiceOptions,
  ) {
    this.now = options.now ?? (() => new Date());
    this.newSeed = options.newSeed ?? (() => randomInt(0, 2 ** 31 - 1));
  }

  private quiz(slug: string): LoadedQuiz {
    const quiz = this.options.quizzes().quizzes.get(slug);
    if (!quiz) throw HttpProblem.notFound(`There is no quiz "${slug}". GET /api/quizzes lists them.`);
    return quiz;
  }

  /** Every quiz with the caller's attempts used, best score and status. */
  async list(user: User): Promise<QuizSummary[]> {
    await this.gradeExpired({ userId: user.id });
    const attempts = await this.dataSource.getRepository(QuizAttempt).find({ where: { userId: user.id }, order: { number: 'ASC' } });
    const summaries: QuizSummary[] = [];
    for (const [slug, loaded] of this.options.quizzes().quizzes) {
      const quiz = loaded.definition;
      const mine = attempts.filter((a) => a.quizSlug === slug);
      const graded = mine.filter((a) => a.status === 'submitted');
      const best = bestOf(graded);
      const open = mine.find((a) => a.status === 'open');
      summaries.push({
        slug,
        title: quiz.title,
        questionCount: quiz.questions.length,
        totalPoints: quiz.questions.reduce((sum, q) => sum + maxPointsOf(q), 0),
        passMark: quiz.passMark,
        attemptLimit: quiz.attemptLimit,
        timeLimitMinutes: quiz.timeLimitMinutes ?? null,
        attemptsUsed: mine.length,
        status: best?.passed ? 'passed' : graded.length > 0 ? 'not-yet-passed' : open ? 'in-progress' : 'not-started',
        best: best ? { attemptId: best.id, scorePercent: best.scorePercent ?? 0, passed: best.passed === true, provisional: best.pendingCount > 0 } : null,
        openAttempt: open ? { id: open.id, deadline: open.deadlineAt?.toISOString() ?? null } : null,
        lastActivityAt: latestOf(mine.flatMap((a) => [a.startedAt, a.submittedAt])),
      });
    }
    return summaries;
  }

  /** Starts an attempt: at most `attemptLimit` per apprentice and quiz, also under concurrent starts. */
  async start(user: User, slug: string): Promise<AttemptView> {
    const loaded = this.quiz(slug);
    if (!mayTakeQuiz(user, slug)) throw HttpProblem.forbidden('Only apprentices take quizzes.');
    const quiz = loaded.definition;
    const versions = await this.versionsOf(slug, loaded);
    const attemptId = await this.dataSource.transaction(async (manager) => {
      // One start at a time per apprentice and quiz: the count below cannot go stale.
      await manager.query('SELECT pg_advisory_xact_lock(hashtext($1))', [`quiz-attempt:${user.id}:${slug}`]);
      const [{ used }] = await manager.query('SELECT count(*)::int AS used FROM quiz_attempt WHERE user_id = $1 AND quiz_slug = $2', [user.id, slug]);
      if (used >= quiz.attemptLimit) {
        throw HttpProblem.conflict(`You have used all ${quiz.attemptLimit} attempts at this quiz. Your best attempt counts.`);
      }
      const startedAt = this.now();
      const seed = this.newSeed();
      const attempt = await manager.save(
        manager.create(QuizAttempt, {
          userId: user.id,
          quizSlug: slug,
          number: used + 1,
          seed,
          status: 'open',
          passMark: quiz.passMark,
          startedAt,
          deadlineAt: quiz.timeLimitMinutes ? new Date(startedAt.getTime() + quiz.timeLimitMinutes * 60_000) : null,
          maxPoints: quiz.questions.reduce((sum, q) => sum + maxPointsOf(q), 0),
          pendingCount: 0,
        }),
      );
      const responses = quiz.questions.map((question, position) => {
        const qSeed = questionSeed(seed, question.id) | 0;
        let drawn: DrawnNumbers | null = null;
        let key = null;
        if (question.kind === 'fresh') {
          const draw = drawFresh(question, qSeed);
          drawn = { inputs: draw.inputs, shown: draw.shown, steps: draw.steps };
          key = draw.key;
        } else if (question.kind === 'numeric') {
          key = question.key;
        }
        return manager.create(QuizResponse, {
          attemptId: attempt.id,
          questionVersionId: versions.get(question.id)!,
          questionId: question.id,
          position,
          seed: qSeed,
          choiceOrder: question.kind === 'single' || question.kind === 'multiple' ? choiceOrder(question.choices, qSeed) : null,
          drawn,
          key,
          answer: null,
          maxPoints: maxPointsOf(question),
        });
      });
      await manager.save(responses);
      return attempt.id;
    });
    return this.view(user, attemptId);
  }

  /** The attempt as its apprentice answers it, or its result once graded. */
  async view(viewer: User, attemptId: string): Promise<AttemptView> {
    let attempt = await this.attemptFor(viewer, attemptId, 'view');
    if (attempt.status === 'open' && this.expired(attempt)) {
      await this.gradeOnce(attemptId);
      attempt = (await this.dataSource.getRepository(QuizAttempt).findOneBy({ id: attemptId }))!;
    }
    return this.render(attempt);
  }

  /** Keeps one answer as the draft. A refused answer (wrong kind, unit, not a number) leaves the stored draft as it was. */
  async saveAnswer(user: User, attemptId: string, questionId: string, raw: unknown): Promise<{ questionId: string; answer: AnswerValue | null; savedAt: string }> {
    await this.attemptFor(user, attemptId, 'answer');
    const savedAt = this.now();
    const result = await this.dataSource.transaction(async (manager) => {
      // The attempt's answers version goes up with every save (the row stays locked until this
      // commits): a submit that read the answers before waits for this, finds its version stale and
      // reads again; one that wrote first leaves the status 'submitted' here, and the save is refused.
      const [rows] = (await manager.query('UPDATE quiz_attempt SET answers_version = answers_version + 1 WHERE id = $1 RETURNING status, deadline_at', [attemptId])) as [
        Array<{ status: string; deadline_at: Date | null }>,
        number,
      ];
      const attempt = rows[0];
      if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
      if (attempt.status !== 'open') throw HttpProblem.conflict('This attempt is submitted; answers can no longer change.');
      if (attempt.deadline_at !== null && this.now().getTime() > attempt.deadline_at.getTime()) return 'expired' as const;
      const response = await manager.getRepository(QuizResponse).findOneBy({ attemptId, questionId });
      if (!response) throw HttpProblem.notFound(`This attempt has no question "${questionId}".`);
      await this.withVersions(manager, [response]);
      let answer: ResponseValue | null = null;
      if (raw !== null && raw !== undefined) {
        const checked = validateResponse(response.questionVersion!.definition, raw);
        if (typeof checked === 'string') {
          throw HttpProblem.badRequest(`Question "${questionId}": ${checked}`, [{ field: `answers.${questionId}`, message: checked }]);
        }
        answer = checked;
      }
      await manager.update(QuizResponse, { id: response.id }, { answer, answeredAt: savedAt });
      return answer;
    });
    if (result === 'expired') {
      await this.gradeOnce(attemptId);
      throw HttpProblem.conflict('The time for this attempt is up; the answers saved before it ended are graded.');
    }
    return { questionId, answer: result as AnswerValue | null, savedAt: savedAt.toISOString() };
  }

  /** Final and idempotent: the first submit grades; a repeat or a concurrent one returns the same result. */
  async submit(user: User, attemptId: string): Promise<AttemptView> {
    if (!isUuid(attemptId)) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
    // The grading's own rows when this call graded it; a repeat (or the loser of a race) reads them.
    const graded = await this.gradeOnce(attemptId, user);
    if (graded) return this.render(graded.attempt, graded.responses);
    const attempt = (await this.dataSource.getRepository(QuizAttempt).findOneBy({ id: attemptId }))!;
    return this.render(attempt);
  }

  /** Grades every open attempt past its deadline (of one apprentice, or all). */
  async gradeExpired(where: { userId?: string } = {}): Promise<number> {
    const rows: Array<{ id: string }> = await this.dataSource.query(
      `SELECT id FROM quiz_attempt WHERE status = 'open' AND deadline_at < $1 AND ($2::uuid IS NULL OR user_id = $2)`,
      [this.now(), where.userId ?? null],
    );
    for (const row of rows) await this.gradeOnce(row.id);
    return rows.length;
  }

  private expired(attempt: QuizAttempt): boolean {
    return attempt.deadlineAt !== null && this.now().getTime() > attempt.deadlineAt.getTime();
  }

  /** The attempt, if the caller may see it (`view`) or act on it (`answer`: its apprentice only). */
  private async attemptFor(user: User, attemptId: string, purpose: 'view' | 'answer'): Promise<QuizAttempt> {
    const attempt = isUuid(attemptId) ? await this.dataSource.getRepository(QuizAttempt).findOneBy({ id: attemptId }) : null;
    if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
    const allowed = purpose === 'answer' ? attempt.userId === user.id : await mayViewAttemptsOf(this.dataSource, user, attempt.userId);
    if (!allowed) throw HttpProblem.forbidden('This attempt belongs to someone else.');
    return attempt;
  }

  /**
   * Grades the attempt once, in two round trips: read the attempt with its answers (one statement,
   * one snapshot), grade them here, then write grades, xAPI statements and score in one statement
   * that holds only while the attempt is still open at the answers version read. A concurrent save
   * or submit makes it match nothing: read again (a submitted attempt → null, the caller reads it).
   * `owner`: the apprentice submitting (anyone else's attempt is a 403).
   */
  private async gradeOnce(attemptId: string, owner?: User): Promise<{ attempt: QuizAttempt; responses: QuizResponse[] } | null> {
    const manager = this.dataSource.manager;
    for (;;) {
      const rows = await manager.getRepository(QuizResponse).find({ where: { attemptId }, relations: { attempt: true }, order: { position: 'ASC' } });
      const attempt = rows[0]?.attempt ?? (await manager.getRepository(QuizAttempt).findOneBy({ id: attemptId }));
      if (owner) {
        if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
        if (attempt.userId !== owner.id) throw HttpProblem.forbidden('This attempt belongs to someone else.');
      }
      if (!attempt || attempt.status !== 'open') return null;
      const responses = await this.withVersions(manager, rows);
      for (const response of responses) delete response.attempt;
      const now = this.now();
      const submittedAt = attempt.deadlineAt && now > attempt.deadlineAt ? attempt.deadlineAt : now;
      if (await this.grade(manager, attempt, responses, submittedAt, owner?.displayName)) return { attempt, responses };
    }
  }

  /** Grades the answers read and writes it all, if the attempt is still open at the version read; false when it was not. */
  private async grade(manager: EntityManager, attempt: QuizAttempt, responses: QuizResponse[], submittedAt: Date, displayName?: string): Promise<boolean> {
    let points = 0;
    let pending = 0;
    for (const response of responses) {
      const question = response.questionVersion!.definition;
      const graded = gradeResponse(question, (response.answer ?? undefined) as ResponseValue | undefined, { key: response.key ?? undefined });
      response.points = graded.points;
      response.status = graded.status;
      response.withinTolerance = graded.withinTolerance ?? null;
      response.answerInKeyUnit = graded.answerInKeyUnit ?? null;
      response.gradedAt = submittedAt;
      points += response.overridePoints ?? graded.points;
      if (graded.status === 'pending') pending++;
    }
    const scorePercent = attempt.maxPoints > 0 ? (100 * points) / attempt.maxPoints : 0;
    attempt.status = 'submitted';
    attempt.submittedAt = submittedAt;
    attempt.points = points;
    attempt.scorePercent = scorePercent;
    attempt.passed = passes(points, attempt.maxPoints, attempt.passMark);
    attempt.pendingCount = pending;
    const name = displayName ?? (await manager.query('SELECT display_name FROM user_account WHERE id = $1', [attempt.userId]))[0]?.display_name ?? '';
    const quiz = this.options.quizzes().quizzes.get(attempt.quizSlug)?.definition;
    const statements = learningStatements({
      baseUrl: this.options.appBaseUrl,
      user: { id: attempt.userId, name },
      quiz: { slug: attempt.quizSlug, title: quiz?.title ?? attempt.quizSlug },
      attempt,
      responses,
    });
    // The attempt's score, the grades and the xAPI statements in one statement (a submit is the hot
    // path of a class taking a quiz). The grades and statements are written only if the attempt row
    // was updated (they join its RETURNING); its gradebook trigger fires at the end and sees it all.
    const written = (await manager.query(
      `WITH submitted AS (
         UPDATE quiz_attempt SET status = 'submitted', submitted_at = $2, points = $6, score_percent = $7, passed = $8, pending_count = $9
          WHERE id = $1 AND status = 'open' AND answers_version = $10
         RETURNING id
       ), graded AS (
         UPDATE quiz_response AS r
            SET points = g.points, status = g.status::quiz_response_status, within_tolerance = g.within_tolerance,
                answer_in_key_unit = g.answer_in_key_unit, graded_at = $2
           FROM submitted, jsonb_to_recordset($3::jsonb) AS g(id uuid, points double precision, status text, within_tolerance boolean, answer_in_key_unit double precision)
          WHERE r.id = g.id AND r.attempt_id = submitted.id
       ), recorded AS (
         INSERT INTO learning_record (user_id, attempt_id, verb, statement, stored_at)
         SELECT $4, submitted.id, s.verb, s.statement, $2 FROM submitted, jsonb_to_recordset($5::jsonb) AS s(verb text, statement jsonb)
       )
       SELECT id FROM submitted`,
      [
        attempt.id,
        submittedAt,
        JSON.stringify(responses.map((r) => ({ id: r.id, points: r.points, status: r.status, within_tolerance: r.withinTolerance, answer_in_key_unit: r.answerInKeyUnit }))),
        attempt.userId,
        JSON.stringify(statements),
        points,
        scorePercent,
        attempt.passed,
        pending,
        attempt.answersVersion,
      ],
    )) as Array<{ id: string }>;
    return written.length === 1;
  }

  /** The attempt for the browser: questions as asked, and after grading, the result that teaches. */
  private async render(attempt: QuizAttempt, known?: QuizResponse[]): Promise<AttemptView> {
    const loaded = this.options.quizzes().quizzes.get(attempt.quizSlug);
    const responses =
      known ?? (await this.responsesOf(this.dataSource.manager, attempt.id));
    const graded = attempt.status === 'submitted';
    const view: AttemptView = {
      id: attempt.id,
      quiz: { slug: attempt.quizSlug, title: loaded?.definition.title ?? attempt.quizSlug },
      number: attempt.number,
      attemptLimit: loaded?.definition.attemptLimit ?? attempt.number,
      status: attempt.status,
      startedAt: attempt.startedAt.toISOString(),
      deadline: attempt.deadlineAt?.toISOString() ?? null,
      submittedAt: attempt.submittedAt?.toISOString() ?? null,
      questions: responses.map((response) => {
        const asked = askedQuestion(response);
        return graded ? { ...asked, result: questionResult(response) } : asked;
      }),
    };
    if (graded) {
      view.score = {
        points: attempt.points ?? 0,
        maxPoints: attempt.maxPoints,
        percent: attempt.scorePercent ?? 0,
        passMark: attempt.passMark,
        passed: attempt.passed === true,
        provisional: attempt.pendingCount > 0,
        pendingCount: attempt.pendingCount,
      };
    }
    return view;
  }

  /** An attempt's responses in order, each with its question version (from memory when read before). */
  private async responsesOf(manager: EntityManager, attemptId: string): Promise<QuizResponse[]> {
    const responses = await manager.getRepository(QuizResponse).find({ where: { attemptId }, order: { position: 'ASC' } });
    return this.withVersions(manager, responses);
  }

  private async withVersions(manager: EntityManager, responses: QuizResponse[]): Promise<QuizResponse[]> {
    const missing = [...new Set(responses.map((r) => r.questionVersionId).filter((id) => !this.versions.has(id)))];
    if (missing.length > 0) {
      // A bound on memory: versions in use are few (questions × their corrections); start afresh past it.
      if (this.versions.size + missing.length > MAX_CACHED_VERSIONS) this.versions.clear();
      for (const version of await manager.getRepository(QuestionVersion).findBy({ id: In(missing) })) this.versions.set(version.id, version);
    }
    for (const response of responses) response.questionVersion = this.versions.get(response.questionVersionId)!;
    return responses;
  }

  /** The stored version id of each question of a quiz as it is now (for regrades). */
  async currentVersions(slug: string): Promise<Map<string, string>> {
    return this.versionsOf(slug, this.quiz(slug));
  }

  /** The stored version of each question of a quiz (made when a definition is first served). */
  private async versionsOf(slug: string, loaded: LoadedQuiz): Promise<Map<string, string>> {
    const result = new Map<string, string>();
    const missing: QuestionDefinition[] = [];
    for (const question of loaded.definition.questions) {
      const id = this.versionIds.get(`${slug}\n${question.id}\n${loaded.fingerprints.get(question.id)}`);
      if (id) result.set(question.id, id);
      else missing.push(question);
    }
    if (missing.length === 0) return result;
    await this.dataSource.transaction(async (manager) => {
      await manager.query('SELECT pg_advisory_xact_lock(hashtext($1))', [`question-version:${slug}`]);
      const repo = manager.getRepository(QuestionVersion);
      for (const question of missing) {
        const fingerprint = loaded.fingerprints.get(question.id);
        if (!fingerprint) throw new Error(`quiz ${slug}: question "${question.id}" has no fingerprint`);
        let version = await repo.findOneBy({ quizSlug: slug, questionId: question.id, fingerprint });
        if (!version) {
          const [{ last }] = await manager.query('SELECT coalesce(max(version), 0)::int AS last FROM question_version WHERE quiz_slug = $1 AND question_id = $2', [slug, question.id]);
          const html = loaded.html.get(question.id);
          if (!html) throw new Error(`quiz ${slug}: question "${question.id}" has no rendered HTML`);
          version = await repo.save(repo.create({ quizSlug: slug, questionId: question.id, version: last + 1, fingerprint, definition: question, html }));
        }
        this.versionIds.set(`${slug}\n${question.id}\n${fingerprint}`, version.id);
        result.set(question.id, version.id);
      }
    });
    return result;
  }
}

/**
 * Sums a graded attempt again from its responses (an instructor's override or rubric marks win
 * over the automatic points) and sets score, pass and pending count. For the grading queue,
 * overrides and regrades: call it in the transaction that changed a response.
 */
export async function rescoreAttempt(manager: EntityManager, attemptId: string): Promise<QuizAttempt> {
  const attempt = await manager.getRepository(QuizAttempt).findOne({ where: { id: attemptId }, lock: { mode: 'pessimistic_write' } });
  if (!attempt) throw HttpProblem.notFound(`There is no attempt "${attemptId}".`);
  if (attempt.status !== 'submitted') return attempt;
  const [row] = await manager.query(
    `SELECT coalesce(sum(coalesce(override_points, points, 0)), 0)::float8 AS points,
            count(*) FILTER (WHERE status = 'pending' AND override_points IS NULL)::int AS pending
       FROM quiz_response WHERE attempt_id = $1`,
    [attemptId],
  );
  attempt.points = row.points as number;
  attempt.pendingCount = row.pending as number;
  attempt.scorePercent = attempt.maxPoints > 0 ? (100 * attempt.points) / attempt.maxPoints : 0;
  attempt.passed = passes(attempt.points, attempt.maxPoints, attempt.passMark);
  await manager.update(QuizAttempt, { id: attempt.id }, { points: attempt.points, pendingCount: attempt.pendingCount, scorePercent: attempt.scorePercent, passed: attempt.passed });
  return attempt;
}

/** The attempt with the best score counts (the earliest of equals). */
export function bestOf(graded: readonly QuizAttempt[]): QuizAttempt | undefined {
  let best: QuizAttempt | undefined;
  for (const attempt of graded) if (!best || (attempt.scorePercent ?? 0) > (best.scorePercent ?? 0)) best = attempt;
  return best;
}

export function maxPointsOf(question: QuestionDefinition): number {
  return question.kind === 'written' ? question.rubric.reduce((sum, c) => sum + c.points, 0) : question.points;
}

/** points / max ≥ passMark %, compared without a float's rounding getting in the way. */
export function passes(points: number, maxPoints: number, passMark: number): boolean {
  return maxPoints > 0 && points * 100 >= passMark * maxPoints - 1e-9;
}

/** What the apprentice needs to answer: no key, no rubric, no correctness, no explanation. */
function askedQuestion(response: QuizResponse): AttemptQuestion {
  const question = response.questionVersion!.definition;
  const html: QuestionHtml = response.questionVersion!.html;
  const asked: AttemptQuestion = {
    id: question.id,
    kind: question.kind,
    points: response.maxPoints,
    stemHtml: question.kind === 'fresh' && response.drawn ? interpolateStem(html.stem, response.drawn.shown) : html.stem,
    answer: (response.answer as AnswerValue | null) ?? null,
  };
  if (question.kind === 'single' || question.kind === 'multiple') {
    asked.choices = (response.choiceOrder ?? question.choices.map((c) => c.id)).map((id) => ({ id, html: html.choices?.[id] ?? '' }));
  }
  if (question.kind === 'multiple') {
    asked.partialCredit =
      question.partialCredit === 'per-choice'
        ? 'Each choice you judge right (ticked and correct, or left and wrong) earns its share of the points.'
        : 'Full points only for exactly the correct set; nothing otherwise.';
  }
  if (question.kind === 'numeric' || question.kind === 'fresh') {
    asked.tolerance = toleranceText(question.tolerance);
    asked.answerUnit = question.kind === 'numeric' ? question.key.unit : question.answerUnit;
    asked.units = answerUnits(asked.answerUnit);
  }
  return asked;
}

/** After grading: what the answer earned, the key and the explanation, with the worked steps. */
function questionResult(response: QuizResponse): QuestionResult {
  const question = response.questionVersion!.definition;
  const html: QuestionHtml = response.questionVersion!.html;
  const result: QuestionResult = {
    status: response.status ?? 'unanswered',
    points: response.overridePoints ?? response.points,
    maxPoints: response.maxPoints,
    explanationHtml: html.explanation,
    override:
      response.overridePoints !== null && response.overrideReason !== null
        ? { points: response.overridePoints, reason: response.overrideReason, at: response.overrideAt?.toISOString() ?? '' }
        : null,
  };
  if (question.kind === 'single' || question.kind === 'multiple') result.correctChoices = question.choices.filter((c) => c.correct).map((c) => c.id);
  if (question.kind === 'numeric' || question.kind === 'fresh') {
    if (response.key) result.key = response.key;
    if (response.withinTolerance !== null) result.withinTolerance = response.withinTolerance;
    if (response.answerInKeyUnit !== null) result.answerInKeyUnit = response.answerInKeyUnit;
    if (question.kind === 'fresh') result.steps = response.drawn?.steps ?? [];
    else {
      result.steps = checkSteps(response.questionVersion!.id, question);
    }
  }
  if (question.kind === 'written') {
    if (response.status === 'pending') result.points = null;
    // The rubric is the instructors' until they have graded: then the apprentice sees the marks.
    const marks = response.rubricMarks;
    if (marks) result.rubric = question.rubric.map((c) => ({ criterion: c.criterion, maxPoints: c.points, points: marks?.find((m) => m.criterion === c.criterion)?.points ?? null }));
    result.comment = response.graderComment;
    // When the instructor graded it (the apprentice's notice that the final mark is in).
    result.gradedAt = marks ? (response.gradedAt?.toISOString() ?? null) : null;
  }
  return result;
}

/**
 * The worked steps of a numeric question's `check` line: the same for every attempt at one version,
 * so they are computed once per version (a version never changes; the map holds one entry per
 * question version in use).
 */
const checkStepsByVersion = new Map<string, Step[]>();
function checkSteps(versionId: string, question: NumericQuestion): Step[] {
  let steps = checkStepsByVersion.get(versionId);
  if (!steps) {
    const run = runCheck(question);
    steps = run.ok ? run.steps : [];
    checkStepsByVersion.set(versionId, steps);
  }
  return steps;
}

export type { QuizDefinition };

/** The latest of some times, as ISO text (null when there is none). */
function latestOf(times: ReadonlyArray<Date | null | undefined>): string | null {
  const latest = Math.max(...times.map((t) => t?.getTime() ?? Number.NEGATIVE_INFINITY));
  return Number.isFinite(latest) ? new Date(latest).toISOString() : null;
}

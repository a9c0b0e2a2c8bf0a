import type { DataSource } from 'typeorm';

import { convert, SI_UNIT } from '../../shared/airflow';
import { kindOfUnit } from '../../shared/quiz/answers';
import type { AttemptView } from '../../shared/api/quizzes';
import type { QuestionDefinition, Quantity, QuizDefinition } from '../../shared/quiz/definition';
import { resolve } from 'node:path';

import { loadLessonLibrary } from '../lessons/lesson-library';
import { createUser, migratedTestDataSource, signedIn } from '../testing/accounts';
import { loadQuizLibrary, type QuizLibrary } from './quiz-library';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from './test-quizzes/fixture-quiz';

/** Member names that would give an answer away before submit. */
const FORBIDDEN_KEYS = ['correct', 'correctChoices', 'key', 'rubric', 'criterion', 'explanation', 'explanationHtml', 'withinTolerance', 'answerInKeyUnit', 'result', 'score', 'steps', 'check', 'seed', 'drawn'];

/**
 * Members that hold counts and settings (HTTP status, attempt number, points, pass mark, minutes,
 * the stated tolerance): authored or fixed, never computed from a key, so a number in them that
 * happens to sit near a key tells nothing. Every other number is checked.
 */
// `units` and `answerUnit` are the fixed list of unit names ("inH2O_39F", "inHg_60F"): their digits
// are part of the names, and a pressure key near 39 or 60 would otherwise look leaked.
const SETTINGS = new Set(['status', 'number', 'attemptLimit', 'attemptsUsed', 'passMark', 'points', 'totalPoints', 'questionCount', 'timeLimitMinutes', 'tolerance', 'order', 'minutes', 'index', 'units', 'answerUnit']);

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;
const ISO_TIME = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z/g;

/** Every member name, string and number in a JSON body (numbers inside strings too, outside HTML tags, ids and times). */
function walk(value: unknown, found: { keys: Set<string>; strings: string[]; numbers: number[] }, numbers = true, authored: ReadonlySet<string> = new Set()): void {
  if (typeof value === 'number') {
    if (numbers) found.numbers.push(value);
  } else if (typeof value === 'string') {
    found.strings.push(value);
    if (!numbers) return;
    const text = value.replace(/<[^>]*>/g, ' ').replace(UUID, ' ').replace(ISO_TIME, ' ');
    for (const m of text.matchAll(/-?\d+(?:\.\d+)?(?:e[-+]?\d+)?/gi)) found.numbers.push(Number(m[0]));
  } else if (Array.isArray(value)) value.forEach((v) => walk(v, found, numbers, authored));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      found.keys.add(k);
      walk(v, found, numbers && !authored.has(k) && !SETTINGS.has(k), authored);
    }
  }
}

/** The key in its own unit and in SI: a number within the tolerance of either would give it away. */
function keyBands(key: Quantity, percent: number): Array<[number, number]> {
  const kind = kindOfUnit(key.unit);
  const values = [key.value];
  if (kind && SI_UNIT[kind] !== key.unit && kind !== 'temperature') values.push(convert(key.value, key.unit, SI_UNIT[kind]));
  return values.map((v) => [Math.abs(v) * (1 - percent / 100), Math.abs(v) * (1 + percent / 100)]);
}

/** A numeric or fresh question's tolerance as a percentage of its key (an absolute one converted). */
function tolerancePercent(question: QuestionDefinition, key: Quantity): number {
  if (question.kind !== 'numeric' && question.kind !== 'fresh') return 0;
  const t = question.tolerance;
  if (t.kind === 'relative') return t.percent;
  const amount = t.amount.unit === key.unit ? t.amount.value : Math.abs(convert(t.amount.value, t.amount.unit, key.unit) - convert(0, t.amount.unit, key.unit));
  return (100 * amount) / Math.abs(key.value);
}

describe('no answer leaks before submit', () => {
  let dataSource: DataSource;
  let quiz: QuizDefinition;
  let t: ReturnType<typeof quizTestApp>;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    quiz = fixtureQuiz({ lesson: uniqueSlug('fixture-leak'), timeLimitMinutes: 30 });
    t = quizTestApp(dataSource, fixtureLibrary(quiz));
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it.each([1, 2, 3])('walks every body an apprentice can fetch before submitting (attempt %i): no key, rubric, correctness or explanation', async (attemptNumber) => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    const bodies: unknown[] = [];
    const keep = (res: { status: number; body: unknown }) => {
      expect(res.status).toBeLessThan(500);
      bodies.push(res.body);
      return res.body;
    };
    keep(await browser.get('/api/quizzes'));
    keep(await browser.get('/api/lessons'));
    let view!: AttemptView;
    for (let i = 0; i < attemptNumber; i++) {
      if (view) await browser.send('post', `/api/attempts/${view.id}/submit`); // earlier attempts, not walked after their submit
      view = keep(await browser.send('post', `/api/quizzes/${quiz.lesson}/attempts`)) as AttemptView;
    }
    bodies.length = 0; // only what this attempt shows before its submit
    keep(await browser.get('/api/quizzes'));
    keep(await browser.get('/api/lessons'));
    keep(await browser.get(`/api/attempts/${view.id}`));
    const answers: Record<string, unknown> = {
      'why-test-pressure': { choiceId: 'b' },
      'which-are-differential': { choiceIds: ['b', 'c'] },
      'convert-reading': { value: 250, unit: 'cfm' },
      'fresh-conversion': { value: 100, unit: 'cfm' },
      'explain-overlap': { text: 'The bands overlap, so no gain.' },
    };
    for (const [questionId, answer] of Object.entries(answers)) keep(await browser.send('put', `/api/attempts/${view.id}/answers/${questionId}`, { answer }));
    keep(await browser.send('put', `/api/attempts/${view.id}/answers/convert-reading`, { answer: { value: 300, unit: 'kPa' } })); // a refused one too
    keep(await browser.get(`/api/attempts/${view.id}`));

    const found = { keys: new Set<string>(), strings: [] as string[], numbers: [] as number[] };
    bodies.forEach((b) => walk(b, found));

    expect(FORBIDDEN_KEYS.filter((k) => found.keys.has(k))).toEqual([]);
    const text = found.strings.join('\n');
    for (const question of quiz.questions) {
      expect(text).not.toContain(question.explanation);
      if (question.kind === 'written') for (const c of question.rubric) expect(text).not.toContain(c.criterion);
      if (question.kind === 'single' || question.kind === 'multiple') expect(JSON.stringify(bodies)).not.toMatch(/"correct"\s*:/);
    }
    // The keys this attempt was given: the numeric question's and the fresh one's (drawn for it).
    const keys: Array<{ key: Quantity }> = await dataSource.query(`SELECT key FROM quiz_response WHERE attempt_id = $1 AND key IS NOT NULL`, [view.id]);
    expect(keys).toHaveLength(2);
    const bands = keys.flatMap(({ key }) => keyBands(key, 1));
    const leaks = (numbers: number[]) => numbers.filter((n) => bands.some(([lo, hi]) => Math.abs(n) >= lo && Math.abs(n) <= hi));
    expect(leaks(found.numbers)).toEqual([]);

    // The walk sees the numbers the stems show (28 inH2O), and would see a key written into any text.
    expect(found.numbers).toContain(28);
    for (const { key } of keys) {
      const planted = { keys: new Set<string>(), strings: [] as string[], numbers: [] as number[] };
      walk({ stemHtml: `<p>It flows <b>${key.value.toFixed(1)}</b> ${key.unit}.</p>` }, planted);
      expect(leaks(planted.numbers)).not.toEqual([]);
    }
  });
});

/**
 * The same walk over the course's own quizzes (content/quizzes) and each quiz's lesson page: keys,
 * rubrics, correctness and explanations never appear before submit. Numbers: the authors' own text
 * (stems with their drawn numbers, choices, lesson prose) is what the apprentice must read, and in
 * a whole quiz some of its numbers fall near some key by chance; so here the numbers are checked
 * in everything the server adds around that text (the fixture quiz above checks every number).
 */
describe('no answer leaks before submit: the course quizzes', () => {
  let dataSource: DataSource;
  let library: QuizLibrary;
  let t: ReturnType<typeof quizTestApp>;
  const lessonsDir = resolve('content/lessons');

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    library = loadQuizLibrary(resolve('content/quizzes'), loadLessonLibrary(lessonsDir).lessons.map((l) => l.meta.slug));
    t = quizTestApp(dataSource, library, { lessonsDir });
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it('loads every course quiz', () => {
    expect(library.errors).toEqual([]);
    expect(library.quizzes.size).toBeGreaterThan(0);
  });

  it('walks the quiz list, each quiz start, attempt, autosaves and lesson page', async () => {
    const browser = await signedIn(t.app, await createUser(dataSource));
    const problems: object[] = [];
    for (const [slug, loaded] of library.quizzes) {
      const bodies: unknown[] = [];
      const keep = (res: { status: number; body: unknown }) => {
        expect({ slug, status: res.status }).toEqual({ slug, status: expect.any(Number) });
        expect(res.status).toBeLessThan(500);
        bodies.push(res.body);
        return res.body;
      };
      keep(await browser.get('/api/quizzes'));
      const view = keep(await browser.send('post', `/api/quizzes/${slug}/attempts`)) as AttemptView;
      expect(view.questions).toHaveLength(loaded.definition.questions.length);
      for (const question of view.questions) {
        const answer =
          question.kind === 'single' ? { choiceId: question.choices![0]!.id }
          : question.kind === 'multiple' ? { choiceIds: [question.choices![0]!.id] }
          : question.kind === 'written' ? { text: 'A draft.' }
          : { value: 123456789, unit: question.answerUnit };
        const saved = await browser.send('put', `/api/attempts/${view.id}/answers/${question.id}`, { answer });
        expect({ slug, question: question.id, status: saved.status }).toEqual({ slug, question: question.id, status: 200 });
        keep(saved);
      }
      keep(await browser.get(`/api/attempts/${view.id}`));
      const lesson = await browser.get(`/api/lessons/${slug}`);
      expect(lesson.status).toBe(200);

      const found = { keys: new Set<string>(), strings: [] as string[], numbers: [] as number[] };
      bodies.forEach((b) => walk(b, found, true, new Set(['stemHtml', 'html'])));
      const lessonFound = { keys: new Set<string>(), strings: [] as string[], numbers: [] as number[] };
      walk(lesson.body, lessonFound, false);
      expect({ slug, keys: FORBIDDEN_KEYS.filter((k) => found.keys.has(k)) }).toEqual({ slug, keys: [] });
      const text = [...found.strings, ...lessonFound.strings].join('\n');
      for (const question of loaded.definition.questions) {
        const html = loaded.html.get(question.id)!;
        expect({ slug, question: question.id, explanation: text.includes(html.explanation) }).toEqual({ slug, question: question.id, explanation: false });
        if (question.kind === 'written') for (const c of question.rubric) expect(text).not.toContain(c.criterion);
      }
      const keys: Array<{ question_id: string; key: Quantity }> = await dataSource.query(`SELECT question_id, key FROM quiz_response WHERE attempt_id = $1 AND key IS NOT NULL`, [view.id]);
      for (const { question_id, key } of keys) {
        const question = loaded.definition.questions.find((q) => q.id === question_id)!;
        const bands = keyBands(key, tolerancePercent(question, key));
        const leaked = found.numbers.filter((n) => bands.some(([lo, hi]) => Math.abs(n) >= lo && Math.abs(n) <= hi));
        if (leaked.length > 0) problems.push({ slug, question: question_id, key, leaked });
      }
    }
    expect(problems).toEqual([]);
  }, 60_000);
});

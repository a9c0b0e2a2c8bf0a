import type { DataSource } from 'typeorm';

import { convert } from '../../shared/airflow';
import type { AttemptView } from '../../shared/api/quizzes';
import type { Quantity, QuizDefinition } from '../../shared/quiz/definition';
import { createUser, migratedTestDataSource, signedIn } from '../testing/accounts';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from './test-quizzes/fixture-quiz';

/** Member names that would give an answer away before submit. */
const FORBIDDEN_KEYS = ['correct', 'correctChoices', 'key', 'rubric', 'criterion', 'explanation', 'explanationHtml', 'withinTolerance', 'answerInKeyUnit', 'result', 'score', 'steps', 'check', 'seed', 'drawn'];

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;
const ISO_TIME = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z/g;

/** Every member name, string and number in a JSON body (numbers inside strings too, outside HTML tags, ids and times). */
function walk(value: unknown, found: { keys: Set<string>; strings: string[]; numbers: number[] }): void {
  if (typeof value === 'number') found.numbers.push(value);
  else if (typeof value === 'string') {
    found.strings.push(value);
    const text = value.replace(/<[^>]*>/g, ' ').replace(UUID, ' ').replace(ISO_TIME, ' ');
    for (const m of text.matchAll(/-?\d+(?:\.\d+)?(?:e[-+]?\d+)?/gi)) found.numbers.push(Number(m[0]));
  } else if (Array.isArray(value)) value.forEach((v) => walk(v, found));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      found.keys.add(k);
      walk(v, found);
    }
  }
}

/** The key in its own unit and in SI: a number within the tolerance of either would give it away. */
function keyBands(key: Quantity, percent: number): Array<[number, number]> {
  const si = convert(key.value, key.unit, 'm^3/s');
  return [key.value, si].map((v) => [Math.abs(v) * (1 - percent / 100), Math.abs(v) * (1 + percent / 100)]);
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

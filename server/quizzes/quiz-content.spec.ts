import { join } from 'node:path';

import { convert, describeCalculator, type Bound } from '../../shared/airflow';
import { kindOfUnit } from '../../shared/quiz/answers';
import type { DrawnInput, FreshNumbersQuestion, QuestionDefinition } from '../../shared/quiz/definition';
import { drawFresh, isDrawnInput, questionSeed, runCheck, stepCount } from '../../shared/quiz/draw';
import { gradeResponse, isWithinTolerance } from '../../shared/quiz/grade';
import { loadLessonLibrary } from '../lessons/lesson-library';
import { loadQuizLibrary } from './quiz-library';

// The quiz content tests, like the lesson ones: a quiz that would not load, a key the engine does
// not reproduce, or fresh numbers that could leave a calculator's range fail here instead of
// reaching an apprentice. `QUIZ=<lesson slug>` runs one quiz.
const lessons = loadLessonLibrary(join(__dirname, '../../content/lessons'));
const slugs = lessons.lessons.map((l) => l.meta.slug);
const library = loadQuizLibrary(join(__dirname, '../../content/quizzes'), slugs);
const only = process.env['QUIZ'];
const quizzes = [...library.quizzes.values()].filter((q) => !only || q.definition.lesson === only);
const SEEDS = 200;
const KINDS: QuestionDefinition['kind'][] = ['single', 'multiple', 'numeric', 'fresh', 'written'];

/** Whether an SI-comparable value lies inside a catalogue bound (inclusive or not). */
function insideBound(value: number, unit: string, bound: Bound | undefined, side: 'min' | 'max'): boolean {
  if (bound === undefined) return true;
  const v = convert(value, unit, bound.unit);
  if (side === 'min') return bound.inclusive ? v >= bound.value : v > bound.value;
  return bound.inclusive ? v <= bound.value : v < bound.value;
}

describe('the course quizzes', () => {
  it('load without an error', () => {
    expect(library.errors.filter((line) => !only || line.includes(`-${only}.yaml`) || line.startsWith(`${only}.yaml`))).toEqual([]);
  });

  it('one for every lesson (ten)', () => {
    if (only) return expect(library.quizzes.has(only)).toBe(true);
    expect(slugs).toHaveLength(10);
    expect(library.missing).toEqual([]);
    expect([...library.quizzes.keys()].sort()).toEqual([...slugs].sort());
  });

  it('use every kind of question across the course', () => {
    if (only) return;
    const used = new Set([...library.quizzes.values()].flatMap((q) => q.definition.questions.map((question) => question.kind)));
    expect([...used].sort()).toEqual([...KINDS].sort());
  });
});

describe.each(quizzes.map((q) => [q.definition.lesson, q] as const))('quiz %s', (slug, quiz) => {
  const questions = quiz.definition.questions;
  const fresh = questions.filter((q): q is FreshNumbersQuestion => q.kind === 'fresh');
  const lesson = lessons.lessons.find((l) => l.meta.slug === slug)!;

  it('has at least 6 questions', () => {
    expect(questions.length).toBeGreaterThanOrEqual(6);
  });

  it('has a fresh-numbers and a written question when its lesson embeds a calculator', () => {
    if (lesson.embeds.length === 0) return;
    expect(questions.filter((q) => q.kind === 'fresh').length).toBeGreaterThanOrEqual(1);
    expect(questions.filter((q) => q.kind === 'written').length).toBeGreaterThanOrEqual(1);
  });

  it('states numeric keys the engine reproduces within their tolerance (check)', () => {
    for (const question of questions) {
      if (question.kind !== 'numeric') continue;
      const run = runCheck(question);
      const label = `${question.id}: key ${question.key.value} ${question.key.unit}`;
      expect({ label, error: run.ok ? undefined : run.message }).toEqual({ label, error: undefined });
      if (!run.ok) continue;
      expect({ label, engine: run.key.value, within: isWithinTolerance(run.key.value, question.key, question.tolerance) }).toEqual({ label, engine: run.key.value, within: true });
    }
  });

  it('typesets its mathematics with KaTeX without an error', () => {
    for (const html of quiz.html.values()) {
      for (const part of [html.stem, html.explanation, ...Object.values(html.choices ?? {})]) expect(part).not.toContain('katex-error');
    }
  });

  if (fresh.length === 0) return;
  it.each(fresh.map((q) => [q.id, q] as const))(`fresh numbers of %s: ${SEEDS} seeds inside the calculator's ranges, no warning, a finite key, different numbers`, (_id, question) => {
    const summary = describeCalculator(question.calculator)!;
    const drawnInputs = Object.entries(question.inputs).filter((e): e is [string, DrawnInput] => isDrawnInput(e[1]));
    const combinations = drawnInputs.reduce((n, [, input]) => n * (stepCount(input) + 1), 1);
    const seen = new Set<string>();
    for (let attempt = 1; attempt <= SEEDS; attempt++) {
      const seed = questionSeed(attempt, question.id);
      const draw = drawFresh(question, seed);
      const label = `${question.id}, seed ${seed}`;
      for (const [name, input] of drawnInputs) {
        const { value, unit } = draw.inputs[name] as { value: number; unit: string };
        const spec = summary.inputs.find((i) => i.name === name)!;
        const inside = value >= input.from && value <= input.to && insideBound(value, unit, spec.min, 'min') && insideBound(value, unit, spec.max, 'max');
        expect({ label, name, value, inside }).toEqual({ label, name, value, inside: true });
      }
      expect({ label, warnings: draw.warnings }).toEqual({ label, warnings: [] });
      expect({ label, finite: Number.isFinite(draw.key.value) }).toEqual({ label, finite: true });
      expect(drawFresh(question, seed)).toEqual(draw);
      seen.add(JSON.stringify(draw.inputs));
      // No reading the stem gives, typed in as it stands, earns the points: the apprentice must work
      // (an unconverted vacuum reading, or a flow left uncorrected, would otherwise pass by chance).
      for (const [name, given] of Object.entries(draw.inputs)) {
        if (!given || typeof given !== 'object' || !('value' in given)) continue;
        if (kindOfUnit(given.unit) !== kindOfUnit(question.answerUnit)) continue;
        const graded = gradeResponse(question, { value: given.value, unit: given.unit }, { key: draw.key });
        expect({ label, name, given, key: draw.key, status: graded.status }).toEqual({ label, name, given, key: draw.key, status: 'incorrect' });
      }
    }
    // Different seeds give different numbers (all of them when there are fewer than 10 combinations).
    expect(seen.size).toBeGreaterThanOrEqual(Math.min(combinations, 10));
  });
});

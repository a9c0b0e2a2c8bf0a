/**
 * The quiz the submits bench answers: six auto-graded questions (a written one would only be
 * queued for an instructor), built in code like the API tests' fixture, and the full-marks answer
 * to each as the browser sends it.
 */
import type { QuestionDefinition, QuizDefinition } from '../../shared/quiz/definition';
import { questionFingerprint } from '../../shared/quiz/version';
import { parseCheckLine, renderQuizInline, renderQuizMarkdown, type LoadedQuiz, type QuizLibrary } from '../quizzes/quiz-library';

export const BENCH_QUIZ_SLUG = 'bench-submits';
const SLUG = BENCH_QUIZ_SLUG;

/** Six auto-graded questions (11 points), the fixture's kinds and keys, built in code. */
export function benchQuiz(): QuizDefinition {
  const questions: QuestionDefinition[] = [
    {
      id: 'why-test-pressure',
      kind: 'single',
      points: 1,
      stem: 'Jo quotes a port at 212 cfm. What is missing before anyone can compare it?',
      choices: [
        { id: 'a', text: 'The test pressure it was measured at', correct: true },
        { id: 'b', text: 'The room temperature', correct: false },
        { id: 'c', text: "The valve's diameter", correct: false },
      ],
      explanation: 'Flow grows with the pressure drop, roughly with its square root.',
    },
    {
      id: 'which-are-differential',
      kind: 'multiple',
      points: 2,
      partialCredit: 'per-choice',
      stem: 'Which of these readings are differential pressures?',
      choices: [
        { id: 'a', text: 'The drop across the port', correct: true },
        { id: 'b', text: 'The barometer', correct: false },
        { id: 'c', text: 'The drop across the orifice plate', correct: true },
        { id: 'd', text: 'A tyre gauge', correct: false },
      ],
      explanation: 'A differential pressure is one pressure measured against another.',
    },
    {
      id: 'convert-reading',
      kind: 'numeric',
      points: 2,
      stem: 'A port flows 180 cfm at 10 inH2O. What does it flow at 28 inH2O?',
      // content/README.md, "Quizzes": 180 cfm · √(28/10) = 301.2 cfm.
      key: { value: 301.2, unit: 'cfm' },
      tolerance: { kind: 'relative', percent: 1 },
      check: parseCheckLine('flow-at-test-pressure | flow=180 cfm, fromPressureDrop=10 inH2O, toPressureDrop=28 inH2O | flow'),
      explanation: 'Flow scales with the square root of the pressure drop.',
    },
    {
      id: 'fresh-conversion',
      kind: 'fresh',
      points: 3,
      calculator: 'flow-at-test-pressure',
      output: 'flow',
      answerUnit: 'cfm',
      inputs: {
        flow: { from: 200, to: 260, step: 1, unit: 'cfm' },
        fromPressureDrop: { from: 10, to: 14, step: 0.5, unit: 'inH2O' },
        toPressureDrop: { value: 28, unit: 'inH2O' },
        model: 'square-root',
      },
      tolerance: { kind: 'relative', percent: 1 },
      stem: 'A port flows {flow} at {fromPressureDrop}. What does it flow at {toPressureDrop}?',
      explanation: 'Scale with the square root of the ratio of the pressure drops.',
    },
    {
      id: 'data-sheet-mbar',
      kind: 'numeric',
      points: 2,
      stem: 'A data sheet allows 15 mbar of pressure drop. What is that in inH2O?',
      // 1500 Pa / 249.0889 Pa per conventional inH2O (NIST SP 811) = 6.022 inH2O; content/quizzes/01-pressure.yaml.
      key: { value: 6.022, unit: 'inH2O' },
      tolerance: { kind: 'relative', percent: 1 },
      check: parseCheckLine('pressure-convert | pressure=15 mbar, kind=gauge | gauge'),
      explanation: '1 mbar is 100 Pa, and one inch of water is 249.0889 Pa.',
    },
    {
      id: 'gauge-or-absolute',
      kind: 'single',
      points: 1,
      stem: 'A regulator reads 140 psi. Which pressure does it show?',
      choices: [
        { id: 'a', text: 'Absolute pressure', correct: false },
        { id: 'b', text: 'Gauge pressure, above the room', correct: true },
      ],
      explanation: 'A regulator reads against the room: gauge pressure.',
    },
  ];
  // Attempt limit and pass mark as a quiz file gets them by default.
  return { lesson: SLUG, title: 'Bench: flow at test pressure', passMark: 80, attemptLimit: 3, questions };
}

/** The quiz as the library loads a file: Markdown rendered and sanitised, fingerprinted. */
export function benchLibrary(definition: QuizDefinition): QuizLibrary {
  const html = new Map(
    definition.questions.map((q) => [
      q.id,
      {
        stem: renderQuizMarkdown(q.stem),
        explanation: renderQuizMarkdown(q.explanation),
        ...(q.kind === 'single' || q.kind === 'multiple' ? { choices: Object.fromEntries(q.choices.map((c) => [c.id, renderQuizInline(c.text)])) } : {}),
      },
    ]),
  );
  const fingerprints = new Map(definition.questions.map((q) => [q.id, questionFingerprint(q)]));
  const loaded: LoadedQuiz = { definition, html, fingerprints, file: `${SLUG}.yaml` };
  return { quizzes: new Map([[SLUG, loaded]]), errors: [], missing: [] };
}

/** Numeric answers in another unit than the key's, so grading converts as it does for apprentices. */
const NUMERIC_ANSWERS: Record<string, { value: number; unit: string }> = {
  // 301.2 cfm × 0.4719474 L/s per cfm (NIST SP 811) = 142.15 L/s.
  'convert-reading': { value: 142.15, unit: 'L/s' },
  // 15 mbar = 1500 Pa (1 mbar = 100 Pa by definition).
  'data-sheet-mbar': { value: 1500, unit: 'Pa' },
};

/** The full-marks answer, as the browser sends it (a fresh question's key read from its attempt). */
export function correctAnswer(question: QuestionDefinition, freshKey: unknown): unknown {
  switch (question.kind) {
    case 'single':
      return { choiceId: question.choices.find((c) => c.correct)!.id };
    case 'multiple':
      return { choiceIds: question.choices.filter((c) => c.correct).map((c) => c.id) };
    case 'numeric':
      return NUMERIC_ANSWERS[question.id];
    case 'fresh':
      return freshKey;
    case 'written':
      throw new Error('the bench quiz has no written question');
  }
}

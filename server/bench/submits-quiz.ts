/**
 * The quiz the submits bench answers: six auto-graded questions (a written one would only be
 * queued for an instructor), built in code like the API tests' fixture, and the full-marks answer
 * to each as the browser sends it.
 */
import type { QuestionDefinition, QuizDefinition } from '../../shared/quiz/definition';
import { questionFingerprint } from '../../shared/quiz/version';
import { parseCheckLine, renderQuizInline, renderQuizMarkdown, type LoadedQuiz, type QuizLibrary } from '../quizzes/quiz-library';
import { sampleQuestions } from '../quizzes/test-quizzes/sample-questions';

export const BENCH_QUIZ_SLUG = 'bench-submits';
const SLUG = BENCH_QUIZ_SLUG;

/** Six auto-graded questions (11 points): the API tests' four sample questions and two more. */
export function benchQuiz(): QuizDefinition {
  const questions: QuestionDefinition[] = [
    ...sampleQuestions(),
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

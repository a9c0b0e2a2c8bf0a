/*
 * A quiz as its author writes it (content/quizzes/NN-<lesson slug>.yaml, format in
 * content/README.md) after validation. Server-only: the Angular app never imports a definition
 * (keys, rubrics and explanations must not reach the browser before a submit). What the browser
 * sees is in `shared/api/quizzes.ts`.
 */
import type { InputValue } from '../airflow';

/** A quantity as written, `24.5 psi` → { value: 24.5, unit: 'psi' }. */
export interface Quantity {
  value: number;
  unit: string;
}

/** Inclusive at both ends: |answer − key| ≤ tolerance (absolute, in its unit) or ≤ percent·|key|. */
export type Tolerance = { kind: 'absolute'; amount: Quantity } | { kind: 'relative'; percent: number };

export interface Choice {
  id: string;
  /** Markdown (rendered and sanitised like lessons). */
  text: string;
  correct: boolean;
}

/**
 * Multiple choice partial credit:
 * - `all-or-nothing`: full points only for exactly the correct set;
 * - `per-choice`: each choice judged right (ticked and correct, or left and wrong) earns
 *   points / number of choices; so 4 choices with one misjudged earn 3/4 of the points.
 */
export type PartialCredit = 'all-or-nothing' | 'per-choice';

/** A fresh-numbers input: drawn from [from, to] in steps of `step`, in `unit` (whole steps from `from`). */
export interface DrawnInput {
  from: number;
  to: number;
  step: number;
  unit: string;
}

export interface RubricCriterion {
  criterion: string;
  points: number;
}

interface QuestionBase {
  /** Stable within its quiz: lower-case words and hyphens. */
  id: string;
  points: number;
  /** Markdown + KaTeX. A fresh-numbers stem names drawn and fixed inputs as `{inputName}`. */
  stem: string;
  /** Markdown shown with the result after submit. */
  explanation: string;
}

export interface SingleChoiceQuestion extends QuestionBase {
  kind: 'single';
  choices: Choice[];
}

export interface MultipleChoiceQuestion extends QuestionBase {
  kind: 'multiple';
  choices: Choice[];
  partialCredit: PartialCredit;
}

/** A number with any compatible unit; the key is checked against the engine (`check`). */
export interface NumericQuestion extends QuestionBase {
  kind: 'numeric';
  key: Quantity;
  tolerance: Tolerance;
  /** The engine reproduces the key: a calculator, its inputs (over its example) and one output. */
  check: { calculator: string; inputs: Record<string, InputValue>; output: string };
}

/** Numbers drawn per attempt; the key is the engine's output for the drawn (rounded) inputs. */
export interface FreshNumbersQuestion extends QuestionBase {
  kind: 'fresh';
  calculator: string;
  output: string;
  /** The unit the key and the stem's answer are stated in (the apprentice may answer in any compatible unit). */
  answerUnit: string;
  /** Drawn inputs, and fixed ones (a value as in a lesson preset). Inputs not named take the calculator's example. */
  inputs: Record<string, DrawnInput | InputValue>;
  tolerance: Tolerance;
}

export interface WrittenQuestion extends QuestionBase {
  kind: 'written';
  /** Instructors only. The question's points are the sum of the criteria's. */
  rubric: RubricCriterion[];
}

export type QuestionDefinition =
  | SingleChoiceQuestion
  | MultipleChoiceQuestion
  | NumericQuestion
  | FreshNumbersQuestion
  | WrittenQuestion;

export interface QuizDefinition {
  /** The lesson this quiz belongs to (its slug is the quiz's id). */
  lesson: string;
  title: string;
  /** Percent of the points needed to pass, default 80. */
  passMark: number;
  /** Attempts allowed, default 3. */
  attemptLimit: number;
  /** Optional time limit per attempt. */
  timeLimitMinutes?: number;
  questions: QuestionDefinition[];
}

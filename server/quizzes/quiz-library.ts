import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

import { Marked, type Tokens } from 'marked';
import markedKatex from 'marked-katex-extension';
import { parse as parseYaml } from 'yaml';
import { z } from 'zod';

import { describeCalculator, type InputValue, isUnitOf, type QuantityKind } from '../../shared/airflow';
import type { DrawnInput, QuestionDefinition, QuizDefinition, Tolerance } from '../../shared/quiz/definition';
import { isCompatibleUnit } from '../../shared/quiz/answers';
import { drawFresh, isDrawnInput, stemPlaceholders, stepCount } from '../../shared/quiz/draw';
import { questionFingerprint } from '../../shared/quiz/version';
import { parsePresetValue, parseResultLine } from '../lessons/preset-values';
import { sanitizeLessonHtml } from '../lessons/sanitize';

/** A question's Markdown rendered (sanitised HTML): stem, explanation and, for choices, each choice by id. */
export interface QuestionHtml {
  stem: string;
  explanation: string;
  choices?: Record<string, string>;
}

export interface LoadedQuiz {
  definition: QuizDefinition;
  /** By question id. A fresh question's stem keeps its `{name}` placeholders (`interpolateStem`). */
  html: Map<string, QuestionHtml>;
  /** By question id: SHA-256 of the question's canonical definition (a new one means a new version). */
  fingerprints: Map<string, string>;
  /** The file it came from, e.g. `02-pressure-drop.yaml`. */
  file: string;
}

export interface QuizLibrary {
  /** By lesson slug (the quiz's id). Only quizzes that loaded without an error. */
  readonly quizzes: ReadonlyMap<string, LoadedQuiz>;
  /** One line per problem, naming the file, the question and the field (the content tests require none). */
  readonly errors: readonly string[];
  /** Lessons without a quiz (the content tests require none). */
  readonly missing: readonly string[];
}

export class QuizDefinitionError extends Error {}

// ---------------------------------------------------------------------------------------------
// Markdown: the lesson pipeline's marked + KaTeX + DOMPurify, without blocks and without raw HTML.

const marked = new Marked(
  // throwOnError: a formula KaTeX cannot parse is an error in the quiz file.
  markedKatex({ throwOnError: true, output: 'htmlAndMathml', nonStandard: true }),
  {
    async: false,
    gfm: true,
    renderer: {
      // Raw HTML in a quiz is shown as text, never passed through.
      html: ({ text }: Tokens.HTML | Tokens.Tag) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;'),
    },
  },
);

/** A stem or explanation: paragraphs, lists, emphasis, KaTeX. */
export function renderQuizMarkdown(markdown: string): string {
  return sanitizeLessonHtml(marked.parse(markdown) as string);
}

/** A choice: one line of inline Markdown and KaTeX. */
export function renderQuizInline(markdown: string): string {
  return sanitizeLessonHtml(marked.parseInline(markdown) as string);
}

// ---------------------------------------------------------------------------------------------
// The YAML shape (content/README.md, "Quizzes"), before the values are read.

const ID = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
const text = z.union([z.string(), z.number()]).transform(String).pipe(z.string().trim().min(1, 'must not be empty'));
const markdown = z.string().trim().min(1, 'must not be empty');
const value = z.union([z.string(), z.number()]);
const points = z.number().positive('must be more than 0').max(100);

const choice = z.strictObject({
  id: z.union([z.string(), z.number()]).transform(String).pipe(z.string().regex(/^[a-z0-9-]+$/, 'lower-case letters, digits and hyphens')),
  text,
  correct: z.boolean(),
});

const drawn = z.strictObject({
  from: z.number(),
  to: z.number(),
  step: z.number().positive('must be more than 0'),
  unit: z.string().trim().min(1, 'must name a unit'),
});

const base = {
  id: z.string().regex(ID, 'lower-case words joined by hyphens'),
  stem: markdown,
  explanation: markdown,
};

const questionSchema = z.discriminatedUnion('kind', [
  z.strictObject({ ...base, kind: z.literal('single'), points, choices: z.array(choice).min(2, 'needs at least two choices') }),
  z.strictObject({
    ...base,
    kind: z.literal('multiple'),
    points,
    partialCredit: z.enum(['all-or-nothing', 'per-choice']),
    choices: z.array(choice).min(2, 'needs at least two choices'),
  }),
  z.strictObject({ ...base, kind: z.literal('numeric'), points, key: value, tolerance: value, check: z.string() }),
  z.strictObject({
    ...base,
    kind: z.literal('fresh'),
    points,
    calculator: z.string(),
    output: z.string(),
    answerUnit: z.string(),
    inputs: z.record(z.string(), z.union([drawn, value])),
    tolerance: value,
  }),
  z.strictObject({
    ...base,
    kind: z.literal('written'),
    points: points.optional(),
    rubric: z.array(z.strictObject({ criterion: text, points })).min(1, 'needs at least one criterion'),
  }),
]);

const quizSchema = z.strictObject({
  lesson: z.string().regex(ID, 'a lesson slug'),
  title: text,
  passMark: z.number().gt(0, 'must be more than 0').max(100, 'is a percent, at most 100').default(80),
  attemptLimit: z.number().int().min(1).max(50).default(3),
  timeLimitMinutes: z.number().int().min(1).max(600).optional(),
  questions: z.array(z.unknown()).min(1, 'needs at least one question'),
});

type RawQuestion = z.infer<typeof questionSchema>;

// ---------------------------------------------------------------------------------------------
// Reading values: `301.2 cfm`, `1 %`, `2 cfm`, check lines.

/** Whether a unit string is one the engine reads. */
const isKnownUnit = (unit: string): boolean => isCompatibleUnit(unit, unit);

/** `301.2 cfm` → { value, unit }; a bare number is a plain ratio. */
function readQuantity(raw: string | number, field: string, problems: string[]): { value: number; unit: string } | undefined {
  const parsed = typeof raw === 'number' ? raw : parsePresetValue(raw);
  if (typeof parsed === 'number') return { value: parsed, unit: '' };
  if (typeof parsed === 'object' && 'value' in parsed) {
    if (!isKnownUnit(parsed.unit)) {
      problems.push(`${field}: unknown unit "${parsed.unit}"`);
      return undefined;
    }
    return parsed;
  }
  problems.push(`${field}: "${String(raw)}" is not a number with a unit, such as 301.2 cfm`);
  return undefined;
}

/** `1 %` (relative, percent of the key) or `2 cfm` (absolute, in a unit of the key's quantity). */
function readTolerance(raw: string | number, keyUnit: string, problems: string[]): Tolerance | undefined {
  const percent = typeof raw === 'string' ? /^(\d+(?:\.\d+)?)\s*%$/.exec(raw.trim()) : null;
  if (percent) {
    const value = Number(percent[1]);
    if (!(value > 0 && value <= 50)) {
      problems.push('tolerance: a relative tolerance must be more than 0 % and at most 50 %');
      return undefined;
    }
    return { kind: 'relative', percent: value };
  }
  const amount = typeof raw === 'string' ? readQuantity(raw, 'tolerance', []) : undefined;
  if (amount === undefined || (amount.unit === '' && keyUnit !== '')) {
    problems.push(`tolerance: write "1 %" (relative to the key) or an amount with its unit, such as "2 cfm" (got "${String(raw)}")`);
    return undefined;
  }
  if (!(amount.value > 0)) problems.push('tolerance: must be more than 0');
  else if (!isCompatibleUnit(amount.unit, keyUnit)) problems.push(`tolerance: "${amount.unit}" does not measure the same quantity as the key's "${keyUnit}"`);
  else return { kind: 'absolute', amount };
  return undefined;
}

/** `calculator | inputs | output`: a result line without its value, read as lessons read them. */
export function parseCheckLine(line: string): { calculator: string; inputs: Record<string, InputValue>; output: string } {
  if (line.split('|').length !== 3) throw new QuizDefinitionError(`"${line}" needs three parts: calculator | inputs | output`);
  const { calculator, inputs, output } = parseResultLine(`${line.trim()} = 0`);
  return { calculator, inputs, output };
}

function outputKind(calculator: string, output: string, problems: string[], field: string): QuantityKind | undefined {
  const summary = describeCalculator(calculator);
  if (summary === undefined) {
    problems.push(`${field}: unknown calculator "${calculator}"`);
    return undefined;
  }
  const found = summary.outputs.find((o) => o.name === output);
  if (found === undefined) problems.push(`${field}: ${calculator} has no output "${output}" (it has ${summary.outputs.map((o) => o.name).join(', ')})`);
  return found?.kind;
}

function checkInputNames(calculator: string, names: readonly string[], problems: string[], field: string): void {
  const summary = describeCalculator(calculator);
  if (summary === undefined) return;
  for (const name of names) {
    if (!summary.inputs.some((i) => i.name === name)) problems.push(`${field}.${name}: ${calculator} has no input "${name}" (it has ${summary.inputs.map((i) => i.name).join(', ')})`);
  }
}

function checkChoices(q: Extract<RawQuestion, { kind: 'single' | 'multiple' }>, problems: string[]): void {
  const ids = q.choices.map((c) => c.id);
  const duplicate = ids.find((id, i) => ids.indexOf(id) !== i);
  if (duplicate !== undefined) problems.push(`choices: the id "${duplicate}" is used twice`);
  const correct = q.choices.filter((c) => c.correct).length;
  if (q.kind === 'single' && correct !== 1) problems.push(`choices: a single-choice question needs exactly one correct choice (has ${correct})`);
  if (q.kind === 'multiple' && correct < 1) problems.push('choices: a multiple-choice question needs at least one correct choice');
}

/** Math and code spans of a stem, where a `{name}` would not be replaced by its number. */
const MATH_OR_CODE = /\$\$[\s\S]*?\$\$|\$[^$\n]*\$|`[^`]*`/g;

/** Validates one question's values and turns it into its definition; problems are pushed as "field: message". */
function readQuestion(q: RawQuestion, problems: string[]): QuestionDefinition | undefined {
  const common = { id: q.id, stem: q.stem, explanation: q.explanation };
  switch (q.kind) {
    case 'single':
      checkChoices(q, problems);
      return { ...common, kind: 'single', points: q.points, choices: q.choices };
    case 'multiple':
      checkChoices(q, problems);
      return { ...common, kind: 'multiple', points: q.points, partialCredit: q.partialCredit, choices: q.choices };
    case 'numeric': {
      let check: ReturnType<typeof parseCheckLine> | undefined;
      try {
        check = parseCheckLine(q.check);
      } catch (error) {
        problems.push(`check: ${(error as Error).message}`);
      }
      const key = readQuantity(q.key, 'key', problems);
      if (check === undefined || key === undefined) return undefined;
      const kind = outputKind(check.calculator, check.output, problems, 'check');
      checkInputNames(check.calculator, Object.keys(check.inputs), problems, 'check');
      if (kind !== undefined && !isUnitOf(key.unit, kind)) problems.push(`key: "${key.unit}" is not a unit of ${check.calculator}'s output "${check.output}"`);
      const tolerance = readTolerance(q.tolerance, key.unit, problems);
      if (tolerance === undefined) return undefined;
      return { ...common, kind: 'numeric', points: q.points, key, tolerance, check };
    }
    case 'fresh': {
      const kind = outputKind(q.calculator, q.output, problems, 'output');
      if (kind !== undefined && !isUnitOf(q.answerUnit, kind)) problems.push(`answerUnit: "${q.answerUnit}" is not a unit of ${q.calculator}'s output "${q.output}"`);
      checkInputNames(q.calculator, Object.keys(q.inputs), problems, 'inputs');
      const summary = describeCalculator(q.calculator);
      const inputs: Record<string, DrawnInput | InputValue> = {};
      for (const [name, raw] of Object.entries(q.inputs)) {
        if (typeof raw !== 'object') {
          inputs[name] = typeof raw === 'number' ? raw : parsePresetValue(raw);
          continue;
        }
        inputs[name] = raw;
        const field = `inputs.${name}`;
        if (raw.to < raw.from) problems.push(`${field}: "to" (${raw.to}) is below "from" (${raw.from})`);
        else if (stepCount(raw) < 1) problems.push(`${field}: from ${raw.from} to ${raw.to} in steps of ${raw.step} leaves one value only: nothing is drawn`);
        const inputKind = summary?.inputs.find((i) => i.name === name)?.kind;
        if (inputKind === 'option') problems.push(`${field}: an option cannot be drawn; give it as a fixed value`);
        else if (inputKind !== undefined && !isUnitOf(raw.unit, inputKind)) problems.push(`${field}: "${raw.unit}" is not a unit of ${kindLabel(inputKind)}`);
      }
      const stemText = q.stem.replace(MATH_OR_CODE, ' ');
      const inMath = new Set((q.stem.match(MATH_OR_CODE) ?? []).flatMap(stemPlaceholders));
      for (const name of inMath) {
        if (name in inputs) problems.push(`stem: {${name}} sits inside mathematics or code, where its number would not be shown`);
      }
      for (const name of stemPlaceholders(stemText)) {
        if (!(name in inputs)) problems.push(`stem: {${name}} is not one of the question's inputs (${Object.keys(inputs).join(', ')})`);
      }
      for (const [name, input] of Object.entries(inputs)) {
        if (isDrawnInput(input) && !stemPlaceholders(stemText).includes(name)) problems.push(`stem: the drawn input ${name} is not shown ({${name}}): the apprentice could not know its number`);
      }
      const tolerance = readTolerance(q.tolerance, q.answerUnit, problems);
      if (tolerance === undefined) return undefined;
      const question: QuestionDefinition = { ...common, kind: 'fresh', points: q.points, calculator: q.calculator, output: q.output, answerUnit: q.answerUnit, inputs, tolerance };
      if (problems.length === 0) {
        try {
          drawFresh(question, 0);
        } catch (error) {
          problems.push(`inputs: the engine refuses a draw: ${(error as Error).message}`);
        }
      }
      return question;
    }
    case 'written': {
      const sum = q.rubric.reduce((total, c) => total + c.points, 0);
      if (q.points !== undefined && Math.abs(q.points - sum) > 1e-9) problems.push(`points: ${q.points} is not the rubric's total, ${sum}`);
      return { ...common, kind: 'written', points: sum, rubric: q.rubric };
    }
  }
}

function kindLabel(kind: string): string {
  return kind.replace(/[A-Z]/g, (c) => ` ${c.toLowerCase()}`);
}

function renderQuestion(question: QuestionDefinition, problems: string[]): QuestionHtml {
  const render = (field: string, source: string, inline = false) => {
    try {
      return inline ? renderQuizInline(source) : renderQuizMarkdown(source);
    } catch (error) {
      problems.push(`${field}: ${(error as Error).message.split('\n')[0]}`);
      return '';
    }
  };
  const html: QuestionHtml = { stem: render('stem', question.stem), explanation: render('explanation', question.explanation) };
  if (question.kind === 'single' || question.kind === 'multiple') {
    html.choices = Object.fromEntries(question.choices.map((c) => [c.id, render(`choices.${c.id}`, c.text, true)]));
  }
  return html;
}

/** Names a zod issue's place: `questions[3]` becomes `question "convert-reading"` when it has an id. */
function place(path: readonly PropertyKey[], rawQuestions: unknown): string {
  if (path[0] === 'questions' && typeof path[1] === 'number') {
    const raw = Array.isArray(rawQuestions) ? (rawQuestions[path[1]] as { id?: unknown } | undefined) : undefined;
    const who = typeof raw?.id === 'string' ? `question "${raw.id}"` : `question ${path[1] + 1}`;
    const rest = path.slice(2).map(String).join('.');
    return rest === '' ? who : `${who}: ${rest}`;
  }
  return path.map(String).join('.') || 'the file';
}

/**
 * Reads, validates and renders one quiz file. Throws a QuizDefinitionError listing every problem,
 * each naming the file, the question and the field.
 */
export function loadQuizFile(source: string, file: string, lessonSlugs: readonly string[]): LoadedQuiz {
  let data: unknown;
  try {
    data = parseYaml(source, { prettyErrors: true, uniqueKeys: true });
  } catch (error) {
    throw new QuizDefinitionError(`${file}: YAML: ${(error as Error).message.split('\n')[0]}`);
  }
  const quiz = quizSchema.safeParse(data);
  const problems: string[] = [];
  if (!quiz.success) {
    throw new QuizDefinitionError(quiz.error.issues.map((i) => `${file}: ${place(i.path, undefined)}: ${i.message}`).join('\n'));
  }
  const { questions: rawQuestions, ...head } = quiz.data;
  if (!lessonSlugs.includes(head.lesson)) problems.push(`${file}: lesson: no lesson "${head.lesson}"`);
  else if (!new RegExp(`^(\\d+-)?${head.lesson}\\.ya?ml$`).test(file)) problems.push(`${file}: is named for another lesson than "${head.lesson}" (name it like its lesson, e.g. 01-pressure.yaml)`);
  const questions: QuestionDefinition[] = [];
  const html = new Map<string, QuestionHtml>();
  const fingerprints = new Map<string, string>();
  rawQuestions.forEach((raw, index) => {
    const parsed = questionSchema.safeParse(raw);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) problems.push(`${file}: ${place(['questions', index, ...issue.path], rawQuestions)}: ${issue.message}`);
      return;
    }
    const who = `${file}: question "${parsed.data.id}"`;
    if (questions.some((q) => q.id === parsed.data.id) || html.has(parsed.data.id)) problems.push(`${who}: the id is used twice in this quiz`);
    const own: string[] = [];
    const question = readQuestion(parsed.data, own);
    if (question !== undefined) {
      html.set(question.id, renderQuestion(question, own));
      fingerprints.set(question.id, questionFingerprint(question));
      questions.push(question);
    }
    problems.push(...own.map((p) => `${who}: ${p}`));
  });
  if (problems.length > 0) throw new QuizDefinitionError(problems.join('\n'));
  const definition: QuizDefinition = { ...head, questions };
  if (definition.timeLimitMinutes === undefined) delete definition.timeLimitMinutes;
  return { definition, html, fingerprints, file };
}

/**
 * Loads every quiz in `dir` (`*.yaml`): validated, Markdown rendered, fingerprinted. A file with a
 * problem is left out and its problems listed in `errors`; a lesson without a quiz in `missing`.
 */
export function loadQuizLibrary(dir: string, lessonSlugs: readonly string[]): QuizLibrary {
  const quizzes = new Map<string, LoadedQuiz>();
  const errors: string[] = [];
  const files = existsSync(dir) ? readdirSync(dir).filter((f) => /\.ya?ml$/.test(f)).sort() : [];
  if (files.length === 0) errors.push(`no quiz files (*.yaml) in ${dir}`);
  for (const file of files) {
    try {
      const loaded = loadQuizFile(readFileSync(join(dir, file), 'utf8'), file, lessonSlugs);
      const slug = loaded.definition.lesson;
      const other = quizzes.get(slug);
      if (other !== undefined) errors.push(`${file}: lesson "${slug}" already has a quiz, ${other.file}`);
      else quizzes.set(slug, loaded);
    } catch (error) {
      errors.push(...(error instanceof Error ? error.message : String(error)).split('\n'));
    }
  }
  const missing = lessonSlugs.filter((slug) => !quizzes.has(slug));
  return { quizzes, errors, missing };
}

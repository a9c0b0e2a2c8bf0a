import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import type { DataSource } from 'typeorm';

import type { QuestionDefinition, QuizDefinition } from '../../../shared/quiz/definition';
import { questionFingerprint } from '../../../shared/quiz/version';
import { createApp } from '../../app';
import { DEFAULT_RATE_LIMITS } from '../../auth/rate-limits';
import { LessonStore } from '../../lessons/lesson-store';
import { Mailer, smtpTransport } from '../../mail/mailer';
import { FAST_HASH_COST } from '../../testing/accounts';
import { silentLogger, testConfig } from '../../testing/database';
import type { LoadedQuiz, QuizLibrary } from '../quiz-library';
import { sampleQuestions } from './sample-questions';

/**
 * A small quiz of every kind, built in code (independent of the YAML loader) for the attempt API
 * tests. Keys: 180 cfm at 10 inH2O → 28 inH2O is 180·√2.8 = 301.2 cfm (the square-root rule,
 * content/README.md's own example).
 */
export function fixtureQuiz(overrides: Partial<QuizDefinition> = {}): QuizDefinition {
  const questions: QuestionDefinition[] = [
    ...sampleQuestions(),
    {
      id: 'explain-overlap',
      kind: 'written',
      points: 3,
      stem: 'Sam says the ported head "shows no gain because the ± bands overlap". What do you tell him?',
      rubric: [
        { criterion: 'Says overlap of intervals is not the test', points: 1 },
        { criterion: 'Names what cancels on the same bench and day', points: 2 },
      ],
      explanation: 'Compare the difference with its own uncertainty.',
    },
  ];
  return { lesson: 'fixture-flow', title: 'Fixture: flow at test pressure', passMark: 80, attemptLimit: 3, questions, ...overrides };
}

const escape = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

export function loadedQuiz(definition: QuizDefinition): LoadedQuiz {
  const html = new Map<string, { stem: string; explanation: string; choices?: Record<string, string> }>();
  const fingerprints = new Map<string, string>();
  for (const q of definition.questions) {
    html.set(q.id, {
      stem: `<p>${escape(q.stem)}</p>`,
      explanation: `<p>${escape(q.explanation)}</p>`,
      ...(q.kind === 'single' || q.kind === 'multiple' ? { choices: Object.fromEntries(q.choices.map((c) => [c.id, `<p>${escape(c.text)}</p>`])) } : {}),
    });
    fingerprints.set(q.id, questionFingerprint(q));
  }
  return { definition, html, fingerprints, file: `${definition.lesson}.yaml` };
}

/** A quiz library of the given quizzes (slugs made unique per test file so versions never collide). */
export function fixtureLibrary(...quizzes: QuizDefinition[]): QuizLibrary {
  return { quizzes: new Map(quizzes.map((q) => [q.lesson, loadedQuiz(q)])), errors: [], missing: [] };
}

export function uniqueSlug(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}`;
}

/** The whole app (fast hashing, generous limits, no lessons) serving the given quizzes. */
export function quizTestApp(dataSource: DataSource, library: QuizLibrary, options: { now?: () => Date; lessonsDir?: string } = {}) {
  const config = testConfig({ passwordHashCost: FAST_HASH_COST, clientDir: join(tmpdir(), 'flowlore-no-client') });
  const mailer = new Mailer(smtpTransport(config.mail), config.mail.from, dataSource, silentLogger);
  const generous = { limit: 1_000_000, windowMs: 60_000 };
  const rateLimits = { ...DEFAULT_RATE_LIMITS, signIn: generous, signUp: generous, passwordReset: generous, keyPrefix: `test-${randomUUID()}:` };
  const lessons = new LessonStore(options.lessonsDir ?? mkdtempSync(join(tmpdir(), 'flowlore-no-lessons-')), silentLogger);
  const app = createApp({ config, dataSource, logger: silentLogger, lessons, mailer, rateLimits, quizzes: () => library, now: options.now });
  return { app, config, mailer };
}

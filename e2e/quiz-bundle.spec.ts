import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

import { expect, test } from '@playwright/test';
import { parse } from 'yaml';

// Quiz definitions (keys, rubrics, explanations) live on the server only. This reads every script the
// app can ever download — the service worker's list of the app's files, fetched from the server as a
// browser would get them — and looks for the authors' own words from content/quizzes in them.

interface QuizFile {
  questions: Array<{ explanation?: string; rubric?: Array<{ criterion: string }>; choices?: Array<{ text: string; correct: boolean }> }>;
}

/** Distinctive pieces of every quiz: each explanation's opening, each rubric criterion, each correct choice. */
function secrets(): string[] {
  const dir = join(__dirname, '../content/quizzes');
  const pieces = readdirSync(dir)
    .filter((f) => f.endsWith('.yaml'))
    .flatMap((f) => (parse(readFileSync(join(dir, f), 'utf8')) as QuizFile).questions)
    .flatMap((q) => [
      q.explanation?.slice(0, 48),
      ...(q.rubric ?? []).map((r) => r.criterion),
      ...(q.choices ?? []).filter((c) => c.correct).map((c) => c.text),
    ]);
  // Short pieces ("Yes", a bare number) could occur anywhere; only phrases are evidence of a leak.
  return [...new Set(pieces.filter((p): p is string => typeof p === 'string' && p.length >= 24))];
}

test('no script of the app contains a quiz key, rubric or explanation', async ({ request }) => {
  const manifest = (await (await request.get('/ngsw.json')).json()) as { assetGroups: Array<{ urls: string[] }> };
  const scripts = manifest.assetGroups.flatMap((g) => g.urls).filter((url) => url.endsWith('.js'));
  expect(scripts.length).toBeGreaterThan(10);
  const words = secrets();
  expect(words.length).toBeGreaterThan(100);
  const found: string[] = [];
  for (const url of scripts) {
    const body = await (await request.get(url)).text();
    for (const w of words) if (body.includes(w)) found.push(`${url}: ${w}`);
  }
  expect(found).toEqual([]);
});

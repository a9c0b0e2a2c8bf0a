import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import request from 'supertest';

import { createApp } from '../app';
import { silentLogger, testConfig, testDataSource } from '../testing/database';
import { LessonStore } from './lesson-store';

const lesson = (order: number, slug: string, free: boolean) => `---
title: Lesson ${order}
slug: ${slug}
order: ${order}
summary: A lesson written for the API tests, number ${order}.
minutes: 15
free: ${free}
objectives:
  - First objective
  - Second objective
  - Third objective
glossary:
  - term: Term ${order}
    definition: A term defined by lesson ${order} for the glossary.
---

## Start here

Flow $Q$ through a [calculator](/calculators/mass-flow).

:::calculator mass-flow
volumeFlow: 100 cfm
:::
`;

describe('the lessons API', () => {
  const dir = mkdtempSync(join(tmpdir(), 'flowlore-lessons-'));
  writeFileSync(join(dir, '01-first.md'), lesson(1, 'first', true));
  writeFileSync(join(dir, '02-second.md'), lesson(2, 'second', false));
  const app = createApp({ config: testConfig(), dataSource: testDataSource(), logger: silentLogger, lessons: new LessonStore(dir) });

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('lists the outline in course order', async () => {
    const res = await request(app).get('/api/lessons');
    expect(res.status).toBe(200);
    expect(res.body.map((l: { slug: string }) => l.slug)).toEqual(['first', 'second']);
    expect(res.body[0]).toEqual({
      slug: 'first', title: 'Lesson 1', order: 1, summary: 'A lesson written for the API tests, number 1.', minutes: 15,
      objectives: ['First objective', 'Second objective', 'Third objective'], labObjectives: [], free: true,
    });
  });

  it('serves a lesson page with HTML, contents, embeds and neighbours', async () => {
    const res = await request(app).get('/api/lessons/first');
    expect(res.status).toBe(200);
    expect(res.body.html).toContain('<h2 id="start-here">Start here</h2>');
    expect(res.body.html).toContain('class="katex"');
    expect(res.body.toc).toEqual([{ id: 'start-here', text: 'Start here', level: 2 }]);
    expect(res.body.embeds).toEqual([{ index: 0, calculator: 'mass-flow', inputs: { volumeFlow: { value: 100, unit: 'cfm' } } }]);
    expect(res.body.previous).toBeNull();
    expect(res.body.next).toEqual({ slug: 'second', title: 'Lesson 2' });
  });

  it('answers a repeat request carrying the ETag with 304 and no body', async () => {
    const first = await request(app).get('/api/lessons/second');
    expect(first.headers['etag']).toMatch(/^"[\w-]+"$/);
    const again = await request(app).get('/api/lessons/second').set('If-None-Match', first.headers['etag']!);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
  });

  it('answers an unknown lesson with a 404 problem', async () => {
    const res = await request(app).get('/api/lessons/no-such-lesson');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  });

  it('lists the glossary with the lesson that defines each term', async () => {
    const res = await request(app).get('/api/glossary');
    expect(res.status).toBe(200);
    expect(res.body).toEqual([
      { term: 'Term 1', definition: 'A term defined by lesson 1 for the glossary.', lesson: { slug: 'first', title: 'Lesson 1' } },
      { term: 'Term 2', definition: 'A term defined by lesson 2 for the glossary.', lesson: { slug: 'second', title: 'Lesson 2' } },
    ]);
  });
});

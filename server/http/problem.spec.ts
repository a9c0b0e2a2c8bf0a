import express from 'express';
import pino from 'pino';
import request from 'supertest';
import { z } from 'zod';

import { problemHandler } from './error-handler';
import { HttpProblem } from './problem';
import { validateBody } from './validate';

/** A small app exercising the shared error path the way feature routers use it. */
function appWith(): express.Express {
  const app = express();
  app.use(express.json());
  const reading = z.object({ testPressure: z.number().positive(), label: z.string().min(1) });
  app.post('/readings', validateBody(reading), (_req, res) => {
    res.status(201).json(res.locals['body']);
  });
  app.get('/boom', () => {
    throw new Error('secret detail: connection string postgres://user:pw@db');
  });
  app.get('/gone', () => {
    throw new HttpProblem(410, 'Gone', 'That bench log was withdrawn.');
  });
  app.use(problemHandler(pino({ level: 'silent' })));
  return app;
}

describe('problem+json errors', () => {
  const app = appWith();

  it('lists every invalid field of a body with a 400', async () => {
    const res = await request(app).post('/readings').send({ testPressure: -3 });
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.title).toBe('Bad request');
    expect(res.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['label', 'testPressure']);
  });

  it('passes a valid body through', async () => {
    const res = await request(app).post('/readings').send({ testPressure: 28, label: 'port 3' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ testPressure: 28, label: 'port 3' });
  });

  it('answers an unexpected error with a 500 that carries no stack and no message', async () => {
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(JSON.stringify(res.body)).not.toMatch(/secret|postgres|at .*\.ts|stack/i);
    expect(res.body).toMatchObject({ status: 500, title: 'Internal server error' });
  });

  it('keeps the status and detail of a typed problem', async () => {
    const res = await request(app).get('/gone');
    expect(res.status).toBe(410);
    expect(res.body).toMatchObject({ status: 410, title: 'Gone', detail: 'That bench log was withdrawn.' });
  });
});

import fc from 'fast-check';
import request from 'supertest';

import { evaluate, exampleRequest, listCalculators } from '../../shared/airflow';
import { createApp } from '../app';
import { silentLogger, testConfig, testDataSource } from '../testing/database';

// The calculators need no database; the app is built with an unopened data source.
const app = createApp({ config: testConfig(), dataSource: testDataSource(), logger: silentLogger });

const airAt20C = {
  inputs: {
    temperature: { value: 20, unit: 'degC' },
    pressure: { value: 101.325, unit: 'kPa' },
    relativeHumidity: { value: 50, unit: '%' },
    method: 'cipm2007',
  },
};

function expectProblem(res: request.Response, status: number): void {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body.status).toBe(status);
}

describe('GET /api/calculators', () => {
  it('lists all nineteen calculators with their input and output schemas', async () => {
    const res = await request(app).get('/api/calculators');
    expect(res.status).toBe(200);
    const ids = res.body.map((c: { id: string }) => c.id).sort();
    expect(ids).toEqual(
      [
        'air-density', 'altitude-pressure', 'boost', 'compare-tests', 'discharge-coefficient', 'engine-demand',
        'flow-at-test-pressure', 'fuel-flow', 'gas-compression', 'manometer', 'mass-flow', 'orifice-flow',
        'port-velocity', 'power-potential', 'pressure-convert', 'sensor-correction', 'speed-density',
        'standard-flow', 'uncertainty',
      ].sort(),
    );
    for (const calculator of res.body) {
      expect(calculator.inputs.length).toBeGreaterThan(0);
      expect(calculator.outputs.length).toBeGreaterThan(0);
    }
  });

  it('describes one calculator by id', async () => {
    const res = await request(app).get('/api/calculators/air-density');
    expect(res.status).toBe(200);
    expect(res.body.inputs.map((i: { name: string }) => i.name)).toEqual(
      expect.arrayContaining(['temperature', 'pressure', 'relativeHumidity', 'dewPoint', 'method']),
    );
    expect(res.body.outputs.map((o: { name: string }) => o.name)).toEqual(
      expect.arrayContaining(['density', 'vaporPressure', 'dewPoint', 'humidityRatio']),
    );
  });

  it('answers an unknown id with a 404 problem', async () => {
    expectProblem(await request(app).get('/api/calculators/flux-capacitor'), 404);
  });
});

describe('POST /api/calculators/:id', () => {
  it('computes with SI outputs by default, with steps', async () => {
    const res = await request(app).post('/api/calculators/air-density').send(airAt20C);
    expect(res.status).toBe(200);
    expect(res.body.id).toBe('air-density');
    expect(res.body.outputs.density.unit).toBe('kg/m^3');
    // Picard et al. 2008 (CIPM-2007): 20 °C, 101.325 kPa, 50 % RH gives about 1.1993 kg/m³.
    expect(res.body.outputs.density.value).toBeCloseTo(1.1993, 3);
    expect(res.body.steps.length).toBeGreaterThan(0);
    expect(res.body.warnings).toEqual([]);
  });

  it('answers in the output units asked for', async () => {
    const res = await request(app)
      .post('/api/calculators/air-density')
      .send({ ...airAt20C, outputUnits: { density: 'lb/ft^3', dewPoint: 'degF' } });
    expect(res.status).toBe(200);
    expect(res.body.outputs.density.unit).toBe('lb/ft^3');
    // NIST SP 811: 1 lb/ft³ = 16.01846 kg/m³.
    expect(res.body.outputs.density.value).toBeCloseTo(1.1993 / 16.01846, 4);
    expect(res.body.outputs.dewPoint.unit).toBe('degF');
  });

  it('warns but computes outside the formula’s validity range', async () => {
    const res = await request(app)
      .post('/api/calculators/air-density')
      .send({ inputs: { ...airAt20C.inputs, temperature: { value: 40, unit: 'degC' } } });
    expect(res.status).toBe(200);
    expect(res.body.warnings).toEqual([expect.objectContaining({ field: 'temperature' })]);
  });

  it('lists each bad input with a 400 problem naming its place in the body', async () => {
    const res = await request(app)
      .post('/api/calculators/air-density')
      .send({
        inputs: {
          temperature: { value: 20, unit: 'psi' },
          pressure: { value: -5, unit: 'kPa' },
          relativeHumidity: { value: 150, unit: '%' },
          method: 'guesswork',
          colour: 3,
        },
      });
    expectProblem(res, 400);
    const fields = res.body.errors.map((e: { field: string }) => e.field).sort();
    expect(fields).toEqual(['inputs.colour', 'inputs.method', 'inputs.pressure', 'inputs.relativeHumidity', 'inputs.temperature']);
    for (const error of res.body.errors) expect(error.message.length).toBeGreaterThan(10);
  });

  it('refuses an unknown output unit', async () => {
    const res = await request(app).post('/api/calculators/air-density').send({ ...airAt20C, outputUnits: { density: 'furlong' } });
    expectProblem(res, 400);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'outputUnits.density' })]);
  });

  it('refuses a body of the wrong shape before the engine sees it', async () => {
    const cases: Array<[unknown, string]> = [
      [{}, 'inputs'],
      [{ inputs: [] }, 'inputs'],
      [{ inputs: { pressure: { value: '14.7', unit: 'psi' } } }, 'inputs.pressure'],
      [{ inputs: {}, extra: true }, 'body'],
      [{ inputs: {}, outputUnits: { density: 3 } }, 'outputUnits.density'],
    ];
    for (const [body, field] of cases) {
      const res = await request(app).post('/api/calculators/air-density').send(body as object);
      expectProblem(res, 400);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toContain(field);
    }
  });

  it('refuses a missing required input', async () => {
    const res = await request(app).post('/api/calculators/air-density').send({ inputs: { method: 'cipm2007' } });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual(expect.arrayContaining(['inputs.temperature', 'inputs.pressure']));
  });

  it('takes lists of readings and answers with a verdict in its notes (compare-tests)', async () => {
    const body = {
      inputs: {
        readingsA: { values: [248.8, 250.0, 251.2], unit: 'cfm' },
        readingsB: { values: [252.8, 254.0, 255.2], unit: 'cfm' },
        setup: 'same-day',
      },
      outputUnits: { differenceExpandedUncertainty: 'cfm' },
    };
    const res = await request(app).post('/api/calculators/compare-tests').send(body);
    expect(res.status).toBe(200);
    // course review 1, E1: U₉₅ = t₉₅(4) × 0.98 cfm = 2.7 cfm on the same bench and day
    expect(res.body.outputs.differenceExpandedUncertainty.value).toBeCloseTo(2.72, 2);
    expect(res.body.notes[0]).toBe('A gain of 4.0 ± 2.7 cfm is shown (95 % confidence).');
    expect(res.body).toEqual((evaluate('compare-tests', body) as { result: unknown }).result);
    const again = await request(app).post('/api/calculators/compare-tests').send(body);
    expect(again.text).toBe(res.text);
  });

  it('refuses a bad list with a 400 problem naming the field and the reading', async () => {
    const base = { readingsB: { values: [252.8, 254.0, 255.2], unit: 'cfm' } };
    const cases: Array<[unknown, RegExp]> = [
      [{ values: [250], unit: 'cfm' }, /2 to 30 readings/],
      [{ values: [250, -3, 251], unit: 'cfm' }, /reading 2 must be above 0/],
      [{ value: 250, unit: 'cfm' }, /takes a list/],
      [{ values: [250, 251], unit: 'psi' }, /not a unit of volume flow/],
    ];
    for (const [readingsA, message] of cases) {
      const res = await request(app).post('/api/calculators/compare-tests').send({ inputs: { ...base, readingsA } });
      expectProblem(res, 400);
      expect(res.body.errors).toEqual([{ field: 'inputs.readingsA', message: expect.stringMatching(message) }]);
    }
    const shape = await request(app).post('/api/calculators/compare-tests').send({ inputs: { ...base, readingsA: { values: ['250', 251], unit: 'cfm' } } });
    expectProblem(shape, 400);
    expect(shape.body.errors.map((e: { field: string }) => e.field)).toContain('inputs.readingsA');
  });

  it('answers an unknown id with a 404 problem even with a valid body', async () => {
    expectProblem(await request(app).post('/api/calculators/nope').send(airAt20C), 404);
  });

  it('answers malformed JSON with a 400 problem', async () => {
    const res = await request(app).post('/api/calculators/air-density').set('Content-Type', 'application/json').send('{"inputs":');
    expectProblem(res, 400);
  });

  it('gives every calculator’s example the same answer as the engine in the browser', async () => {
    for (const calculator of listCalculators()) {
      const body = exampleRequest(calculator.id)!;
      const res = await request(app).post(`/api/calculators/${calculator.id}`).send(body);
      expect({ id: calculator.id, status: res.status }).toEqual({ id: calculator.id, status: 200 });
      const local = evaluate(calculator.id, body);
      expect(local.ok && local.result).toEqual(res.body);
    }
  });

  it('agrees with the engine for random air conditions (property)', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.double({ min: -20, max: 45, noNaN: true }),
        fc.double({ min: 70, max: 110, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.constantFrom('cipm2007', 'ideal-dry'),
        async (t, p, rh, method) => {
          const body = {
            inputs: {
              temperature: { value: t, unit: 'degC' },
              pressure: { value: p, unit: 'kPa' },
              relativeHumidity: { value: rh, unit: '%' },
              method,
            },
          };
          const res = await request(app).post('/api/calculators/air-density').send(body);
          const local = evaluate('air-density', body);
          expect(local.ok).toBe(true);
          expect(res.status).toBe(200);
          expect(res.body).toEqual(local.ok ? local.result : undefined);
        },
      ),
      { numRuns: 40 },
    );
  });
});

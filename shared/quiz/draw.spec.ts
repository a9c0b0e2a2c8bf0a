import { evaluate, withExampleDefaults } from '../airflow';
import type { DrawnInput, FreshNumbersQuestion } from './definition';
import { choiceOrder, decimalsOf, displayUnit, drawFresh, interpolateStem, questionSeed, stemPlaceholders, stepCount } from './draw';

const question: FreshNumbersQuestion = {
  id: 'fresh-conversion',
  kind: 'fresh',
  points: 3,
  calculator: 'flow-at-test-pressure',
  output: 'flow',
  answerUnit: 'cfm',
  inputs: {
    flow: { from: 120, to: 260, step: 1, unit: 'cfm' },
    fromPressureDrop: { from: 10, to: 14, step: 0.5, unit: 'inH2O' },
    toPressureDrop: { value: 28, unit: 'inH2O' },
  },
  tolerance: { kind: 'relative', percent: 1 },
  stem: 'A port flows {flow} at {fromPressureDrop}. What does it flow at {toPressureDrop}?',
  explanation: '…',
};

const drawn = (q: FreshNumbersQuestion) => Object.entries(q.inputs).filter((e): e is [string, DrawnInput] => typeof e[1] === 'object' && 'from' in e[1]);
const SEEDS = Array.from({ length: 300 }, (_, i) => questionSeed(1000 + i, question.id));

describe('drawFresh', () => {
  it('gives the same numbers, key and steps for the same seed', () => {
    for (const seed of [0, 1, 42, 0xffffffff, -7]) expect(drawFresh(question, seed)).toEqual(drawFresh(question, seed));
  });

  it('draws values on whole steps inside [from, to], and reaches both ends', () => {
    const seen = new Map<string, Set<number>>();
    for (const seed of SEEDS) {
      const draw = drawFresh(question, seed);
      for (const [name, input] of drawn(question)) {
        const { value, unit } = draw.inputs[name] as { value: number; unit: string };
        expect(unit).toBe(input.unit);
        expect(value).toBeGreaterThanOrEqual(input.from);
        expect(value).toBeLessThanOrEqual(input.to);
        const steps = (value - input.from) / input.step;
        expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-9);
        seen.set(name, (seen.get(name) ?? new Set()).add(value));
      }
    }
    expect(seen.get('fromPressureDrop')).toEqual(new Set([10, 10.5, 11, 11.5, 12, 12.5, 13, 13.5, 14]));
    expect(seen.get('flow')!.size).toBeGreaterThan(100);
  });

  it('computes the key with evaluate on exactly the drawn values, and the stem shows those values', () => {
    for (const seed of SEEDS.slice(0, 50)) {
      const draw = drawFresh(question, seed);
      const outcome = evaluate(question.calculator, { ...withExampleDefaults(question.calculator, draw.inputs)!, outputUnits: { flow: 'cfm' } });
      if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
      expect(draw.key).toEqual({ value: outcome.result.outputs['flow']!.value, unit: 'cfm' });
      expect(draw.steps).toEqual(outcome.result.steps);
      expect(draw.warnings).toEqual([]);
      for (const [name, value] of Object.entries(draw.inputs)) {
        const { value: v, unit } = value as { value: number; unit: string };
        expect(draw.shown[name]).toBe(`${name === 'fromPressureDrop' ? v.toFixed(1) : v} ${unit}`);
        expect(Number(draw.shown[name]!.split(' ')[0])).toBe(v);
      }
    }
  });

  it('rounds drawn values to the digits of from and step before the engine sees them', () => {
    const q: FreshNumbersQuestion = {
      ...question,
      inputs: { flow: { from: 100.1, to: 100.9, step: 0.1, unit: 'L/s' }, fromPressureDrop: { from: 2, to: 3, step: 0.05, unit: 'kPa' }, toPressureDrop: { value: 7, unit: 'kPa' } },
      answerUnit: 'L/s',
    };
    for (let seed = 0; seed < 200; seed++) {
      const draw = drawFresh(q, seed);
      const flow = draw.inputs['flow'] as { value: number };
      const drop = draw.inputs['fromPressureDrop'] as { value: number };
      // The values are the doubles nearest the shown decimals (100.3, not 100.30000000000001).
      expect(String(flow.value)).toMatch(/^100(\.\d)?$/);
      expect(String(drop.value)).toMatch(/^[23](\.\d\d?)?$/);
      expect(draw.shown['flow']).toMatch(/^100\.\d L\/s$/);
      expect(draw.shown['fromPressureDrop']).toMatch(/^[23]\.\d\d kPa$/);
    }
  });

  it('shows units as an apprentice reads them', () => {
    expect(displayUnit('degF')).toBe('°F');
    expect(displayUnit('m^3/h')).toBe('m³/h');
    expect(displayUnit('kg/m^3')).toBe('kg/m³');
    expect(displayUnit('inH2O')).toBe('inH2O');
    expect(displayUnit('%')).toBe('%');
  });

  it('counts steps and decimals', () => {
    expect(stepCount({ from: 0.1, to: 0.7, step: 0.1, unit: 'm' })).toBe(6);
    expect(stepCount({ from: 8, to: 12, step: 0.5, unit: 'inH2O' })).toBe(8);
    expect(stepCount({ from: 0, to: 10, step: 3, unit: 'm' })).toBe(3);
    expect(decimalsOf(0.05)).toBe(2);
    expect(decimalsOf(1e-7)).toBe(7);
    expect(decimalsOf(250)).toBe(0);
  });

  it('refuses numbers the engine refuses, naming the question', () => {
    const bad: FreshNumbersQuestion = { ...question, inputs: { ...question.inputs, flow: { from: -5, to: -1, step: 1, unit: 'cfm' } } };
    expect(() => drawFresh(bad, 1)).toThrow(/fresh-conversion.*flow/);
  });
});

describe('seeds, choice order and stems', () => {
  it('derives a question seed from the attempt seed and the question id', () => {
    expect(questionSeed(7, 'a')).toBe(questionSeed(7, 'a'));
    expect(questionSeed(7, 'a')).not.toBe(questionSeed(7, 'b'));
    expect(questionSeed(7, 'a')).not.toBe(questionSeed(8, 'a'));
    const seeds = new Set(Array.from({ length: 1000 }, (_, i) => questionSeed(i, 'q')));
    expect(seeds.size).toBe(1000);
    for (const s of seeds) expect(Number.isInteger(s) && s >= 0 && s < 2 ** 32).toBe(true);
  });

  it('shuffles choice ids by the seed: a permutation, the same for the same seed, differing across seeds', () => {
    const choices = ['a', 'b', 'c', 'd', 'e'].map((id) => ({ id }));
    const orders = new Set<string>();
    for (let seed = 0; seed < 200; seed++) {
      const order = choiceOrder(choices, seed);
      expect([...order].sort()).toEqual(['a', 'b', 'c', 'd', 'e']);
      expect(choiceOrder(choices, seed)).toEqual(order);
      orders.add(order.join(''));
    }
    expect(orders.size).toBeGreaterThan(50);
  });

  it('puts the shown numbers into a stem, escaped, and leaves other braces alone', () => {
    const stem = 'At {flow} and {drop}, find $\\frac{Q}{A}$ for {unknown}.';
    expect(stemPlaceholders(stem)).toEqual(['flow', 'drop', 'Q', 'A', 'unknown']);
    expect(interpolateStem(stem, { flow: '212 cfm', drop: '<b>' })).toBe('At 212 cfm and &lt;b&gt;, find $\\frac{Q}{A}$ for {unknown}.');
    const draw = drawFresh(question, 5);
    expect(interpolateStem(question.stem, draw.shown)).toBe(`A port flows ${draw.shown['flow']} at ${draw.shown['fromPressureDrop']}. What does it flow at 28 inH2O?`);
  });
});

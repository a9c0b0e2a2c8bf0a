import { evaluate, exampleRequest } from '../../shared/airflow';
import { CalculationCache } from './calculation-cache';

describe('CalculationCache', () => {
  it('answers exactly as the engine does, for hits and misses alike', () => {
    const cache = new CalculationCache(2);
    const request = exampleRequest('boost')!;
    const first = cache.evaluate('boost', request);
    const fresh = evaluate('boost', request);
    expect(first).toMatchObject(fresh);
    expect(JSON.parse(first.json!)).toEqual(fresh.ok && fresh.result);
    expect(cache.evaluate('boost', structuredClone(request))).toBe(first);
  });

  it('keys on the calculator and every input, so different inputs never share an answer', () => {
    const cache = new CalculationCache();
    const request = exampleRequest('altitude-pressure')!;
    const higher = { inputs: { ...request.inputs, altitude: { value: 2000, unit: 'm' } } };
    const a = cache.evaluate('altitude-pressure', request);
    const b = cache.evaluate('altitude-pressure', higher);
    expect(a.ok && b.ok && a.result.outputs['pressure']!.value).not.toBe(b.ok && b.result.outputs['pressure']!.value);
    expect(b).toMatchObject(evaluate('altitude-pressure', higher));
  });

  it('keys on every reading of a list input, in order', () => {
    const cache = new CalculationCache();
    const request = exampleRequest('compare-tests')!;
    const oneMore = { inputs: { ...request.inputs, readingsB: { values: [252.8, 254.0, 255.2, 254.0], unit: 'cfm' } } };
    const a = cache.evaluate('compare-tests', request);
    const b = cache.evaluate('compare-tests', oneMore);
    expect(cache.size).toBe(2);
    expect(b).toMatchObject(evaluate('compare-tests', oneMore));
    expect(a.ok && b.ok && a.result.outputs['differenceStandardUncertainty']!.value).not.toBe(b.ok && b.result.outputs['differenceStandardUncertainty']!.value);
    expect(cache.evaluate('compare-tests', structuredClone(request))).toBe(a);
  });

  it('stays bounded', () => {
    const cache = new CalculationCache(3);
    for (let m = 0; m < 10; m++) cache.evaluate('altitude-pressure', { inputs: { altitude: { value: m * 100, unit: 'm' } } });
    expect(cache.size).toBe(3);
  });
});

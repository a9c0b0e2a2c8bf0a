import { convert, evaluate, exampleRequest, isListValue, isUsCustomary, listCalculators, SI_UNIT } from './index';
import type { CalculationRequest, CalculatorSummary, InputSummary, InputValue, QuantityKind } from './index';

/** What the SI form fills in: each input's SI example over its example, one member per one-of group. */
function siExampleRequest(summary: CalculatorSummary): CalculationRequest {
  const inputs: Record<string, InputValue> = {};
  const groupsUsed = new Set<string>();
  for (const input of summary.inputs) {
    const example = input.exampleSi ?? input.example;
    if (example === undefined) continue;
    if (input.group !== undefined) {
      if (groupsUsed.has(input.group)) continue;
      groupsUsed.add(input.group);
    }
    inputs[input.name] = example;
  }
  return { inputs };
}

/** Round to read: at most three significant figures, or a whole number of up to four digits (1013 hPa, 6000 rpm). */
function isRound(value: number): boolean {
  return Number(value.toPrecision(3)) === value || (Number.isInteger(value) && Math.abs(value) < 10_000);
}

/** The example in SI; for a list of readings, their mean. */
function inSI(input: InputSummary, example: InputValue): number | undefined {
  if (typeof example !== 'object') return undefined;
  const value = isListValue(example) ? example.values.reduce((sum, v) => sum + v, 0) / example.values.length : example.value;
  return convert(value, example.unit, SI_UNIT[input.kind as QuantityKind]);
}

const summaries = listCalculators();

describe('every SI worked example', () => {
  it.each(summaries.map((s) => [s.id, s] as const))('%s evaluates cleanly', (_id, summary) => {
    const outcome = evaluate(summary.id, siExampleRequest(summary));
    expect(outcome.ok ? [] : outcome.errors).toEqual([]);
    if (outcome.ok) expect(outcome.result.warnings).toEqual([]);
  });

  it.each(summaries.map((s) => [s.id, s] as const))('%s reads in round SI figures', (_id, summary) => {
    for (const [name, value] of Object.entries(siExampleRequest(summary).inputs)) {
      if (typeof value === 'string') continue;
      const quantity = typeof value === 'number' ? { values: [value], unit: '' } : isListValue(value) ? value : { values: [value.value], unit: value.unit };
      expect({ name, unit: quantity.unit, usCustomary: isUsCustomary(quantity.unit) }).toEqual({ name, unit: quantity.unit, usCustomary: false });
      for (const reading of quantity.values) expect({ name, value: reading, round: isRound(reading) }).toEqual({ name, value: reading, round: true });
    }
  });

  it('tells the same story as the US example, in its own round figures', () => {
    for (const summary of summaries) {
      for (const input of summary.inputs) {
        if (input.exampleSi === undefined || input.example === undefined) continue;
        const us = inSI(input, input.example);
        const si = inSI(input, input.exampleSi);
        if (us === undefined || si === undefined) continue;
        // Within 10 %: a different figure, not a different job (or a slip of the unit).
        const label = `${summary.id}.${input.name}`;
        expect({ label, close: Math.abs(si / us - 1) <= 0.1 }).toEqual({ label, close: true });
      }
    }
  });

  it('leaves the example request (lessons, the API) on the US example', () => {
    for (const summary of summaries) {
      const request = exampleRequest(summary.id)!;
      for (const input of summary.inputs) {
        if (input.exampleSi !== undefined && input.name in request.inputs) expect(request.inputs[input.name]).toEqual(input.example);
      }
    }
    expect(exampleRequest('boost')!.inputs['boostPressure']).toEqual({ value: 10, unit: 'psi' });
  });

  it('knows which units are US customary', () => {
    for (const unit of ['psi', 'inH2O', 'inHg', 'degF', 'cfm', 'lb/min', 'ft^3', 'in']) expect(isUsCustomary(unit)).toBe(true);
    for (const unit of ['kPa', 'hPa', 'Pa', 'degC', 'K', 'L/s', 'g/s', 'L', 'mm', 'kg/m^3', 'rpm', '%', '']) expect(isUsCustomary(unit)).toBe(false);
  });
});

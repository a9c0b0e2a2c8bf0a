import katex from 'katex';
import { describeCalculator, evaluate, exampleRequest, listCalculators } from './index';
import type { CalculationRequest, InputValue } from './index';

/** Every option value of every calculator, tried on top of its example, with US output units. */
function variants(): [string, CalculationRequest][] {
  const cases: [string, CalculationRequest][] = [];
  for (const c of listCalculators()) {
    const base = exampleRequest(c.id) as CalculationRequest;
    const outputUnits = Object.fromEntries(c.outputs.map((o) => [o.name, o.defaultUnit.us]));
    cases.push([`${c.id} (example, US outputs)`, { inputs: base.inputs, outputUnits }]);
    for (const input of c.inputs) {
      for (const option of input.options ?? []) {
        cases.push([`${c.id} ${input.name}=${option.value}`, { inputs: { ...base.inputs, [input.name]: option.value } }]);
      }
    }
  }
  const extra: [string, Record<string, InputValue>][] = [
    ['air-density', { temperature: { value: 30, unit: 'degF' }, pressure: { value: 25, unit: 'inHg' }, dewPoint: { value: 10, unit: 'degF' } }],
    ['manometer', { pressure: { value: -3, unit: 'kPa' }, fluid: 'mercury', fluidTemperature: { value: 20, unit: 'degC' } }],
    ['altitude-pressure', { altitude: { value: 15, unit: 'km' } }],
    ['sensor-correction', { measuredFlow: { value: 300, unit: 'cfm' }, testPressure: { value: 28, unit: 'inH2O' }, sensorPressureDrop: { value: 1, unit: 'inH2O' }, sensorReferenceFlow: { value: 250, unit: 'cfm' }, ambientPressure: { value: 1, unit: 'atm' } }],
    ['uncertainty', { quantity: 'mass-flow', convention: 'standard', volumeFlow: { value: 300, unit: 'cfm' }, volumeFlowUncertainty: { value: 3, unit: 'cfm' }, density: { value: 0.075, unit: 'lb/ft^3' } }],
  ];
  for (const [id, inputs] of extra) cases.push([`${id} (variant)`, { inputs }]);
  return cases;
}

describe('worked steps are valid LaTeX for KaTeX', () => {
  it.each(variants())('%s', (_name, request) => {
    const id = _name.split(' ')[0] ?? '';
    expect(describeCalculator(id)).toBeDefined();
    const outcome = evaluate(id, request);
    if (!outcome.ok) {
      // some option swaps need other inputs (e.g. solving for a diameter needs a flow): refusals must name a field
      expect(outcome.errors.every((e) => e.field !== '')).toBe(true);
      return;
    }
    for (const step of outcome.result.steps) {
      for (const tex of [step.formula, step.substituted, step.result]) {
        expect(() => katex.renderToString(tex, { throwOnError: true })).not.toThrow();
      }
    }
  });
});

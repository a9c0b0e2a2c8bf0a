/* The catalogue: every calculator definition, in the order the course meets them. */
import { airDensity } from './calculators/air-density';
import { altitudePressure } from './calculators/altitude-pressure';
import { boost } from './calculators/boost';
import { compareTests } from './calculators/compare-tests';
import { dischargeCoefficient } from './calculators/discharge-coefficient';
import { engineDemand } from './calculators/engine-demand';
import { flowAtTestPressure } from './calculators/flow-at-test-pressure';
import { fuelFlow } from './calculators/fuel-flow';
import { gasCompression } from './calculators/gas-compression';
import { manometer } from './calculators/manometer';
import { massFlow } from './calculators/mass-flow';
import { orificeFlow } from './calculators/orifice-flow';
import { portVelocity } from './calculators/port-velocity';
import { powerPotential } from './calculators/power-potential';
import { pressureConvert } from './calculators/pressure-convert';
import { sensorCorrection } from './calculators/sensor-correction';
import { speedDensity } from './calculators/speed-density';
import { standardFlow } from './calculators/standard-flow';
import { uncertainty } from './calculators/uncertainty';
import { type CalculatorDefinition, exampleInputs, toSummary } from './define';
import { evaluateDefinition } from './evaluate';
import type { CalculationOutcome, CalculationRequest, CalculatorSummary, InputValue } from './types';

export const CALCULATORS: readonly CalculatorDefinition[] = [
  pressureConvert,
  manometer,
  flowAtTestPressure,
  engineDemand,
  orificeFlow,
  portVelocity,
  dischargeCoefficient,
  airDensity,
  altitudePressure,
  standardFlow,
  massFlow,
  gasCompression,
  fuelFlow,
  powerPotential,
  speedDensity,
  boost,
  sensorCorrection,
  uncertainty,
  compareTests,
];

const byId = new Map(CALCULATORS.map((c) => [c.id, c]));
let summaries: CalculatorSummary[] | undefined;

function allSummaries(): CalculatorSummary[] {
  summaries ??= CALCULATORS.map(toSummary);
  return summaries;
}

/** The JSON-serialisable catalogue (a fresh copy each call, safe to mutate). */
export function listCalculators(): CalculatorSummary[] {
  return structuredClone(allSummaries());
}

export function describeCalculator(id: string): CalculatorSummary | undefined {
  const summary = allSummaries().find((s) => s.id === id);
  return summary === undefined ? undefined : structuredClone(summary);
}

/** Inputs of the calculator's worked example ("reset to example"). */
export function exampleRequest(id: string): CalculationRequest | undefined {
  const def = byId.get(id);
  return def === undefined ? undefined : { inputs: structuredClone(exampleInputs(def)) as Record<string, InputValue> };
}

/** Runs a calculator; never throws for bad input. */
export function evaluate(id: string, request: CalculationRequest): CalculationOutcome {
  const def = typeof id === 'string' && byId.has(id) ? byId.get(id) : undefined;
  if (def === undefined) return { ok: false, errors: [{ field: 'id', message: `Unknown calculator "${String(id)}".` }] };
  try {
    return evaluateDefinition(def, request);
  } catch (e) {
    return { ok: false, errors: [{ field: '', message: `The calculation failed: ${(e as Error).message}` }] };
  }
}

/**
 * A preset (a lesson's embedded calculator, a result line, a quiz question) over the example:
 * inputs the preset leaves out take the example's values, except other members of a one-of
 * group the preset already answers (giving `pressure` drops the example's `height`).
 */
export function withExampleDefaults(id: string, preset: Record<string, InputValue>): CalculationRequest | undefined {
  const def = byId.get(id);
  if (def === undefined) return undefined;
  const inputs = structuredClone(exampleInputs(def)) as Record<string, InputValue>;
  for (const group of toSummaryGroups(id)) {
    if (group.inputs.some((name) => name in preset)) for (const name of group.inputs) delete inputs[name];
  }
  return { inputs: { ...inputs, ...preset } };
}

function toSummaryGroups(id: string) {
  return allSummaries().find((s) => s.id === id)?.groups ?? [];
}

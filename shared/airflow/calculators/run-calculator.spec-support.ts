/* Shared by the calculator reference tests: run a calculator or fail loudly, read an output. */
import { evaluate } from '../index';
import type { CalculationResult, InputValue } from '../index';

export function run(id: string, inputs: Record<string, InputValue>, outputUnits?: Record<string, string>): CalculationResult {
  const outcome = evaluate(id, outputUnits === undefined ? { inputs } : { inputs, outputUnits });
  if (!outcome.ok) throw new Error(`${id} refused: ${JSON.stringify(outcome.errors)}`);
  return outcome.result;
}

export const out = (r: CalculationResult, name: string) => r.outputs[name]?.value ?? Number.NaN;
export const q = (value: number, unit: string) => ({ value, unit });

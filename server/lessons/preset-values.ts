import type { InputValue } from '../../shared/airflow';

const NUMBER = /^-?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?$/;

/**
 * Reads an author's value: `200 cfm` → quantity, `0.62` → bare number, `cipm2007` → option,
 * `248.8 250.0 251.2 cfm` (numbers separated by spaces, then one unit) → a list of readings.
 */
export function parsePresetValue(text: string): InputValue {
  const trimmed = text.trim();
  const words = trimmed.split(/\s+/);
  let count = 0;
  while (count < words.length && NUMBER.test(words[count]!)) count++;
  if (count >= 2) {
    const values = words.slice(0, count).map(Number);
    return { values, unit: words.slice(count).join(' ') };
  }
  const match = /^(-?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(trimmed);
  if (!match) return trimmed;
  const value = Number(match[1]);
  const unit = match[2]!.trim();
  return unit ? { value, unit } : value;
}

/** `name: value unit` lines of a `:::calculator` block. */
export function parsePresetLines(body: string): Record<string, InputValue> {
  const inputs: Record<string, InputValue> = {};
  for (const line of body.split('\n').map((l) => l.trim()).filter(Boolean)) {
    const colon = line.indexOf(':');
    if (colon < 1) throw new Error(`calculator preset "${line}" is not "name: value unit"`);
    inputs[line.slice(0, colon).trim()] = parsePresetValue(line.slice(colon + 1));
  }
  return inputs;
}

export interface ResultLine {
  calculator: string;
  inputs: Record<string, InputValue>;
  output: string;
  value: number;
  unit: string;
  tolerance: number;
}

/** `=> id | a=1 cfm, b=2 inH2O | out = 354.7 cfm [± 0.1]`; tolerance defaults to half the last digit. */
export function parseResultLine(line: string): ResultLine {
  const parts = line.replace(/^=>\s*/, '').split('|').map((p) => p.trim());
  if (parts.length !== 3) throw new Error(`result line "${line}" needs three parts: id | inputs | output = value unit`);
  const [calculator, inputText, expectText] = parts as [string, string, string];
  const inputs: Record<string, InputValue> = {};
  for (const pair of inputText.split(',').map((p) => p.trim()).filter(Boolean)) {
    const eq = pair.indexOf('=');
    if (eq < 1) throw new Error(`result line input "${pair}" is not name=value unit`);
    inputs[pair.slice(0, eq).trim()] = parsePresetValue(pair.slice(eq + 1));
  }
  const expected = /^(\w+)\s*=\s*(-?\d+(?:\.(\d+))?)\s*([^±]*?)\s*(?:±\s*(\d+(?:\.\d+)?))?$/.exec(expectText);
  if (!expected) throw new Error(`result "${expectText}" is not "output = value unit"`);
  const decimals = expected[3]?.length ?? 0;
  return {
    calculator,
    inputs,
    output: expected[1]!,
    value: Number(expected[2]),
    unit: expected[4]!.trim(),
    tolerance: expected[5] ? Number(expected[5]) : 0.5 / 10 ** decimals,
  };
}

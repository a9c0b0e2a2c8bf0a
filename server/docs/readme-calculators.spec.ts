import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

import { listCalculators, type CalculatorSummary, type InputSummary } from '../../shared/airflow';

// The README's calculator table is the public contract's index: it is generated from the catalogue
// and this test fails when the two drift. `UPDATE_README=1 npx jest server/docs` rewrites it.
const README = join(__dirname, '../../README.md');
const HEADER = '| id | title | inputs | outputs |\n| --- | --- | --- | --- |\n';

function unitsOf(kind: string, pair: { si: string; us: string } | undefined): string {
  if (kind === 'ratio') return '[ratio]';
  if (pair === undefined) return '';
  return `[${pair.us} / ${pair.si}]`;
}

/** `?` marks an optional input (every member of a one-of group is one; the group line says how many). */
function inputText(input: InputSummary): string {
  const optional = input.optional ? '?' : '';
  const list = input.list ? ` (list of ${input.list.min}–${input.list.max})` : '';
  if (input.kind === 'option') return `\`${input.name}\` (${(input.options ?? []).map((o) => `"${o.value}"`).join(' \\| ')})${optional}`;
  return `\`${input.name}\` ${unitsOf(input.kind, input.defaultUnit)}${list}${optional}`;
}

function row(c: CalculatorSummary): string {
  const inputs = c.inputs.map(inputText).join(', ');
  const groups = c.groups
    .map((g) => ` — one of: ${g.inputs.map((n) => `\`${n}\``).join(' or ')}${g.required ? '' : ' (optional)'}`)
    .join('');
  const outputs = c.outputs.map((o) => `\`${o.name}\` [${o.kind === 'ratio' ? 'ratio' : o.defaultUnit.si}]`).join(', ');
  return `| \`${c.id}\` | ${c.title} | ${inputs}${groups} | ${outputs} |`;
}

export function calculatorTable(): string {
  return HEADER + listCalculators().map(row).join('\n') + '\n';
}

describe('the README calculator table', () => {
  it('lists every calculator of the catalogue with its inputs and outputs', () => {
    const readme = readFileSync(README, 'utf8');
    const start = readme.indexOf(HEADER);
    expect(start).toBeGreaterThan(0);
    const end = readme.indexOf('\n\n', start);
    const current = readme.slice(start, end + 1);
    const wanted = calculatorTable();
    if (process.env['UPDATE_README'] === '1' && current !== wanted) {
      writeFileSync(README, readme.slice(0, start) + wanted + readme.slice(end + 1));
      return;
    }
    expect(current).toBe(wanted);
  });
});

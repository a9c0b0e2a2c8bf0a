/* LaTeX for the worked steps: numbers to a sensible number of significant figures, units. */

const UNIT_TEX: Readonly<Record<string, string>> = {
  degC: '{}^{\\circ}\\mathrm{C}',
  degF: '{}^{\\circ}\\mathrm{F}',
  degR: '{}^{\\circ}\\mathrm{R}',
  '%': '\\%',
  inH2O: '\\mathrm{inH_2O}',
  inH2O_39F: '\\mathrm{inH_2O}_{(39.2\\,{}^{\\circ}\\mathrm{F})}',
  inH2O_60F: '\\mathrm{inH_2O}_{(60\\,{}^{\\circ}\\mathrm{F})}',
  inHg: '\\mathrm{inHg}',
  inHg_60F: '\\mathrm{inHg}_{(60\\,{}^{\\circ}\\mathrm{F})}',
  mmH2O: '\\mathrm{mmH_2O}',
  cmH2O: '\\mathrm{cmH_2O}',
  '1/s': '\\mathrm{s^{-1}}',
  '1/min': '\\mathrm{min^{-1}}',
};

const texCache = new Map<string, string>();

/** A mathjs unit string as LaTeX, e.g. `m^3/s` → `\mathrm{m^{3}/s}`; '' → ''. */
export function unitTex(unit: string): string {
  const known = UNIT_TEX[unit];
  if (known !== undefined) return known;
  let tex = texCache.get(unit);
  if (tex === undefined) {
    tex = unit
      .trim()
      .split(/\s*\/\s*/)
      .map((part) => part.split(/\s*\*\s*|\s+/).map(factorTex).join('\\,'))
      .join('/');
    if (texCache.size < 500) texCache.set(unit, tex);
  }
  return tex;
}

function factorTex(factor: string): string {
  const [name = '', power] = factor.split('^');
  const base = UNIT_TEX[name] ?? (name === '' ? '' : `\\mathrm{${name.replace(/_/g, '\\_')}}`);
  return power === undefined ? base : `${base}^{${power}}`;
}

/**
 * A number as LaTeX with `sig` significant figures (default 5): plain notation from 1e-4 to
 * 1e6 with thin-space digit groups in long integer parts, scientific notation outside it;
 * trailing zeros after the decimal point are dropped.
 */
export function num(x: number, sig = 5): string {
  if (!Number.isFinite(x)) return x > 0 ? '\\infty' : x < 0 ? '-\\infty' : '\\text{NaN}';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-4) {
    const [mantissa = '0', exponent = '0'] = x.toExponential(sig - 1).split('e');
    return `${trimZeros(mantissa)} \\times 10^{${Number(exponent)}}`;
  }
  const integerDigits = Math.floor(Math.log10(abs)) + 1;
  const text = trimZeros(x.toFixed(Math.min(20, Math.max(0, sig - integerDigits))));
  return groupDigits(text);
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

function groupDigits(text: string): string {
  const negative = text.startsWith('-');
  const [intPart = '', frac] = (negative ? text.slice(1) : text).split('.');
  const grouped = intPart.length > 4 ? intPart.replace(/\B(?=(\d{3})+(?!\d))/g, '\\,') : intPart;
  return `${negative ? '-' : ''}${grouped}${frac === undefined ? '' : `.${frac}`}`;
}

/** A quantity as LaTeX: `101\,325\,\mathrm{Pa}`; a dimensionless value has no unit. */
export function qty(x: number, unit: string, sig = 5): string {
  const u = unitTex(unit);
  return u === '' ? num(x, sig) : `${num(x, sig)}\\,${u}`;
}

/** Wraps a negative number in parentheses for substitution into a formula. */
export function paren(tex: string): string {
  return tex.startsWith('-') ? `\\left(${tex}\\right)` : tex;
}

/** Several LaTeX lines stacked left-aligned. */
export function lines(items: readonly string[]): string {
  return items.length === 1 ? (items[0] ?? '') : `\\begin{aligned}${items.map((l) => `&${l}`).join(' \\\\ ')}\\end{aligned}`;
}

/**
 * A list of numbers as LaTeX lines for `lines()`: `(a,\ b,\ c,` … `x,\ y)`, at most `perLine`
 * numbers a line, so thirty readings do not run off the screen.
 */
export function listLinesTex(values: readonly number[], sig = 5, perLine = 6): string[] {
  const chunks: string[] = [];
  for (let i = 0; i < values.length; i += perLine) {
    chunks.push(values.slice(i, i + perLine).map((v) => num(v, sig)).join(',\\ '));
  }
  return chunks.map((chunk, i) => `${i === 0 ? '(' : ''}${chunk}${i < chunks.length - 1 ? ',' : ')'}`);
}

/** A list of readings on one line: `(248.8,\ 250,\ 251.2)\,\mathrm{cfm}`. */
export function listTex(values: readonly number[], unit: string, sig = 5): string {
  const u = unitTex(unit);
  const list = `(${values.map((v) => num(v, sig)).join(',\\ ')})`;
  return u === '' ? list : `${list}\\,${u}`;
}

/** Lines `prefix(a,\ b, …` … `y)suffix`, the continuation lines indented. */
export function wrapLines(prefix: string, body: readonly string[], suffix: string): string[] {
  return body.map((line, i) => `${i === 0 ? prefix : '\\quad '}${line}${i === body.length - 1 ? suffix : ''}`);
}

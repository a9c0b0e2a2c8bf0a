/* How units and figures read on screen: the engine's unit names (mathjs syntax) made typographic. */

const labels: Readonly<Record<string, string>> = {
  '': 'no unit',
  degC: '°C',
  degF: '°F',
  degR: '°R',
  inH2O: 'inH₂O',
  inH2O_39F: 'inH₂O (39.2 °F)',
  inH2O_60F: 'inH₂O (60 °F)',
  inHg_60F: 'inHg (60 °F)',
  mmH2O: 'mmH₂O',
  cmH2O: 'cmH₂O',
  'g/(kW h)': 'g/(kW·h)',
  'lb/(hp h)': 'lb/(hp·h)',
};

/** A unit as a picker shows it: `m^3/s` → `m³/s`, `degC` → `°C`, '' → `no unit`. */
export function unitLabel(unit: string): string {
  return labels[unit] ?? unit.replace(/\^2/g, '²').replace(/\^3/g, '³');
}

/** A unit as it follows a figure: like {@link unitLabel}, but nothing for a plain number. */
export function unitSuffix(unit: string): string {
  return unit === '' ? '' : unitLabel(unit);
}

const superscripts: Readonly<Record<string, string>> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

/**
 * A result with `significant` figures (5, as the worked steps print them): plain from 10⁻⁴ to
 * 10⁶, with narrow spaces between digit groups of long integer parts, scientific notation outside;
 * trailing zeros after the point dropped; a true minus sign.
 */
export function formatFigure(value: number, significant = 5): string {
  if (!Number.isFinite(value)) return value > 0 ? '∞' : value < 0 ? '−∞' : '—';
  if (value === 0) return '0';
  const sign = value < 0 ? '−' : '';
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-4) {
    const [mantissa = '0', exponent = '0'] = abs.toExponential(significant - 1).split('e');
    const power = String(Number(exponent)).replace(/./g, (c) => superscripts[c] ?? c);
    return `${sign}${trimZeros(mantissa)} × 10${power}`;
  }
  const integerDigits = Math.floor(Math.log10(abs)) + 1;
  const text = trimZeros(abs.toFixed(Math.min(20, Math.max(0, significant - integerDigits))));
  const [whole = '', fraction] = text.split('.');
  const grouped = whole.length > 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f') : whole;
  return `${sign}${grouped}${fraction === undefined ? '' : `.${fraction}`}`;
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

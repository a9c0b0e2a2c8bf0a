import { lines, num, qty, unitTex } from './latex';

describe('numbers in the worked steps', () => {
  it.each([
    [101325, '101\\,325'],
    [1.23456789, '1.2346'],
    [0.011589, '0.011589'],
    [2.5, '2.5'],
    [-2.5, '-2.5'],
    [0, '0'],
    [1.2e-5, '1.2 \\times 10^{-5}'],
    [6.02e23, '6.02 \\times 10^{23}'],
    [1234.5678, '1234.6'],
  ])('%d → %s', (x, tex) => {
    expect(num(x)).toBe(tex);
  });

  it('takes a number of significant figures', () => {
    expect(num(Math.PI, 3)).toBe('3.14');
    expect(num(Math.PI, 7)).toBe('3.141593');
  });
});

describe('units in the worked steps', () => {
  it.each([
    ['m^3/s', '\\mathrm{m}^{3}/\\mathrm{s}'],
    ['degC', '{}^{\\circ}\\mathrm{C}'],
    ['%', '\\%'],
    ['inH2O', '\\mathrm{inH_2O}'],
    ['', ''],
    ['kg m^-3', '\\mathrm{kg}\\,\\mathrm{m}^{-3}'],
  ])('%s → %s', (unit, tex) => {
    expect(unitTex(unit)).toBe(tex);
  });

  it('writes a quantity as number and unit, a pure number without a unit', () => {
    expect(qty(101325, 'Pa')).toBe('101\\,325\\,\\mathrm{Pa}');
    expect(qty(0.85, '')).toBe('0.85');
  });

  it('stacks several lines in an aligned block', () => {
    expect(lines(['a = 1'])).toBe('a = 1');
    expect(lines(['a = 1', 'b = 2'])).toBe('\\begin{aligned}&a = 1 \\\\ &b = 2\\end{aligned}');
  });
});

import * as fc from 'fast-check';
import { convert, isUnitOf, parseUnit, UNITS_BY_KIND } from './units';
import type { QuantityKind } from './types';

/** Checks a factor against a value printed with `digits` significant figures (half a unit in the last place). */
function expectPrinted(actual: number, printed: number, digits: number): void {
  const lastPlace = 10 ** (Math.floor(Math.log10(Math.abs(printed))) - digits + 1);
  expect(Math.abs(actual - printed)).toBeLessThanOrEqual(lastPlace / 2 + 1e-12 * Math.abs(printed));
}

describe('unit factors against NIST SP 811 (2008), Appendix B.8', () => {
  it.each([
    // NIST SP 811 B.8: pound-force per square inch (psi) → pascal 6.894 757 E+03
    ['psi', 'Pa', 6894.757, 7],
    // NIST SP 811 B.8: inch of mercury, conventional (inHg) → pascal 3.386 389 E+03
    ['inHg', 'Pa', 3386.389, 7],
    // NIST SP 811 B.8: inch of mercury (60 °F) → pascal 3.376 85 E+03
    ['inHg_60F', 'Pa', 3376.85, 6],
    // NIST SP 811 B.8: inch of water, conventional (inH2O) → pascal 2.490 889 E+02
    ['inH2O', 'Pa', 249.0889, 7],
    // NIST SP 811 B.8: inch of water (39.2 °F) → pascal 2.490 82 E+02
    ['inH2O_39F', 'Pa', 249.082, 6],
    // NIST SP 811 B.8: inch of water (60 °F) → pascal 2.4884 E+02
    ['inH2O_60F', 'Pa', 248.84, 5],
    // NIST SP 811 B.8: millimeter of mercury, conventional (mmHg) → pascal 1.333 224 E+02
    ['mmHg', 'Pa', 133.3224, 7],
    // NIST SP 811 B.8: torr (Torr) → pascal 1.333 224 E+02
    ['torr', 'Pa', 133.3224, 7],
    // NIST SP 811 B.8: millimeter of water, conventional (mmH2O) → pascal 9.806 65 E+00
    ['mmH2O', 'Pa', 9.80665, 6],
    // NIST SP 811 B.8: atmosphere, standard (atm) → pascal 1.013 25 E+05
    ['atm', 'Pa', 101325, 6],
    // NIST SP 811 B.8: bar → pascal 1.0 E+05
    ['bar', 'Pa', 100000, 2],
    // NIST SP 811 B.8: cubic foot per minute (ft³/min) → cubic meter per second 4.719 474 E−04
    ['cfm', 'm^3/s', 4.719474e-4, 7],
    // NIST SP 811 B.8: pound (avoirdupois) (lb) → kilogram 4.535 924 E−01 (0.453 592 37 exactly)
    ['lb', 'kg', 0.4535924, 7],
    // NIST SP 811 B.8: pound per minute (lb/min) → kilogram per second 7.559 873 E−03
    ['lb/min', 'kg/s', 7.559873e-3, 7],
    // NIST SP 811 B.8: pound per cubic foot (lb/ft³) → kilogram per cubic meter 1.601 846 E+01
    ['lb/ft^3', 'kg/m^3', 16.01846, 7],
    // NIST SP 811 B.8: cubic foot (ft³) → cubic meter 2.831 685 E−02
    ['ft^3', 'm^3', 2.831685e-2, 7],
    // NIST SP 811 B.8: cubic inch (in³) → cubic meter 1.638 706 E−05
    ['in^3', 'm^3', 1.638706e-5, 7],
    // NIST SP 811 B.8: gallon (U.S.) (gal) → cubic meter 3.785 412 E−03
    ['gal', 'm^3', 3.785412e-3, 7],
    // NIST SP 811 B.8: foot (ft) → meter 3.048 E−01 (exact)
    ['ft', 'm', 0.3048, 4],
    // NIST SP 811 B.8: liter (L) → cubic meter 1.0 E−03
    ['L/s', 'm^3/s', 1e-3, 2],
    // NIST SP 811 B.8: liter (L) → cubic meter 1.0 E−03; hour (h) → second 3.6 E+03: 1 L/h = 2.777 778 E−07 m³/s
    ['L/h', 'm^3/s', 2.777778e-7, 7],
    // NIST SP 811 B.8: cubic centimeter (cm³) → cubic meter 1.0 E−06; minute → second 6.0 E+01: 1 cc/min = 1.666 667 E−08 m³/s
    ['cc/min', 'm^3/s', 1.666667e-8, 7],
    // NIST SP 811 B.8: liter (L) → cubic meter 1.0 E−03, so 1 kg/L = 1.0 E+03 kg/m³
    ['kg/L', 'kg/m^3', 1000, 2],
    // NIST SP 811 B.8: square inch (in²) → square meter (m²) 6.4516 E−04 (exact)
    ['in^2', 'm^2', 6.4516e-4, 5],
    // NIST SP 811 B.8: square foot (ft²) → square meter (m²) 9.290 304 E−02 (exact)
    ['ft^2', 'm^2', 9.290304e-2, 7],
    // NIST SP 811 B.8: horsepower (550 ft · lbf/s) → watt (W) 7.456 999 E+02
    ['hp', 'W', 745.6999, 7],
    // NIST SP 811 B.8: pound per horsepower hour [lb/(hp · h)] → kilogram per joule (kg/J) 1.689 659 E−07
    ['lb/(hp h)', 'kg/J', 1.689659e-7, 7],
  ] as const)('1 %s = %d %s', (from, to, printed, digits) => {
    expectPrinted(convert(1, from, to), printed, digits);
  });

  it('reads degF and degC as absolute temperatures (NIST SP 811 B.9: T/K = (t/°F + 459.67)/1.8)', () => {
    // NIST SP 811 B.9: T/K = (t/°F + 459.67)/1.8 and T/K = t/°C + 273.15
    expect(convert(68, 'degF', 'K')).toBeCloseTo((68 + 459.67) / 1.8, 9);
    expect(convert(20, 'degC', 'K')).toBeCloseTo(293.15, 9);
    expect(convert(20, 'degC', 'degF')).toBeCloseTo(68, 9);
    expect(convert(-40, 'degC', 'degF')).toBeCloseTo(-40, 9);
  });

  it('counts rpm as 1/min for flow arithmetic (a revolution counted as 1, not 2π)', () => {
    expect(convert(6000, 'rpm', '1/s')).toBeCloseTo(100, 12);
  });

  it('gives a specific fuel consumption in g/(kW·h) from the pound and the horsepower', () => {
    // NIST SP 811 B.8: pound (avoirdupois) → kilogram 0.453 592 37 (exact); horsepower (550 ft · lbf/s) → watt 7.456 999 E+02;
    // by hand: 1 lb/(hp·h) = 453.592 37 g / 0.745 699 9 kW·h = 608.2774 g/(kW·h)
    // (the brief's "168.9659" is the mantissa of NIST's kg/J figure 1.689 659 E−07, not a g/(kW·h) figure)
    const byHand = 453.59237 / 0.7456999;
    expectPrinted(convert(1, 'lb/(hp h)', 'g/(kW h)'), byHand, 7);
    expectPrinted(convert(1, 'lb/(hp h)', 'g/(kW h)'), 608.2774, 7);
    // the same figure from the SI value: 1.689 659 E−07 kg/J × 3.6 E+06 J/(kW·h) × 1000 g/kg
    expectPrinted(convert(1, 'lb/(hp h)', 'g/(kW h)'), 1.689659e-7 * 3.6e6 * 1000, 6);
    // shop common practice: a good gasoline engine at full load, about 0.50 lb/(hp·h) ≈ 300 g/(kW·h)
    expect(convert(0.5, 'lb/(hp h)', 'g/(kW h)')).toBeCloseTo(304.1, 1);
  });

  it('reads % as 0.01', () => {
    expect(convert(85, '%', '')).toBeCloseTo(0.85, 15);
    expect(convert(0.5, '', '%')).toBeCloseTo(50, 12);
  });
});

describe('shop common practice', () => {
  it('an inch of water is about 0.036 psi', () => {
    // shop common practice: about 0.036 psi per inch of water
    expect(convert(1, 'inH2O', 'psi')).toBeCloseTo(0.036, 3);
  });

  it('sea-level air pressure is about 14.7 psi', () => {
    // shop common practice: about 14.7 psi at sea level
    expect(convert(1, 'atm', 'psi')).toBeCloseTo(14.7, 1);
  });

  it('29.92 inHg is the standard atmosphere to four figures', () => {
    // shop common practice: 29.92 inHg barometer = standard atmosphere
    expect(convert(29.92, 'inHg', 'kPa')).toBeCloseTo(101.32, 2);
  });
});

describe('unit parsing', () => {
  it('refuses unknown units, numbers inside unit strings, and scfm', () => {
    for (const bad of ['blarg', '5 m', '2/s', 'kPa*2', 'scfm', 'psig', 'm^x']) {
      expect(parseUnit(bad)).toBeUndefined();
    }
  });

  it('accepts mathjs syntax and the trade units', () => {
    for (const good of ['kPa', 'psi', 'degF', 'degC', 'K', 'm^3/s', 'lb/min', 'in^3', 'L/s', 'g/s', 'kg/m^3', 'inH2O', 'inHg', 'cfm', 'rpm', '%', '1/s', 'kg m^-3',
      'in^2', 'cm^2', 'hp', 'kW', 'g/(kW h)', 'lb/(hp h)', 'kg/L', 'cc/min', 'L/h']) {
      expect(parseUnit(good)).toBeDefined();
    }
  });

  it('throws a readable error from convert for incompatible or unknown units', () => {
    expect(() => convert(1, 'kPa', 'K')).toThrow(/different things/);
    expect(() => convert(1, 'blarg', 'K')).toThrow(/Unknown unit "blarg"/);
  });

  it('offers only units that measure their kind', () => {
    for (const [kind, units] of Object.entries(UNITS_BY_KIND)) {
      for (const unit of units) expect([kind, unit, isUnitOf(unit, kind as QuantityKind)]).toEqual([kind, unit, true]);
    }
  });
});

describe('unit round trips (property)', () => {
  const kinds = Object.keys(UNITS_BY_KIND) as QuantityKind[];
  it('convert a → b → a returns the value', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...kinds).chain((kind) =>
          fc.tuple(fc.constantFrom(...UNITS_BY_KIND[kind]), fc.constantFrom(...UNITS_BY_KIND[kind])),
        ),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        ([a, b], value) => {
          const back = convert(convert(value, a, b), b, a);
          expect(Math.abs(back - value)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(value)));
        },
      ),
      { numRuns: 300 },
    );
  });
});

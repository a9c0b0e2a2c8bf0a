import * as fc from 'fast-check';
import { evaluate } from '../index';
import { out, q, run } from './run-calculator.spec-support';


describe('pressure-convert', () => {
  it('gauge to absolute with a barometer reading (NIST SP 811 factors)', () => {
    const r = run('pressure-convert', { pressure: q(30, 'psi'), kind: 'gauge', ambient: q(29.92, 'inHg') }, { absolute: 'psi', gauge: 'kPa' });
    // NIST SP 811 B.8: psi → Pa 6.894 757 E+03; inHg (conventional) → Pa 3.386 389 E+03; by hand 30 + 29.92 × 3386.389/6894.757
    expect(out(r, 'absolute')).toBeCloseTo(30 + (29.92 * 3386.389) / 6894.757, 5);
    // NIST SP 811 B.8: 30 psi × 6.894 757 kPa/psi = 206.8427 kPa
    expect(out(r, 'gauge')).toBeCloseTo(206.8427, 3);
  });

  it('0 psi gauge at sea level is about 14.7 psi absolute', () => {
    const r = run('pressure-convert', { pressure: q(0, 'psi'), kind: 'gauge', ambient: q(1, 'atm') }, { absolute: 'psi' });
    // shop common practice: about 14.7 psi at sea level
    expect(out(r, 'absolute')).toBeCloseTo(14.7, 1);
  });

  it('absolute to gauge: a reading below ambient is a negative gauge pressure (suction)', () => {
    const r = run('pressure-convert', { pressure: q(95, 'kPa'), kind: 'absolute', ambient: q(101.325, 'kPa') });
    // by hand: 95 000 − 101 325 = −6325 Pa
    expect(out(r, 'gauge')).toBeCloseTo(-6325, 9);
  });

  it('assumes 101.325 kPa with a warning when the ambient pressure is left out', () => {
    const r = run('pressure-convert', { pressure: q(1, 'bar'), kind: 'gauge' });
    // ISO 2533 sea level 101 325 Pa + 1 bar (NIST SP 811 B.8: bar → Pa 1.0 E+05)
    expect(out(r, 'absolute')).toBeCloseTo(201325, 9);
    expect(r.warnings.map((w) => w.field)).toEqual(['ambient']);
  });

  it('an idle vacuum of 19 inHg with the barometer at 29.6 inHg is a MAP of about 35.9 kPa absolute', () => {
    const r = run('pressure-convert', { pressure: q(19, 'inHg'), kind: 'vacuum', ambient: q(29.6, 'inHg') }, { absolute: 'kPa', gauge: 'inHg', vacuum: 'inHg' });
    // review G5 worked example: MAP ≈ 35.9 kPa; by hand (29.6 − 19) inHg × 3.386 389 kPa/inHg (NIST SP 811 B.8) = 35.8957 kPa
    expect(out(r, 'absolute')).toBeCloseTo(((29.6 - 19) * 3386.389) / 1000, 4);
    expect(out(r, 'absolute')).toBeCloseTo(35.9, 1);
    // a vacuum reading is a negative gauge pressure of the same size
    expect(out(r, 'gauge')).toBeCloseTo(-19, 10);
    expect(out(r, 'vacuum')).toBeCloseTo(19, 10);
    expect(r.warnings).toEqual([]);
  });

  it('gives the vacuum for readings at or below ambient, and none above', () => {
    const suction = run('pressure-convert', { pressure: q(-28, 'inH2O'), kind: 'gauge', ambient: q(29.92, 'inHg') }, { vacuum: 'inH2O' });
    // by hand: 28 inH2O below ambient is a vacuum of 28 inH2O
    expect(out(suction, 'vacuum')).toBeCloseTo(28, 10);
    const map = run('pressure-convert', { pressure: q(35, 'kPa'), kind: 'absolute', ambient: q(100, 'kPa') }, { vacuum: 'kPa' });
    // by hand: 100 − 35 = 65 kPa below ambient
    expect(out(map, 'vacuum')).toBeCloseTo(65, 10);
    const tyre = run('pressure-convert', { pressure: q(30, 'psi'), kind: 'gauge', ambient: q(29.92, 'inHg') });
    expect(tyre.outputs['vacuum']).toBeUndefined();
  });

  it('refuses a vacuum as large as the ambient pressure, or a negative one', () => {
    const tooDeep = evaluate('pressure-convert', { inputs: { pressure: q(30, 'inHg'), kind: 'vacuum', ambient: q(29.6, 'inHg') } });
    expect(tooDeep.ok ? [] : tooDeep.errors.map((e) => e.field)).toEqual(['pressure']);
    const negative = evaluate('pressure-convert', { inputs: { pressure: q(-5, 'inHg'), kind: 'vacuum', ambient: q(29.6, 'inHg') } });
    expect(negative.ok ? [] : negative.errors.map((e) => e.field)).toEqual(['pressure']);
  });

  it('vacuum, gauge and absolute readings of one pressure agree (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 99, noNaN: true }), fc.double({ min: 60, max: 110, noNaN: true }), (vac, amb) => {
        fc.pre(vac < amb);
        const fromVacuum = run('pressure-convert', { pressure: q(vac, 'kPa'), kind: 'vacuum', ambient: q(amb, 'kPa') });
        const fromGauge = run('pressure-convert', { pressure: q(-vac, 'kPa'), kind: 'gauge', ambient: q(amb, 'kPa') });
        expect(out(fromVacuum, 'absolute')).toBeCloseTo(out(fromGauge, 'absolute'), 6);
        expect(out(fromGauge, 'vacuum')).toBeCloseTo(vac * 1000, 6);
      }),
      { numRuns: 50 },
    );
  });

  it('refuses a gauge reading below a perfect vacuum, naming the field', () => {
    const outcome = evaluate('pressure-convert', { inputs: { pressure: q(-20, 'psi'), kind: 'gauge', ambient: q(14.7, 'psi') } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['pressure']);
  });
});

describe('manometer', () => {
  const column = (fluid: string, tempF: number, inches = 1) =>
    run('manometer', { height: q(inches, 'in'), fluid, fluidTemperature: q(tempF, 'degF') });

  it('1 in of water at 39.2 °F is NIST\'s inch of water (39.2 °F)', () => {
    // NIST SP 811 B.8: inch of water (39.2 °F) → Pa 2.490 82 E+02. NIST's figure rests on the
    // older maximum water density 999.972 kg/m³; Tanaka (2001) gives 999.975, 3 ppm more.
    expect(Math.abs(out(column('water', 39.2), 'pressure') - 249.082)).toBeLessThan(1e-3);
  });

  it('1 in of water at 60 °F is NIST\'s inch of water (60 °F)', () => {
    // NIST SP 811 B.8: inch of water (60 °F) → Pa 2.4884 E+02
    expect(out(column('water', 60), 'pressure')).toBeCloseTo(248.84, 2);
  });

  it('1 in of mercury at 32 °F and at 60 °F match NIST', () => {
    // NIST SP 811 B.8: inch of mercury (32 °F) → Pa 3.386 38 E+03 (conventional 3.386 389 E+03)
    expect(Math.abs(out(column('mercury', 32), 'pressure') - 3386.38)).toBeLessThan(0.01);
    // NIST SP 811 B.8: inch of mercury (60 °F) → Pa 3.376 85 E+03
    expect(Math.abs(out(column('mercury', 60), 'pressure') - 3376.85)).toBeLessThan(0.02);
  });

  it('water density at 20 °C is the Tanaka et al. (2001) table value', () => {
    // Tanaka et al., Metrologia 38 (2001) 301, table (from memory): 998.2067 kg/m³ at 20 °C
    const r = run('manometer', { height: q(100, 'mm'), fluid: 'water', fluidTemperature: q(20, 'degC') });
    expect(out(r, 'fluidDensity')).toBeCloseTo(998.2067, 3);
  });

  it('an inch of water is about 0.036 psi', () => {
    const r = run('manometer', { height: q(1, 'in'), fluid: 'water', fluidTemperature: q(68, 'degF') }, { pressure: 'psi' });
    // shop common practice: about 0.036 psi per inch of water
    expect(out(r, 'pressure')).toBeCloseTo(0.036, 3);
  });

  it('pressure to height is the inverse', () => {
    const r = run('manometer', { pressure: q(28, 'inH2O_39F'), fluid: 'water', fluidTemperature: q(4, 'degC') }, { height: 'in' });
    // NIST SP 811 B.8: the 39.2 °F inch of water is a 1 in column of water at 39.2 °F (4 °C)
    expect(Math.abs(out(r, 'height') / 28 - 1)).toBeLessThan(5e-6);
  });

  it('warns outside the density formula\'s range and refuses frozen fluids', () => {
    expect(run('manometer', { height: q(1, 'in'), fluid: 'water', fluidTemperature: q(50, 'degC') }).warnings.map((w) => w.field)).toEqual(['fluidTemperature']);
    const frozen = evaluate('manometer', { inputs: { height: q(1, 'in'), fluid: 'mercury', fluidTemperature: q(-45, 'degC') } });
    expect(frozen.ok ? [] : frozen.errors.map((e) => e.field)).toEqual(['fluidTemperature']);
  });

  it('a taller column always means more pressure (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.constantFrom('water', 'mercury'), (h, dh, fluid) => {
        const p1 = out(run('manometer', { height: q(h, 'in'), fluid, fluidTemperature: q(20, 'degC') }), 'pressure');
        const p2 = out(run('manometer', { height: q(h + dh, 'in'), fluid, fluidTemperature: q(20, 'degC') }), 'pressure');
        expect(p2).toBeGreaterThan(p1);
      }),
      { numRuns: 50 },
    );
  });
});

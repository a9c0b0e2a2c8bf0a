import * as fc from 'fast-check';
import { describeCalculator, evaluate } from '../index';
import type { InputValue } from '../index';
import { out, q, run } from './run-calculator.spec-support';

const head: Record<string, InputValue> = {
  flow: q(160, 'cfm'), testPressure: q(28, 'inH2O'), density: q(1.2, 'kg/m^3'),
  valveDiameter: q(1.5, 'in'), lift: q(0.375, 'in'),
};
const fields = (r: { warnings: { field: string }[] }) => r.warnings.map((w) => w.field);

describe('discharge-coefficient: reference values', () => {
  it('inner-seat coefficient by hand (C_d = Q/(A_ref √(2Δp/ρ)), Heywood §6.3)', () => {
    const r = run('discharge-coefficient', { ...head, referenceArea: 'inner-seat' }, { area: 'in^2', effectiveArea: 'in^2' });
    // course-review-1 §2 G4 (Heywood §6.3, from memory): C_d = Q/(A_ref·√(2Δp/ρ)), inner seat A = πd²/4
    // by hand: A = π × 1.5²/4 = 1.767146 in² = 1.140092e-3 m²; √(2 × 6974.489/1.2) = 107.8153 m/s;
    // Q = 160 × 4.719474e-4 = 0.07551158 m³/s; C_d = 0.07551158 / (1.140092e-3 × 107.8153) = 0.614318
    expect(out(r, 'area')).toBeCloseTo(1.767146, 5);
    expect(out(r, 'dischargeCoefficient')).toBeCloseTo(0.614318, 5);
    // by hand: L/d = 0.375/1.5 = 0.25; A_e = C_d × A = 1.085593 in²
    expect(out(r, 'liftOverDiameter')).toBeCloseTo(0.25, 12);
    expect(out(r, 'effectiveArea')).toBeCloseTo(1.085593, 5);
    expect(r.warnings).toEqual([]);
    expect(r.notes).toEqual([]);
  });

  it('curtain and inner seat agree at L/d = 0.25 (πdL = πd²/4)', () => {
    // course-review-1 §2 G4: curtain πdL and inner seat πd²/4 are equal when L = d/4
    const seat = run('discharge-coefficient', { ...head, referenceArea: 'inner-seat' });
    const curtain = run('discharge-coefficient', { ...head, referenceArea: 'curtain' });
    expect(out(curtain, 'area')).toBeCloseTo(out(seat, 'area'), 15);
    expect(out(curtain, 'dischargeCoefficient')).toBeCloseTo(out(seat, 'dischargeCoefficient'), 12);
  });

  it('throat reference by hand', () => {
    const r = run('discharge-coefficient', { ...head, referenceArea: 'throat', throatDiameter: q(1.3, 'in') });
    // by hand: A = π × 1.3²/4 = 1.327323 in² = 8.563347e-4 m²; C_d = 0.07551158 / (8.563347e-4 × 107.8153) = 0.817878
    expect(out(r, 'dischargeCoefficient')).toBeCloseTo(0.817878, 5);
  });

  it('the inner-seat coefficient is the orifice equation solved for C_d with the seat as bore (one engine)', () => {
    const port = run('discharge-coefficient', { ...head, referenceArea: 'inner-seat' });
    const orifice = run('orifice-flow', { solveFor: 'dischargeCoefficient', diameter: q(1.5, 'in'), volumeFlow: q(160, 'cfm'), pressureDrop: q(28, 'inH2O'), density: q(1.2, 'kg/m^3') });
    expect(out(port, 'dischargeCoefficient')).toBeCloseTo(out(orifice, 'dischargeCoefficient'), 12);
  });

  it('a coefficient above 1 is allowed with a note; far above 1 is a warning', () => {
    // curtain at low lift: A = π × 1.5 × 0.05 = 0.2356 in², so 160 cfm gives C_d ≈ 4.6 (warning); 30 cfm gives ≈ 0.86, 40 cfm ≈ 1.15
    const low = { ...head, lift: q(0.05, 'in'), referenceArea: 'curtain' };
    const slightly = run('discharge-coefficient', { ...low, flow: q(40, 'cfm') });
    expect(out(slightly, 'dischargeCoefficient')).toBeGreaterThan(1);
    expect(slightly.warnings).toEqual([]);
    expect(slightly.notes.join(' ')).toMatch(/above 1.*allowed/);
    expect(fields(run('discharge-coefficient', low))).toEqual(['flow']);
  });

  it('notes that the curtain coefficient falls past L/d = 0.25, and warns on a very high lift', () => {
    const r = run('discharge-coefficient', { ...head, lift: q(0.45, 'in'), referenceArea: 'curtain' });
    expect(r.notes.join(' ')).toMatch(/0\.25/);
    expect(fields(run('discharge-coefficient', { ...head, lift: q(0.8, 'in') }))).toEqual(['lift']);
  });

  it('needs the throat diameter for the throat reference, and says when it is not used', () => {
    const outcome = evaluate('discharge-coefficient', { inputs: { ...head, referenceArea: 'throat' } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['throatDiameter']);
    expect(fields(run('discharge-coefficient', { ...head, throatDiameter: q(1.3, 'in') }))).toEqual(['throatDiameter']);
    expect(fields(run('discharge-coefficient', { ...head, referenceArea: 'throat', throatDiameter: q(1.6, 'in') }))).toEqual(['throatDiameter']);
  });

  it('is a bench calculator with the suction hazard', () => {
    expect(describeCalculator('discharge-coefficient')?.hazard).toMatch(/inlet.*instructions/);
  });
});

describe('discharge-coefficient: properties', () => {
  it('C_d scales with 1/A: twice the seat diameter, a quarter of the coefficient', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 3, noNaN: true }), (d) => {
        const cd = (dia: number) => out(run('discharge-coefficient', { ...head, valveDiameter: q(dia, 'in'), lift: q(0.1, 'in') }), 'dischargeCoefficient');
        expect(cd(2 * d) / cd(d)).toBeCloseTo(0.25, 10);
      }),
      { numRuns: 50 },
    );
  });

  it('the curtain coefficient scales with 1/L and equals the seat coefficient at L = d/4', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.8, max: 3, noNaN: true }), fc.double({ min: 0.02, max: 0.35, noNaN: true }), (d, ld) => {
        const at = (lift: number, referenceArea: string) =>
          out(run('discharge-coefficient', { ...head, valveDiameter: q(d, 'in'), lift: q(lift, 'in'), referenceArea }), 'dischargeCoefficient');
        expect(at(ld * d, 'curtain') * ld).toBeCloseTo(at(0.5 * ld * d, 'curtain') * 0.5 * ld, 9);
        expect(at(d / 4, 'curtain')).toBeCloseTo(at(d / 4, 'inner-seat'), 9);
      }),
      { numRuns: 50 },
    );
  });
});

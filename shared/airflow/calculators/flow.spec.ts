import * as fc from 'fast-check';
import { evaluate } from '../index';
import type { InputValue } from '../index';
import { out, q, run } from './run-calculator.spec-support';


describe('flow-at-test-pressure', () => {
  it('200 cfm at 10 inH2O is 334.66 cfm at 28 inH2O', () => {
    const r = run('flow-at-test-pressure', { flow: q(200, 'cfm'), fromPressureDrop: q(10, 'inH2O'), toPressureDrop: q(28, 'inH2O') }, { flow: 'cfm' });
    // by hand: 200 × √(28/10) = 200 × 1.673 320 = 334.664 cfm
    expect(out(r, 'flow')).toBeCloseTo(334.664, 3);
  });

  it('scaling there and back returns the reading, in any pressure unit', () => {
    const r = run('flow-at-test-pressure', { flow: q(100, 'L/s'), fromPressureDrop: q(7, 'kPa'), toPressureDrop: q(28, 'inH2O') }, { flow: 'L/s' });
    const back = run('flow-at-test-pressure', { flow: q(out(r, 'flow'), 'L/s'), fromPressureDrop: q(28, 'inH2O'), toPressureDrop: q(7000, 'Pa') }, { flow: 'L/s' });
    expect(out(back, 'flow')).toBeCloseTo(100, 10);
  });

  it('warns when the pressure drop is large enough to squeeze the air', () => {
    const r = run('flow-at-test-pressure', { flow: q(100, 'cfm'), fromPressureDrop: q(28, 'inH2O'), toPressureDrop: q(80, 'inH2O') });
    expect(r.warnings.map((w) => w.field)).toEqual(['toPressureDrop']);
  });

  it('flow rises with the pressure drop (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 50, noNaN: true }), (dp, extra) => {
        const at = (to: number) => out(run('flow-at-test-pressure', { flow: q(200, 'cfm'), fromPressureDrop: q(10, 'inH2O'), toPressureDrop: q(to, 'inH2O') }), 'flow');
        expect(at(dp + extra)).toBeGreaterThan(at(dp));
      }),
      { numRuns: 50 },
    );
  });
});

describe('orifice-flow', () => {
  // by hand: A = π·0.05²/4 = 1.963 495e-3 m²; √(2·1000/1.2) = 40.824 83 m/s;
  // Q = 0.6 × 1.963 495e-3 × 40.824 83 = 0.048 095 62 m³/s; ṁ = 1.2 Q = 0.057 714 74 kg/s
  const known = { diameter: q(50, 'mm'), dischargeCoefficient: 0.6, pressureDrop: q(1000, 'Pa'), density: q(1.2, 'kg/m^3') };

  it('flow by hand computation', () => {
    const r = run('orifice-flow', known);
    expect(out(r, 'volumeFlow')).toBeCloseTo(0.04809562, 8);
    expect(out(r, 'massFlow')).toBeCloseTo(0.05771474, 8);
    expect(out(r, 'velocity')).toBeCloseTo(0.6 * 40.82483, 4);
  });

  it('is the ISO 5167-1 mass-flow equation with ε = 1 and C/√(1−β⁴) folded into C_d', () => {
    // ISO 5167-1: q_m = C/√(1−β⁴) · ε · (π/4) d² · √(2 Δp ρ₁)
    const qm = 0.6 * 1 * (Math.PI / 4) * 0.05 ** 2 * Math.sqrt(2 * 1000 * 1.2);
    expect(out(run('orifice-flow', known), 'massFlow')).toBeCloseTo(qm, 12);
  });

  it.each([
    ['diameter', 'diameter', 0.05],
    ['dischargeCoefficient', 'dischargeCoefficient', 0.6],
    ['pressureDrop', 'pressureDrop', 1000],
  ])('solves for %s from the flow', (solveFor, name, expected) => {
    const inputs: Record<string, InputValue> = { ...known, volumeFlow: q(0.048095618631, 'm^3/s'), solveFor };
    delete inputs[name];
    expect(out(run('orifice-flow', inputs), name)).toBeCloseTo(expected, 5);
  });

  it('names the missing quantity when solving', () => {
    const outcome = evaluate('orifice-flow', { inputs: { ...known, solveFor: 'diameter' } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['volumeFlow']);
  });

  it('flow rises with the pressure drop (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 10000, noNaN: true }), fc.double({ min: 1, max: 5000, noNaN: true }), (dp, extra) => {
        const at = (p: number) => out(run('orifice-flow', { ...known, pressureDrop: q(p, 'Pa') }), 'volumeFlow');
        expect(at(dp + extra)).toBeGreaterThan(at(dp));
      }),
      { numRuns: 50 },
    );
  });
});

describe('engine-demand', () => {
  it('5.0 L four-stroke at 6000 rpm and 85 % VE draws 12.75 m³/min = 450.3 cfm', () => {
    const r = run('engine-demand', { displacement: q(5.0, 'L'), speed: q(6000, 'rpm'), volumetricEfficiency: q(85, '%'), cycle: 'four-stroke', density: q(1.2, 'kg/m^3') },
      { volumeFlow: 'm^3/min' });
    // by hand: 5.0 L × 6000 /min × 0.85 / 2 = 12 750 L/min = 12.75 m³/min
    expect(out(r, 'volumeFlow')).toBeCloseTo(12.75, 10);
    const cfm = run('engine-demand', { displacement: q(5.0, 'L'), speed: q(6000, 'rpm'), volumetricEfficiency: 85, density: q(1.2, 'kg/m^3') }, { volumeFlow: 'cfm' });
    // NIST SP 811 B.8: ft³/min → m³/s 4.719 474 E−04, so 0.2125 m³/s = 450.26 cfm (≈ 450.3 cfm)
    expect(out(cfm, 'volumeFlow')).toBeCloseTo(450.262, 3);
  });

  it('a two-stroke fills once per revolution: twice the four-stroke figure', () => {
    const inputs = { displacement: q(350, 'in^3'), speed: q(5000, 'rpm'), volumetricEfficiency: q(90, '%'), density: q(0.075, 'lb/ft^3') };
    const four = run('engine-demand', { ...inputs, cycle: 'four-stroke' });
    const two = run('engine-demand', { ...inputs, cycle: 'two-stroke' });
    expect(out(two, 'volumeFlow') / out(four, 'volumeFlow')).toBeCloseTo(2, 12);
    // by hand: 350 in³ × 5000 rpm × 0.9 / 2 / 1728 in³/ft³ = 455.73 cfm; × 0.075 lb/ft³ = 34.18 lb/min
    const us = run('engine-demand', { ...inputs, cycle: 'four-stroke' }, { volumeFlow: 'cfm', massFlow: 'lb/min' });
    expect(out(us, 'volumeFlow')).toBeCloseTo((350 * 5000 * 0.9) / 2 / 1728, 6);
    expect(out(us, 'massFlow')).toBeCloseTo(((350 * 5000 * 0.9) / 2 / 1728) * 0.075, 6);
  });
});

import * as fc from 'fast-check';
import { evaluate } from '../index';
import type { InputValue } from '../index';
import { nozzleExpansibility, orificeExpansibility } from '../flow';
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

  // ISO 5167-2:2003 orifice expansibility with β → 0, κ = 1.4, written out by hand: ε = 1 − 0.351[1 − τ^(1/κ)]
  const isoOrifice = (tau: number) => 1 - 0.351 * (1 - tau ** (1 / 1.4));
  // ISO 5167-3:2003 nozzle expansibility with β → 0, κ = 1.4, by hand: ε = √[κτ^(2/κ)/(κ−1) · (1 − τ^((κ−1)/κ))/(1 − τ)]
  const isoNozzle = (tau: number) => Math.sqrt(((1.4 * tau ** (2 / 1.4)) / 0.4) * ((1 - tau ** (0.4 / 1.4)) / (1 - tau)));
  // NIST SP 811 B.8: conventional inch of water 249.0889 Pa; ambient 101 325 Pa (ISO 2533 sea level)
  const tau = (inH2O: number) => 1 - (inH2O * 249.08891) / 101325;
  const convert10to28 = (model: string) => run('flow-at-test-pressure',
    { flow: q(200, 'cfm'), fromPressureDrop: q(10, 'inH2O'), toPressureDrop: q(28, 'inH2O'), model, ambientPressure: q(101.325, 'kPa') }, { flow: 'cfm' });

  it('the orifice and nozzle models follow the ISO 5167 expansibility formulas worked by hand', () => {
    const orifice = convert10to28('orifice');
    expect(out(orifice, 'expansibilityRatio')).toBeCloseTo(isoOrifice(tau(28)) / isoOrifice(tau(10)), 12);
    expect(out(orifice, 'flow')).toBeCloseTo(200 * Math.sqrt(2.8) * (isoOrifice(tau(28)) / isoOrifice(tau(10))), 9);
    const nozzle = convert10to28('nozzle');
    expect(out(nozzle, 'expansibilityRatio')).toBeCloseTo(isoNozzle(tau(28)) / isoNozzle(tau(10)), 12);
    expect(orifice.warnings).toEqual([]);
  });

  it('10 → 28 inH2O by the square-root rule reads 1.1 % high for an orifice-like part and 2.5 % high for a nozzle-like one', () => {
    const root = out(convert10to28('square-root'), 'flow');
    // review E10 (ISO 5167-2 and -3 expansibility): ε₂₈/ε₁₀ = 0.989 (orifice-like) and 0.975 (nozzle-like)
    expect(out(convert10to28('orifice'), 'expansibilityRatio')).toBeCloseTo(0.989, 3);
    expect(out(convert10to28('nozzle'), 'expansibilityRatio')).toBeCloseTo(0.975, 3);
    // review E10: the square-root figure reads 1.1 % and 2.5 % high
    expect((root / out(convert10to28('orifice'), 'flow') - 1) * 100).toBeCloseTo(1.1, 1);
    expect((root / out(convert10to28('nozzle'), 'flow') - 1) * 100).toBeCloseTo(2.5, 1);
  });

  it('lesson 2\'s core example, 95 L/s at 2 kPa to 8 kPa: the real flow is 1.5–3.3 % under the square-root 190 L/s', () => {
    const at8 = (model: string) => run('flow-at-test-pressure',
      { flow: q(95, 'L/s'), fromPressureDrop: q(2, 'kPa'), toPressureDrop: q(8, 'kPa'), model, ambientPressure: q(101.325, 'kPa') }, { flow: 'L/s' });
    // review E10: 1.5 % (orifice-like) to 3.3 % (nozzle-like) under 190 L/s
    expect((1 - out(at8('orifice'), 'flow') / 190) * 100).toBeCloseTo(1.5, 1);
    expect((1 - out(at8('nozzle'), 'flow') / 190) * 100).toBeCloseTo(3.3, 1);
    // a ratio of 4 between the test pressures warns on every model; the square-root warning says how far off it reads
    const root = at8('square-root');
    expect(out(root, 'flow')).toBeCloseTo(190, 10);
    expect(root.warnings.map((w) => w.field)).toEqual(['toPressureDrop']);
    expect(root.warnings[0]?.message).toContain('reads high here: by about 1.5 % for an orifice-like part and 3.4 % for a nozzle-like one');
    expect(at8('orifice').warnings.map((w) => w.field)).toEqual(['toPressureDrop']);
    expect(at8('nozzle').warnings.map((w) => w.field)).toEqual(['toPressureDrop']);
  });

  it('converting down by more than 3 times says the square-root figure reads low', () => {
    const r = run('flow-at-test-pressure', { flow: q(250, 'cfm'), fromPressureDrop: q(28, 'inH2O'), toPressureDrop: q(8, 'inH2O') });
    expect(r.warnings.map((w) => w.field)).toEqual(['toPressureDrop']);
    expect(r.warnings[0]?.message).toContain('reads low');
  });

  it('the expansibility models assume 101.325 kPa with a warning, and refuse a test pressure as large as the ambient', () => {
    const assumed = run('flow-at-test-pressure', { flow: q(200, 'cfm'), fromPressureDrop: q(10, 'inH2O'), toPressureDrop: q(28, 'inH2O'), model: 'nozzle' });
    expect(assumed.warnings.map((w) => w.field)).toEqual(['ambientPressure']);
    const outcome = evaluate('flow-at-test-pressure', { inputs: { flow: q(200, 'cfm'), fromPressureDrop: q(10, 'inH2O'), toPressureDrop: q(110, 'kPa'), model: 'orifice', ambientPressure: q(100, 'kPa') } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['toPressureDrop']);
  });

  it('expansibility is at most 1 and falls as the pressure drop grows, for both models (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 20000, noNaN: true }), fc.double({ min: 1, max: 5000, noNaN: true }), (dp, extra) => {
        for (const f of [orificeExpansibility, nozzleExpansibility]) {
          const eps = (drop: number) => f(1 - drop / 101325);
          expect(eps(dp)).toBeLessThanOrEqual(1);
          expect(eps(dp + extra)).toBeLessThan(eps(dp));
        }
        // ISO 5167-2 vs -3: an orifice's free jet makes up for part of the expansion by contracting less, so its ε stays nearer 1
        expect(orificeExpansibility(1 - dp / 101325)).toBeGreaterThan(nozzleExpansibility(1 - dp / 101325));
      }),
      { numRuns: 100 },
    );
  });

  it('converting up with either expansibility model gives less than the square-root rule (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 20, noNaN: true }), fc.double({ min: 1.01, max: 3, noNaN: true }), fc.constantFrom('orifice', 'nozzle'), (from, k, model) => {
        const inputs = { flow: q(200, 'cfm'), fromPressureDrop: q(from, 'inH2O'), toPressureDrop: q(from * k, 'inH2O'), ambientPressure: q(29.92, 'inHg') };
        expect(out(run('flow-at-test-pressure', { ...inputs, model }), 'flow')).toBeLessThan(out(run('flow-at-test-pressure', inputs), 'flow'));
      }),
      { numRuns: 50 },
    );
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

  it('names the density the VE is referred to, and warns of boost counted twice', () => {
    const inputs = { displacement: q(2.0, 'L'), speed: q(6000, 'rpm'), density: q(2.0, 'kg/m^3') };
    const doubled = run('engine-demand', { ...inputs, volumetricEfficiency: q(180, '%') });
    // review E4 (Heywood §2.10, from memory): a VE of 180 % with the manifold density counts boost twice
    expect(doubled.warnings.map((w) => w.field)).toEqual(['volumetricEfficiency']);
    expect(doubled.steps.some((s) => s.title.includes('manifold air density'))).toBe(true);
    const ambient = run('engine-demand', { ...inputs, volumetricEfficiency: q(180, '%'), densityReference: 'ambient', density: q(1.18, 'kg/m^3') });
    expect(ambient.warnings).toEqual([]);
    expect(ambient.steps.some((s) => s.title.includes('ambient air density'))).toBe(true);
    // the arithmetic does not change with the reference, only which density belongs with the VE:
    // by hand 2.0 L × 100 /s × 0.9 / 2 × 2.0 kg/m³ = 0.18 kg/s
    expect(out(run('engine-demand', { ...inputs, volumetricEfficiency: q(90, '%') }), 'massFlow')).toBeCloseTo(0.18, 12);
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

import * as fc from 'fast-check';
import katex from 'katex';
import { evaluate } from '../index';
import { out, q, run } from './run-calculator.spec-support';


describe('sensor-correction', () => {
  it('removes the sensor drop by square-root scaling and corrects the density, by hand', () => {
    const r = run('sensor-correction', { measuredFlow: q(300, 'cfm'), testPressure: q(28, 'inH2O'), sensorPressureDrop: q(2, 'inH2O'), ambientPressure: q(101325, 'Pa') }, { correctedFlow: 'cfm', partPressureDrop: 'inH2O' });
    // by hand: 300 × √(28/26) × √(101 325/(101 325 − 2 × 249.0889)) = 311.32 × 1.002464
    const expected = 300 * Math.sqrt(28 / 26) * Math.sqrt(101325 / (101325 - 2 * 249.08891));
    expect(out(r, 'correctedFlow')).toBeCloseTo(expected, 9);
    expect(out(r, 'partPressureDrop')).toBeCloseTo(26, 9);
  });

  it('scales a sensor drop measured at another flow with the square of the flow', () => {
    const r = run('sensor-correction', { measuredFlow: q(300, 'cfm'), testPressure: q(28, 'inH2O'), sensorPressureDrop: q(1, 'inH2O'), sensorReferenceFlow: q(200, 'cfm'), ambientPressure: q(29.92, 'inHg') }, { sensorPressureDrop: 'inH2O' });
    // by hand: 1 inH2O × (300/200)² = 2.25 inH2O
    expect(out(r, 'sensorPressureDrop')).toBeCloseTo(2.25, 10);
  });

  it('a sensor with no drop changes nothing', () => {
    const r = run('sensor-correction', { measuredFlow: q(300, 'cfm'), testPressure: q(28, 'inH2O'), sensorPressureDrop: q(1e-9, 'Pa'), ambientPressure: q(1, 'atm') });
    expect(out(r, 'correctionFactor')).toBeCloseTo(1, 9);
  });

  it('refuses a sensor drop as large as the test pressure, naming the field', () => {
    const outcome = evaluate('sensor-correction', { inputs: { measuredFlow: q(300, 'cfm'), testPressure: q(10, 'inH2O'), sensorPressureDrop: q(10, 'inH2O'), ambientPressure: q(1, 'atm') } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['sensorPressureDrop']);
  });
});

describe('uncertainty', () => {
  it('mass flow from volume flow and density, by hand (GUM eq. 10)', () => {
    const r = run('uncertainty', { quantity: 'mass-flow', convention: 'standard', volumeFlow: q(0.2, 'm^3/s'), volumeFlowUncertainty: q(0.004, 'm^3/s'), density: q(1.2, 'kg/m^3'), densityUncertainty: q(0.006, 'kg/m^3') });
    // GUM (JCGM 100:2008) eq. 10 by hand: u_c = √((1.2·0.004)² + (0.2·0.006)²) = 4.947 72e-3 kg/s; U = 2 u_c
    const uc = Math.sqrt((1.2 * 0.004) ** 2 + (0.2 * 0.006) ** 2);
    expect(out(r, 'massFlow')).toBeCloseTo(0.24, 12);
    expect(out(r, 'massFlowStandardUncertainty')).toBeCloseTo(uc, 9);
    expect(out(r, 'massFlowExpandedUncertainty')).toBeCloseTo(2 * uc, 9);
    expect(out(r, 'relativeExpandedUncertainty')).toBeCloseTo((200 * uc) / 0.24, 6);
  });

  it('reads ± accuracy limits as rectangular: u = a/√3 (GUM 4.3.7)', () => {
    const inputs = { quantity: 'mass-flow', volumeFlow: q(0.2, 'm^3/s'), volumeFlowUncertainty: q(0.004, 'm^3/s'), density: q(1.2, 'kg/m^3') };
    const rect = run('uncertainty', { ...inputs, convention: 'rectangular' });
    // GUM 4.3.7: rectangular half-width a → u = a/√3
    expect(out(rect, 'massFlowStandardUncertainty')).toBeCloseTo((1.2 * 0.004) / Math.sqrt(3), 9);
  });

  it('air density: sensitivities match the CIPM-2007 rule of thumb', () => {
    const r = run('uncertainty', { quantity: 'air-density', convention: 'standard', temperature: q(20, 'degC'), temperatureUncertainty: q(0.1, 'K'),
      pressure: q(101325, 'Pa'), relativeHumidity: q(50, '%') });
    // Picard et al. 2008 (from memory): (1/ρ)∂ρ/∂T ≈ −4×10⁻³ K⁻¹ (one figure), so u(T) = 0.1 K gives
    // ≈ 4×10⁻⁴ relative; we get 3.7×10⁻⁴ (≈ 1/T plus the vapour term), the formula's 22×10⁻⁶ in quadrature
    const rel = out(r, 'densityStandardUncertainty') / out(r, 'density');
    expect(rel).toBeGreaterThan(3.5e-4);
    expect(rel).toBeLessThan(4.5e-4);
  });

  it('pressure and humidity sensitivities: ≈ +1×10⁻⁵ /Pa and ≈ −9×10⁻³ per unit h', () => {
    const base = { quantity: 'air-density', convention: 'standard', temperature: q(20, 'degC'), pressure: q(101325, 'Pa'), relativeHumidity: q(50, '%') };
    const onlyP = run('uncertainty', { ...base, pressureUncertainty: q(10, 'Pa') });
    const onlyH = run('uncertainty', { ...base, relativeHumidityUncertainty: q(10, '%') });
    const formula = 22e-6;
    const relP = Math.sqrt((out(onlyP, 'densityStandardUncertainty') / out(onlyP, 'density')) ** 2 - formula ** 2);
    const relH = Math.sqrt((out(onlyH, 'densityStandardUncertainty') / out(onlyH, 'density')) ** 2 - formula ** 2);
    // Picard et al. 2008 (from memory): (1/ρ)∂ρ/∂p ≈ 1×10⁻⁵ Pa⁻¹ → 10 Pa gives ≈ 1×10⁻⁴
    expect(relP).toBeCloseTo(9.87e-5, 6);
    // Picard et al. 2008 (from memory): (1/ρ)∂ρ/∂h ≈ −9×10⁻³ → 0.1 gives ≈ 9×10⁻⁴ (about 8.8×10⁻⁴ at 20 °C)
    expect(relH).toBeGreaterThan(8e-4);
    expect(relH).toBeLessThan(9.5e-4);
  });

  it('treats a temperature uncertainty as an interval: 0.9 °F is 0.5 K, not an absolute temperature', () => {
    const base = { quantity: 'air-density', convention: 'standard', temperature: q(20, 'degC'), pressure: q(101325, 'Pa') };
    const k = run('uncertainty', { ...base, temperatureUncertainty: q(0.5, 'K') });
    const f = run('uncertainty', { ...base, temperatureUncertainty: q(0.9, 'degF') });
    const c = run('uncertainty', { ...base, temperatureUncertainty: q(0.5, 'degC') });
    expect(out(f, 'densityStandardUncertainty')).toBeCloseTo(out(k, 'densityStandardUncertainty'), 12);
    expect(out(c, 'densityStandardUncertainty')).toBeCloseTo(out(k, 'densityStandardUncertainty'), 12);
  });

  it('names a missing input for the chosen result', () => {
    const outcome = evaluate('uncertainty', { inputs: { quantity: 'mass-flow', volumeFlow: q(1, 'm^3/s') } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['density']);
  });

  it('uncertainty grows with each input uncertainty (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2, noNaN: true }), fc.double({ min: 0.01, max: 2, noNaN: true }), (uT, extra) => {
        const at = (u: number) => out(run('uncertainty', { quantity: 'air-density', temperature: q(20, 'degC'), pressure: q(1000, 'hPa'), temperatureUncertainty: q(u, 'K') }), 'densityStandardUncertainty');
        expect(at(uT + extra)).toBeGreaterThan(at(uT));
      }),
      { numRuns: 30 },
    );
  });
});

describe('uncertainty with repeat runs (Type A, t factor)', () => {
  const massFlow = { quantity: 'mass-flow', convention: 'standard', volumeFlow: q(0.2, 'm^3/s'), volumeFlowUncertainty: q(0.004, 'm^3/s'), density: q(1.2, 'kg/m^3'), densityUncertainty: q(0.006, 'kg/m^3') };

  it('adds s/√n with ν = n − 1 and uses t at ν_eff, by hand (GUM 4.2, G.4.2, Table G.2)', () => {
    const r = run('uncertainty', { ...massFlow, repeatCount: 3, repeatScatter: q(0.01, 'm^3/s') });
    // by hand: Type A u_A(Q) = 0.01/√3 = 0.005 774 m³/s, times c_Q = ρ = 1.2 → 0.006 928 kg/s
    const typeA = (1.2 * 0.01) / Math.sqrt(3);
    const uc = Math.sqrt((1.2 * 0.004) ** 2 + (0.2 * 0.006) ** 2 + typeA ** 2);
    expect(out(r, 'massFlowStandardUncertainty')).toBeCloseTo(uc, 9);
    // GUM eq. G.2b by hand: ν_eff = u_c⁴ / (u_A⁴/2) = 4.56 → 4; GUM Table G.2: t_95(4) = 2.78
    expect(uc ** 4 / (typeA ** 4 / 2)).toBeCloseTo(4.56, 2);
    expect(out(r, 'coverageFactor')).toBeCloseTo(2.78, 2);
    expect(out(r, 'massFlowExpandedUncertainty')).toBeCloseTo(out(r, 'coverageFactor') * uc, 9);
  });

  it('three repeat runs alone give t = 4.30, not k = 2 (course review 1, E5)', () => {
    const r = run('uncertainty', { quantity: 'mass-flow', convention: 'standard', volumeFlow: q(182.2, 'cfm'), density: q(1.2, 'kg/m^3'), repeatCount: 3, repeatScatter: q(1.2, 'cfm') });
    // course review 1 E5 and GUM Table G.2: n = 3 gives ν = 2 and t_95(2) = 4.30
    expect(out(r, 'coverageFactor')).toBeCloseTo(4.3, 2);
    // by hand: U = 4.303 × 1.2/√3 = 2.98 cfm of 182.2 cfm = 1.64 %
    expect(out(r, 'relativeExpandedUncertainty')).toBeCloseTo((100 * out(r, 'coverageFactor') * 1.2) / Math.sqrt(3) / 182.2, 9);
    expect(out(r, 'relativeExpandedUncertainty')).toBeCloseTo(1.64, 2);
  });

  it('keeps k = 2 without repeat runs, and says that repeat scatter belongs in the budget', () => {
    const r = run('uncertainty', massFlow);
    expect(out(r, 'coverageFactor')).toBe(2);
    expect(r.notes.join(' ')).toMatch(/square root of density/);
    expect(r.notes.join(' ')).toMatch(/always belongs in the budget/);
    const density = run('uncertainty', { quantity: 'air-density', temperature: q(20, 'degC'), pressure: q(1013, 'hPa') });
    expect(out(density, 'coverageFactor')).toBe(2);
    expect(density.notes).toEqual([]);
  });

  it('needs both the count and the scatter, a whole count of 2 or more', () => {
    const fields = (extra: Record<string, unknown>) => {
      const outcome = evaluate('uncertainty', { inputs: { ...massFlow, ...extra } as never });
      return outcome.ok ? [] : outcome.errors.map((e) => e.field);
    };
    expect(fields({ repeatCount: 3 })).toEqual(['repeatScatter']);
    expect(fields({ repeatScatter: q(1, 'cfm') })).toEqual(['repeatCount']);
    expect(fields({ repeatCount: 2.5, repeatScatter: q(1, 'cfm') })).toEqual(['repeatCount']);
    expect(fields({ repeatCount: 1, repeatScatter: q(1, 'cfm') })).toEqual(['repeatCount']);
  });

  it('leaves repeat runs out of an air-density result, with a warning', () => {
    const r = run('uncertainty', { quantity: 'air-density', temperature: q(20, 'degC'), pressure: q(1013, 'hPa'), repeatCount: 3, repeatScatter: q(1, 'cfm') });
    expect(r.warnings.map((w) => w.field)).toEqual(['repeatCount']);
    expect(out(r, 'coverageFactor')).toBe(2);
  });

  it('writes steps KaTeX can typeset', () => {
    const r = run('uncertainty', { ...massFlow, repeatCount: 5, repeatScatter: q(0.002, 'm^3/s') });
    expect(r.steps.map((s) => s.title)).toEqual(expect.arrayContaining(['Repeatability of the volume flow (Type A, GUM 4.2)', 'Effective degrees of freedom (Welch–Satterthwaite, GUM G.4.2)']));
    for (const step of r.steps) for (const tex of [step.formula, step.substituted, step.result]) expect(() => katex.renderToString(tex, { throwOnError: true })).not.toThrow();
  });
});

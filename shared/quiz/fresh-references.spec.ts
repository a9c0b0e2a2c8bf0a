/*
 * Fresh-numbers keys against independent references, 100 seeds each: for every draw, the
 * reference computed here from the drawn numbers must lie within the question's tolerance of the
 * engine's key (it is graded correct), and in fact much closer.
 */
import type { FreshNumbersQuestion, Quantity } from './definition';
import { drawFresh, questionSeed } from './draw';
import { gradeResponse } from './grade';

interface Psychrolib {
  SI: number;
  SetUnitSystem(system: number): void;
  GetHumRatioFromRelHum(tC: number, rh: number, pPa: number): number;
  GetMoistAirDensity(tC: number, w: number, pPa: number): number;
}
const psychrolib: Psychrolib = require('psychrolib');
psychrolib.SetUnitSystem(psychrolib.SI);

const SEEDS = Array.from({ length: 100 }, (_, i) => questionSeed(20_000 + i, 'reference'));
const quantity = (inputs: Record<string, unknown>, name: string) => inputs[name] as Quantity;

function fresh(partial: Pick<FreshNumbersQuestion, 'calculator' | 'output' | 'answerUnit' | 'inputs'>): FreshNumbersQuestion {
  return { id: 'reference', kind: 'fresh', points: 2, stem: '', explanation: '', tolerance: { kind: 'relative', percent: 1 }, ...partial };
}

describe('fresh-numbers keys against independent references (100 seeds each)', () => {
  it('air density (air-density, CIPM-2007) against psychrolib (ASHRAE Handbook — Fundamentals psychrometrics)', () => {
    const q = fresh({
      calculator: 'air-density',
      output: 'density',
      answerUnit: 'kg/m^3',
      inputs: {
        temperature: { from: 60, to: 80, step: 1, unit: 'degF' },
        pressure: { from: 950, to: 1050, step: 1, unit: 'hPa' },
        relativeHumidity: { from: 20, to: 80, step: 5, unit: '%' },
      },
    });
    for (const seed of SEEDS) {
      const draw = drawFresh(q, seed);
      // °F → °C: t/°C = (t/°F − 32)/1.8 (NIST SP 811 B.9); hPa → Pa: × 100 (SI prefix).
      const tC = (quantity(draw.inputs, 'temperature').value - 32) / 1.8;
      const pPa = quantity(draw.inputs, 'pressure').value * 100;
      const rh = quantity(draw.inputs, 'relativeHumidity').value / 100;
      // psychrolib 1.1.1 (ASHRAE Handbook — Fundamentals 2017, ch. 1, eqs. 22 and 11): ideal-gas moist air.
      const reference = psychrolib.GetMoistAirDensity(tC, psychrolib.GetHumRatioFromRelHum(tC, rh, pPa), pPa);
      // CIPM-2007 sits 0 … +0.05 % above the ideal-gas mixture here (shared/airflow/moist-air.spec.ts).
      expect(draw.key.value / reference - 1).toBeGreaterThanOrEqual(0);
      expect(draw.key.value / reference - 1).toBeLessThan(5e-4);
      expect(draw.warnings).toEqual([]);
      expect(gradeResponse(q, { value: reference, unit: 'kg/m^3' }, { key: draw.key }).status).toBe('correct');
    }
  });

  it('flow at another test pressure against the square-root law written out here', () => {
    const q = fresh({
      calculator: 'flow-at-test-pressure',
      output: 'flow',
      answerUnit: 'cfm',
      inputs: {
        flow: { from: 120, to: 260, step: 1, unit: 'cfm' },
        fromPressureDrop: { from: 10, to: 14, step: 0.5, unit: 'inH2O' },
        toPressureDrop: { value: 28, unit: 'inH2O' },
      },
    });
    for (const seed of SEEDS) {
      const draw = drawFresh(q, seed);
      const q1 = quantity(draw.inputs, 'flow').value;
      const dp1 = quantity(draw.inputs, 'fromPressureDrop').value;
      const dp2 = quantity(draw.inputs, 'toPressureDrop').value;
      // Orifice equation Q = C_d·A·√(2Δp/ρ) with C_d, A and ρ unchanged (ISO 5167-1:2003 §5.1; any fluid-mechanics textbook): Q₂ = Q₁·√(Δp₂/Δp₁).
      const reference = q1 * Math.sqrt(dp2 / dp1);
      expect(Math.abs(draw.key.value / reference - 1)).toBeLessThan(1e-12);
      expect(gradeResponse(q, { value: reference, unit: 'cfm' }, { key: draw.key }).status).toBe('correct');
    }
  });

  it('mass flow against ṁ = ρQ written out here', () => {
    const q = fresh({
      calculator: 'mass-flow',
      output: 'massFlow',
      answerUnit: 'lb/min',
      inputs: {
        volumeFlow: { from: 150, to: 600, step: 5, unit: 'cfm' },
        density: { from: 1.1, to: 1.25, step: 0.01, unit: 'kg/m^3' },
      },
    });
    for (const seed of SEEDS) {
      const draw = drawFresh(q, seed);
      // NIST SP 811 B.8: 1 ft³ = 0.028 316 846 592 m³ (exact); 1 lb = 0.453 592 37 kg (exact).
      const qM3s = (quantity(draw.inputs, 'volumeFlow').value * 0.028316846592) / 60;
      const rho = quantity(draw.inputs, 'density').value;
      // Mass flow is density times volume flow, ṁ = ρ·Q (continuity; e.g. Heywood, Internal Combustion Engine Fundamentals, §2.10, from memory).
      const referenceLbMin = ((rho * qM3s) / 0.45359237) * 60;
      expect(Math.abs(draw.key.value / referenceLbMin - 1)).toBeLessThan(1e-12);
      expect(gradeResponse(q, { value: referenceLbMin, unit: 'lb/min' }, { key: draw.key }).status).toBe('correct');
    }
  });
});

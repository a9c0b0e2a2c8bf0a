import * as fc from 'fast-check';
import { describeCalculator, evaluate } from '../index';
import type { InputValue } from '../index';
import { out, q, run } from './run-calculator.spec-support';

// The lesson 7 car (content/lessons/07-forced-induction.md): 2.0 L four-cylinder, 15 psi boost at
// 14.7 psi ambient, 48.0 °C after the intercooler, 117.2 °C at the compressor outlet.
const car: Record<string, InputValue> = {
  manifoldPressure: q(29.7, 'psi'), intakeAirTemperature: q(48, 'degC'), volumetricEfficiency: q(90, '%'),
  displacement: q(2.0, 'L'), engineSpeed: q(6000, 'rpm'),
};
const fields = (r: { warnings: { field: string }[] }) => r.warnings.map((w) => w.field);

describe('speed-density: reference values', () => {
  it('manifold density and mass flow by hand', () => {
    const r = run('speed-density', car);
    // by hand: p = 29.7 × 6894.757 = 204 774.3 Pa; R_d = 8.314 472/0.028 965 46 = 287.0478 J/(kg·K) (CIPM-2007 constants);
    // ρ = 204 774.3 / (287.0478 × 321.15) = 2.221 33 kg/m³; ṁ = 0.9 × 2.221 33 × 0.002 × 100 / 2 = 0.199 920 kg/s
    expect(out(r, 'manifoldDensity')).toBeCloseTo(2.22133, 4);
    expect(out(r, 'massFlow')).toBeCloseTo(0.19992, 5);
    expect(r.warnings).toEqual([]);
  });

  it('an IAT sensor before the intercooler (117 °C instead of 48 °C) is a 1.215× density error', () => {
    const after = run('speed-density', car);
    const before = run('speed-density', { ...car, intakeAirTemperature: q(117, 'degC') });
    // course-review-1 §2 G6: 117 °C instead of 48 °C gives a 1.215× density error (ρ_man = MAP/(R·IAT));
    // by hand: (117 + 273.15)/(48 + 273.15) = 390.15/321.15 = 1.214 85
    expect(out(after, 'manifoldDensity') / out(before, 'manifoldDensity')).toBeCloseTo(1.215, 3);
    expect(out(after, 'massFlow') / out(before, 'massFlow')).toBeCloseTo(390.15 / 321.15, 12);
  });

  it('bench to mass-air sensor: 270.4 cfm × 1.18 kg/m³ = 150.6 g/s', () => {
    const r = run('speed-density', { ...car, benchFlow: q(270.4, 'cfm'), benchDensity: q(1.18, 'kg/m^3'), sensorReading: q(148, 'g/s') },
      { benchMassFlow: 'g/s', sensorDifference: '%' });
    // course-review-1 §2 G6 (from lesson 8's example): 270.4 cfm × 1.18 kg/m³ = 150.6 g/s
    expect(out(r, 'benchMassFlow')).toBeCloseTo(150.6, 1);
    // by hand: 270.4 × 4.719 474e-4 = 0.127 615 m³/s × 1.18 = 0.150 586 kg/s; 148/150.586 − 1 = −1.717 %
    expect(out(r, 'benchMassFlow')).toBeCloseTo(150.586, 2);
    expect(out(r, 'sensorDifference')).toBeCloseTo(-1.717, 2);
    expect(r.notes.join(' ')).toMatch(/pulsing and reverse flow/);
  });

  it('compares the sensor with the speed-density figure when there is no bench flow', () => {
    const r = run('speed-density', { ...car, sensorReading: q(195, 'g/s') });
    // by hand: 0.195 / 0.199 920 − 1 = −2.461 %
    expect(out(r, 'sensorDifference')).toBeCloseTo(-2.461, 2);
  });

  it('agrees with engine-demand at the manifold density and with air-density (ideal gas, dry)', () => {
    const sd = run('speed-density', car);
    const rho = out(sd, 'manifoldDensity');
    const air = run('air-density', { temperature: q(48, 'degC'), pressure: q(29.7, 'psi'), relativeHumidity: 0, method: 'ideal-dry' });
    expect(out(air, 'density')).toBeCloseTo(rho, 12);
    const demand = run('engine-demand', { displacement: q(2.0, 'L'), speed: q(6000, 'rpm'), volumetricEfficiency: q(90, '%'), density: q(rho, 'kg/m^3') });
    expect(out(demand, 'massFlow')).toBeCloseTo(out(sd, 'massFlow'), 12);
  });

  it('warns on a VE over 120 % and asks for the bench density', () => {
    expect(fields(run('speed-density', { ...car, volumetricEfficiency: q(150, '%') }))).toEqual(['volumetricEfficiency']);
    const outcome = evaluate('speed-density', { inputs: { ...car, benchFlow: q(270.4, 'cfm') } });
    expect(outcome.ok ? [] : outcome.errors.map((e) => e.field)).toEqual(['benchDensity']);
    expect(fields(run('speed-density', { ...car, benchDensity: q(1.18, 'kg/m^3') }))).toEqual(['benchDensity']);
  });

  it('carries the charge-air hazard', () => {
    expect(describeCalculator('speed-density')?.hazard).toMatch(/licensed practice/);
  });
});

describe('speed-density: properties', () => {
  it('mass flow is proportional to MAP and inversely to absolute IAT', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 300, noNaN: true }),
        fc.double({ min: 250, max: 450, noNaN: true }),
        fc.double({ min: 1.1, max: 3, noNaN: true }),
        (kpa, kelvin, k) => {
          const m = (p: number, t: number) =>
            out(run('speed-density', { ...car, manifoldPressure: q(p, 'kPa'), intakeAirTemperature: q(t, 'K') }), 'massFlow');
          expect(m(k * kpa, kelvin) / m(kpa, kelvin)).toBeCloseTo(k, 9);
          expect(m(kpa, k * kelvin) / m(kpa, kelvin)).toBeCloseTo(1 / k, 9);
        },
      ),
      { numRuns: 50 },
    );
  });
});

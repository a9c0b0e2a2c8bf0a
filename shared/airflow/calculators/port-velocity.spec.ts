import * as fc from 'fast-check';
import { convert, describeCalculator } from '../index';
import { out, q, run } from './run-calculator.spec-support';

const bench = { testPressure: q(28, 'inH2O'), density: q(1.2, 'kg/m^3') };
const fields = (r: { warnings: { field: string }[] }) => r.warnings.map((w) => w.field);

describe('port-velocity: reference values', () => {
  it('the ideal velocity at 28 inH2O and 1.2 kg/m³ is 107.8 m/s = 354 ft/s', () => {
    const r = run('port-velocity', bench, { idealVelocity: 'ft/s' });
    // course-review-1 §2 G2 (Bernoulli): √(2Δp/ρ) = 107.8 m/s = 354 ft/s at 28 inH2O and 1.2 kg/m³
    expect(out(r, 'idealVelocity')).toBeCloseTo(354, 0);
    // by hand: 28 × 249.0889 Pa = 6974.489 Pa; √(2 × 6974.489 / 1.2) = 107.8153 m/s; ÷ 0.3048 = 353.725 ft/s
    expect(out(r, 'idealVelocity')).toBeCloseTo(353.725, 2);
    expect(out(run('port-velocity', bench), 'idealVelocity')).toBeCloseTo(107.8153, 3);
  });

  it('mean velocity, its share of ideal and the effective area by hand', () => {
    const r = run('port-velocity', { ...bench, flow: q(160, 'cfm'), sectionArea: q(1.3, 'in^2') },
      { meanVelocity: 'ft/s', effectiveArea: 'in^2' });
    // shop common practice: cfm per square inch × 2.4 = ft/s (1 ft³/min per in² = 144 ft/min); 160/1.3 × 2.4 = 295.385 ft/s
    expect(out(r, 'meanVelocity')).toBeCloseTo(295.385, 2);
    // by hand: 295.385 / 353.725 = 83.507 %
    expect(out(r, 'velocityRatio')).toBeCloseTo(83.507, 2);
    // by hand: Q = 160 × 4.719474e-4 = 0.07551158 m³/s; A_e = 0.07551158 / 107.8153 = 7.00378e-4 m² = 1.08559 in²
    expect(out(r, 'effectiveArea')).toBeCloseTo(1.08559, 4);
    expect(r.warnings).toEqual([]);
  });

  it('a pitot-static probe reading 18 inH2O means 86.44 m/s', () => {
    const r = run('port-velocity', { ...bench, velocityPressure: q(18, 'inH2O') });
    // by hand: 18 × 249.0889 = 4483.600 Pa; √(2 × 4483.600 / 1.2) = 86.4446 m/s
    expect(out(r, 'probeVelocity')).toBeCloseTo(86.4446, 3);
  });

  it('a probe reading the whole test pressure reads the ideal velocity', () => {
    const r = run('port-velocity', { ...bench, velocityPressure: q(28, 'inH2O') });
    expect(out(r, 'probeVelocity')).toBeCloseTo(out(r, 'idealVelocity'), 10);
  });

  it('minimum area from peak flow and target speed, with its caveat as a note', () => {
    const r = run('port-velocity', { ...bench, peakFlow: q(160, 'cfm'), targetVelocity: q(260, 'ft/s') }, { minimumArea: 'in^2' });
    // by hand: (160/60 ft³/s) / 260 ft/s = 0.0102564 ft² × 144 = 1.47692 in²
    expect(out(r, 'minimumArea')).toBeCloseTo(1.47692, 4);
    expect(r.notes.join(' ')).toMatch(/starting figure.*not a design/);
  });

  it('leaves out what it cannot compute and says why', () => {
    const r = run('port-velocity', { ...bench, sectionArea: q(1.3, 'in^2'), peakFlow: q(160, 'cfm') });
    expect(Object.keys(r.outputs)).toEqual(['idealVelocity']);
    expect(fields(r)).toEqual(['sectionArea', 'targetVelocity']);
  });

  it('warns when the section or probe beats the ideal speed, or the air is squeezed', () => {
    expect(fields(run('port-velocity', { ...bench, flow: q(160, 'cfm'), sectionArea: q(0.9, 'in^2') }))).toEqual(['sectionArea']);
    expect(fields(run('port-velocity', { ...bench, velocityPressure: q(30, 'inH2O') }))).toEqual(['velocityPressure']);
    expect(fields(run('port-velocity', { ...bench, testPressure: q(80, 'inH2O') }))).toEqual(['testPressure']);
  });

  it('is a bench calculator with the suction hazard', () => {
    expect(describeCalculator('port-velocity')?.hazard).toMatch(/inlet.*instructions/);
  });
});

describe('port-velocity: properties', () => {
  it('the ideal velocity rises with the square root of the test pressure', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 60, noNaN: true }), fc.double({ min: 1.1, max: 4, noNaN: true }), (dp, k) => {
        const at = (p: number) => out(run('port-velocity', { testPressure: q(p, 'inH2O'), density: q(1.2, 'kg/m^3') }), 'idealVelocity');
        expect(at(dp * k) / at(dp)).toBeCloseTo(Math.sqrt(k), 9);
      }),
      { numRuns: 50 },
    );
  });

  it('mean over ideal velocity is the effective area over the section area', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 500, noNaN: true }), fc.double({ min: 0.5, max: 5, noNaN: true }), (cfm, in2) => {
        const r = run('port-velocity', { ...bench, flow: q(cfm, 'cfm'), sectionArea: q(in2, 'in^2') });
        const areaSi = convert(in2, 'in^2', 'm^2');
        expect(out(r, 'velocityRatio') / 100).toBeCloseTo(out(r, 'effectiveArea') / areaSi, 10);
      }),
      { numRuns: 50 },
    );
  });
});

/* E13 (course-review-1): the orifice's discharge coefficient is below 1 only when referred to its bore. */
import { describeCalculator, evaluate } from '../index';
import type { InputValue } from '../index';
import { out, q, run } from './run-calculator.spec-support';

const known: Record<string, InputValue> = { diameter: q(50, 'mm'), pressureDrop: q(1000, 'Pa'), density: q(1.2, 'kg/m^3') };
const refusedFields = (inputs: Record<string, InputValue>) => {
  const outcome = evaluate('orifice-flow', { inputs });
  return outcome.ok ? [] : outcome.errors.map((e) => e.field);
};

describe('orifice-flow discharge coefficient (E13)', () => {
  it('says "below 1 for an orifice referred to its bore"', () => {
    const help = describeCalculator('orifice-flow')?.inputs.find((i) => i.name === 'dischargeCoefficient')?.help;
    expect(help).toMatch(/below 1 for an orifice referred to its bore/);
  });

  it('accepts a flow coefficient above 1 with a warning that says when that is legitimate', () => {
    // ISO 5167-1: the flow coefficient is C/√(1−β⁴); with C = 0.6 and β = 0.9 it is 0.6/√(1 − 0.6561) = 1.0231
    const flowCoefficient = 0.6 / Math.sqrt(1 - 0.9 ** 4);
    expect(flowCoefficient).toBeCloseTo(1.0231, 4);
    const r = run('orifice-flow', { ...known, dischargeCoefficient: flowCoefficient });
    // by hand: Q = 1.0231 × 1.963 495e-3 m² × √(2 × 1000/1.2) = 1.0231 × 1.963 495e-3 × 40.824 83 = 0.082 011 m³/s
    expect(out(r, 'volumeFlow')).toBeCloseTo(flowCoefficient * 1.963495e-3 * 40.82483, 7);
    expect(r.warnings.map((w) => w.field)).toEqual(['dischargeCoefficient']);
    expect(r.warnings[0]?.message).toMatch(/approach speed.*ISO 5167-1/);
  });

  it('takes 1 without a warning, and refuses zero, negative values and values above 1.5', () => {
    expect(run('orifice-flow', { ...known, dischargeCoefficient: 1 }).warnings).toEqual([]);
    for (const bad of [0, -0.1, 1.6]) expect(refusedFields({ ...known, dischargeCoefficient: bad })).toEqual(['dischargeCoefficient']);
    expect(refusedFields({ ...known, dischargeCoefficient: 1.5 })).toEqual([]);
  });

  it('warns when a coefficient solved from a flow comes out above 1', () => {
    // by hand: C_d = 0.06 / (1.963 495e-3 × 40.824 83) = 0.7485; twice that flow gives 1.497
    const r = run('orifice-flow', { ...known, solveFor: 'dischargeCoefficient', volumeFlow: q(0.12, 'm^3/s') });
    expect(out(r, 'dischargeCoefficient')).toBeCloseTo(0.12 / (1.963495e-3 * 40.82483), 4);
    expect(r.warnings.map((w) => w.field)).toEqual(['']);
    expect(r.warnings[0]?.message).toMatch(/^The discharge coefficient comes out at 1\.5, which is above 1/);
  });
});

/*
 * Worked steps for the loss-free jet at the bench's test pressure, shared by the port-velocity
 * and discharge-coefficient calculators so both show the same figures in the same words.
 */
import type { ComputeContext } from '../define';
import { idealVelocity, INCOMPRESSIBLE_LIMIT_PA } from '../flow';
import { qty } from '../latex';

type Ctx = ComputeContext<string>;

/** v_i = √(2Δp/ρ) as a step, with the warning above the incompressible limit on `testPressure`. */
export function idealVelocityStep(ctx: Ctx, testPressurePa: number, densityKgM3: number): number {
  const vi = idealVelocity(testPressurePa, densityKgM3);
  ctx.step('Ideal velocity: the test pressure turned fully into speed (Bernoulli)',
    'v_{i} = \\sqrt{\\frac{2\\,\\Delta p}{\\rho}}',
    `v_{i} = \\sqrt{\\frac{2 \\times ${qty(testPressurePa, 'Pa')}}{${qty(densityKgM3, 'kg/m^3')}}}`,
    `v_{i} = ${qty(vi, 'm/s')}`);
  if (testPressurePa > INCOMPRESSIBLE_LIMIT_PA) {
    ctx.warn('testPressure', 'Above about 15 kPa (60 inH2O) the air is squeezed noticeably; these incompressible figures lose accuracy.');
  }
  return vi;
}

/** A_e = Q / v_i as a step: the hole a perfect nozzle would need to pass the same flow. */
export function effectiveAreaStep(ctx: Ctx, flowM3s: number, idealVelocityMs: number): number {
  const ae = flowM3s / idealVelocityMs;
  ctx.step('Effective area: the flow divided by the ideal velocity',
    'A_{e} = \\frac{Q}{v_{i}}',
    `A_{e} = \\frac{${qty(flowM3s, 'm^3/s')}}{${qty(idealVelocityMs, 'm/s')}}`,
    `A_{e} = ${qty(ae, 'm^2')}`);
  return ae;
}

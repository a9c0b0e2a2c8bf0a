/*
 * Port velocity (review gap G2). Bernoulli, incompressible, as the rest of the bench maths:
 * - ideal velocity at the test pressure v_i = √(2 Δp / ρ), the speed of a loss-free jet;
 * - mean velocity at a section v̄ = Q / A (flow per unit area), and how close it comes to v_i;
 * - effective area A_e = Q / v_i, the hole a perfect nozzle would need to pass the same flow;
 * - a pitot-static probe: v = √(2 q / ρ) from its velocity pressure q;
 * - a first port size from demand: A_min = Q_peak / v_target.
 * The air at the port's narrowest section is thinner than the room air, by about Δp/(κp) (some
 * 5 % at 28 inH2O, isentropic): the room density is used throughout, as the bench's own figures
 * are referred to it.
 */
import { bound, defineCalculator } from '../define';
import { idealVelocity } from '../flow';
import { num, qty } from '../latex';
import { density, pressureDrop, volumeFlow } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';
import { effectiveAreaStep, idealVelocityStep } from './jet-steps';

export const portVelocity = defineCalculator({
  id: 'port-velocity',
  title: 'Port velocity, effective area and pitot probe',
  topic: 'Flow',
  summary:
    'Air speeds in a port on the bench: the ideal speed the test pressure can give (v = √(2Δp/ρ)), the mean speed through a section (Q/A) and how close it comes to ideal, the effective area, the speed a pitot-static probe reads, and a first minimum port area from peak flow and a target speed.',
  hazard: BENCH_SUCTION_HAZARD,
  inputs: {
    testPressure: {
      ...pressureDrop('Test pressure', '\\Delta p', { value: 28, unit: 'inH2O' },
        'The pressure drop the bench holds across the part. 28 inH2O is a common shop choice for heads, not a standard.'),
      // 7 kPa: the metric round figure for a 28 inH2O test pressure (shop common practice).
      exampleSi: { value: 7, unit: 'kPa' },
    },
    density: density('Air density', { value: 1.2, unit: 'kg/m^3' },
      'Density of the room air the bench draws in; the air-density calculator gives it. The air in the port is a few percent thinner; the room figure is near enough here.'),
    flow: {
      ...volumeFlow('Bench flow', 'Q', { value: 160, unit: 'cfm' },
        'The flow the bench reads at this test pressure. Gives the effective area, and with a section area the mean speed.'),
      exampleSi: { value: 75, unit: 'L/s' },
      optional: true,
    },
    sectionArea: {
      label: 'Section area',
      symbol: 'A',
      kind: 'area',
      optional: true,
      min: bound(0, 'm^2', false),
      example: { value: 1.3, unit: 'in^2' },
      exampleSi: { value: 8.4, unit: 'cm^2' },
      help: 'Cross-section of the port where you want the mean speed, often the smallest (the throat or the pinch at the pushrod). Measure it or take it from a mould.',
    },
    velocityPressure: {
      ...pressureDrop('Probe velocity pressure', 'q', { value: 18, unit: 'inH2O' },
        'From a pitot-static probe at one point in the port: the difference between its total and static openings, read on one manometer.'),
      exampleSi: { value: 4.5, unit: 'kPa' },
      optional: true,
    },
    peakFlow: {
      ...volumeFlow('Peak flow the port must pass', 'Q_{peak}', { value: 160, unit: 'cfm' },
        'For sizing: one cylinder\'s demand while its valve is open, as in the volume-flow lesson (the mean demand of one cylinder × 720 / intake duration in degrees).'),
      exampleSi: { value: 75, unit: 'L/s' },
      optional: true,
    },
    targetVelocity: {
      label: 'Target mean speed',
      symbol: 'v_{t}',
      kind: 'velocity',
      optional: true,
      min: bound(0, 'm/s', false),
      example: { value: 260, unit: 'ft/s' },
      exampleSi: { value: 80, unit: 'm/s' },
      help: 'The mean speed you want at the smallest section at peak flow. It is a choice from experience, not a law: the example\'s 260 ft/s (about 80 m/s) is only a round starting figure.',
    },
  },
  outputs: {
    idealVelocity: { label: 'Ideal velocity at the test pressure', symbol: 'v_{i}', kind: 'velocity', us: 'ft/s', help: '√(2Δp/ρ): a loss-free jet.' },
    meanVelocity: { label: 'Mean velocity through the section', symbol: '\\bar v', kind: 'velocity', us: 'ft/s', help: 'Q/A. In shop units, cfm per square inch × 2.4 gives ft/s.' },
    velocityRatio: { label: 'Mean over ideal velocity', symbol: '\\bar v/v_{i}', kind: 'percent', us: '%' },
    effectiveArea: { label: 'Effective area', symbol: 'A_{e}', kind: 'area', us: 'in^2', help: 'Q/v_i: the hole a perfect nozzle would need to pass this flow.' },
    probeVelocity: { label: 'Velocity at the probe', symbol: 'v_{p}', kind: 'velocity', us: 'ft/s' },
    minimumArea: { label: 'Minimum section area for the target speed', symbol: 'A_{min}', kind: 'area', us: 'in^2' },
  },
  compute(ctx) {
    const dp = ctx.value('testPressure');
    const rho = ctx.value('density');
    const vi = idealVelocityStep(ctx, dp, rho);
    const result: { idealVelocity: number; meanVelocity?: number; velocityRatio?: number; effectiveArea?: number; probeVelocity?: number; minimumArea?: number } = { idealVelocity: vi };

    if (ctx.has('flow')) {
      const q = ctx.value('flow');
      result.effectiveArea = effectiveAreaStep(ctx, q, vi);
      if (ctx.has('sectionArea')) {
        const a = ctx.value('sectionArea');
        const vm = q / a;
        const ratio = vm / vi;
        ctx.step('Mean velocity through the section (flow per unit area)',
          '\\bar v = \\frac{Q}{A}',
          `\\bar v = \\frac{${qty(q, 'm^3/s')}}{${qty(a, 'm^2')}}`,
          `\\bar v = ${qty(vm, 'm/s')}`);
        ctx.step('How close the section comes to the ideal velocity',
          '\\frac{\\bar v}{v_{i}} = \\frac{A_{e}}{A}',
          `\\frac{\\bar v}{v_{i}} = \\frac{${qty(vm, 'm/s')}}{${qty(vi, 'm/s')}}`,
          `\\frac{\\bar v}{v_{i}} = ${num(ratio)} = ${num(ratio * 100, 4)}\\,\\%`);
        if (ratio > 1) {
          ctx.warn('sectionArea', 'The mean speed comes out above the ideal speed. Check the area and the flow; it is only possible where the pressure recovers after this section (a widening port).');
        }
        result.meanVelocity = vm;
        result.velocityRatio = ratio;
      }
    } else if (ctx.has('sectionArea')) {
      ctx.warn('sectionArea', 'The mean speed needs the bench flow too; the section area is not used.');
    }

    if (ctx.has('velocityPressure')) {
      const qp = ctx.value('velocityPressure');
      const vp = idealVelocity(qp, rho);
      ctx.step('Pitot-static probe: its velocity pressure turned into speed',
        'v_{p} = \\sqrt{\\frac{2\\,q}{\\rho}}',
        `v_{p} = \\sqrt{\\frac{2 \\times ${qty(qp, 'Pa')}}{${qty(rho, 'kg/m^3')}}}`,
        `v_{p} = ${qty(vp, 'm/s')}`);
      if (qp > dp) {
        ctx.warn('velocityPressure', 'The probe reads more than the test pressure. Check the probe\'s hoses and zero; it is only possible where the pressure recovers downstream.');
      }
      result.probeVelocity = vp;
    }

    if (ctx.has('peakFlow') && ctx.has('targetVelocity')) {
      const qPeak = ctx.value('peakFlow');
      const vt = ctx.value('targetVelocity');
      const aMin = qPeak / vt;
      ctx.step('Smallest section that keeps the peak flow at the target speed',
        'A_{min} = \\frac{Q_{peak}}{v_{t}}',
        `A_{min} = \\frac{${qty(qPeak, 'm^3/s')}}{${qty(vt, 'm/s')}}`,
        `A_{min} = ${qty(aMin, 'm^2')}`);
      ctx.note('The minimum area is a starting figure for a port, not a design: cam timing, the runner, the valve and the engine\'s use all move the best size.');
      result.minimumArea = aMin;
    } else if (ctx.has('peakFlow') || ctx.has('targetVelocity')) {
      ctx.warn(ctx.has('peakFlow') ? 'targetVelocity' : 'peakFlow', 'The minimum area needs both the peak flow and the target speed.');
    }
    return result;
  },
});

/*
 * Discharge coefficient of a valve and port (review gap G4): C_d = Q / (A_ref √(2 Δp / ρ)), the
 * bench flow over the flow of a loss-free jet through a chosen reference area (Heywood, Internal
 * Combustion Engine Fundamentals, §6.3, from memory). Reference areas:
 * - inner seat πd²/4 (d the valve or inner seat diameter);
 * - curtain πdL (the side of the cylinder between valve and seat at lift L);
 * - port throat πd_t²/4.
 * Curtain and inner seat are equal at L/d = 0.25. A reference that is not the smallest section
 * the air must cross at that lift can give C_d above 1, which is allowed (see ISO 5167-1 on the
 * discharge coefficient C against the flow coefficient).
 */
import { bound, defineCalculator } from '../define';
import { circleArea } from '../flow';
import { num, qty } from '../latex';
import { density, pressureDrop, volumeFlow } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';
import { effectiveAreaStep, idealVelocityStep } from './jet-steps';

/** Above this C_d the figures are more likely wrong than a generous reference area (our choice). */
const IMPLAUSIBLE_CD = 1.5;
/** Lifts beyond this share of the valve diameter are rare in engines (our warning limit). */
const LARGE_LIFT_RATIO = 0.5;

type Reference = 'inner-seat' | 'curtain' | 'throat';

export const dischargeCoefficient = defineCalculator({
  id: 'discharge-coefficient',
  title: 'Discharge coefficient of a valve and port',
  topic: 'Flow',
  summary:
    'How well a valve and port use their size: the bench flow over the flow of a perfect jet through a reference area (C_d = Q/(A·√(2Δp/ρ))), with the inner seat, the valve curtain or the port throat as reference, and the lift as L/D. Lets you compare heads with different valve sizes.',
  hazard: BENCH_SUCTION_HAZARD,
  inputs: {
    flow: {
      ...volumeFlow('Bench flow', 'Q', { value: 160, unit: 'cfm' },
        'The flow the bench reads for the valve and port at this lift and test pressure.'),
      exampleSi: { value: 75, unit: 'L/s' },
    },
    testPressure: {
      ...pressureDrop('Test pressure', '\\Delta p', { value: 28, unit: 'inH2O' },
        'The pressure drop the bench holds across the head. 28 inH2O is a common shop choice for heads, not a standard.'),
      // 7 kPa: the metric round figure for a 28 inH2O test pressure (shop common practice).
      exampleSi: { value: 7, unit: 'kPa' },
    },
    density: density('Air density', { value: 1.2, unit: 'kg/m^3' },
      'Density of the room air the bench draws in; the air-density calculator gives it.'),
    referenceArea: {
      label: 'Reference area',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'inner-seat',
      options: [
        { value: 'inner-seat', label: 'Inner seat: πd²/4', help: 'The usual choice for comparing heads: the round hole of the valve seat.' },
        { value: 'curtain', label: 'Valve curtain: πdL', help: 'The side of the cylinder between valve and seat at this lift; the smallest area at low lift.' },
        { value: 'throat', label: 'Port throat: πd_t²/4', help: 'The narrowest round section of the port just above the seat; needs the throat diameter.' },
      ],
      example: 'inner-seat',
      help: 'Which area the coefficient is referred to. Use the same one for every head you compare, and write it on the lab sheet.',
    },
    valveDiameter: {
      label: 'Valve diameter',
      symbol: 'd',
      kind: 'length',
      min: bound(0, 'm', false),
      example: { value: 1.5, unit: 'in' },
      exampleSi: { value: 38, unit: 'mm' },
      help: 'Shops use the inner seat diameter or the valve head diameter. Either works if you say which and keep to it.',
    },
    lift: {
      label: 'Valve lift',
      symbol: 'L',
      kind: 'length',
      min: bound(0, 'm', false),
      example: { value: 0.375, unit: 'in' },
      exampleSi: { value: 9.5, unit: 'mm' },
      help: 'How far the valve is off its seat for this reading, from a dial indicator.',
    },
    throatDiameter: {
      label: 'Throat diameter',
      symbol: 'd_{t}',
      kind: 'length',
      optional: true,
      min: bound(0, 'm', false),
      help: 'Only for the throat reference: the narrowest diameter of the port just above the seat, often 85–90 % of the valve diameter.',
    },
  },
  outputs: {
    area: { label: 'Reference area', symbol: 'A_{ref}', kind: 'area', us: 'in^2' },
    idealVelocity: { label: 'Ideal velocity at the test pressure', symbol: 'v_{i}', kind: 'velocity', us: 'ft/s' },
    dischargeCoefficient: { label: 'Discharge coefficient', symbol: 'C_{d}', kind: 'ratio', us: '' },
    liftOverDiameter: { label: 'Lift over diameter', symbol: 'L/d', kind: 'ratio', us: '' },
    effectiveArea: { label: 'Effective area', symbol: 'A_{e}', kind: 'area', us: 'in^2', help: 'C_d × A_ref = Q/v_i: the hole a perfect nozzle would need to pass this flow.' },
  },
  compute(ctx) {
    const q = ctx.value('flow');
    const dp = ctx.value('testPressure');
    const rho = ctx.value('density');
    const d = ctx.value('valveDiameter');
    const lift = ctx.value('lift');
    const reference = ctx.option('referenceArea') as Reference;

    let area: number;
    if (reference === 'curtain') {
      area = Math.PI * d * lift;
      ctx.step('Reference area: the valve curtain', 'A_{ref} = \\pi\\,d\\,L',
        `A_{ref} = \\pi \\times ${qty(d, 'm')} \\times ${qty(lift, 'm')}`, `A_{ref} = ${qty(area, 'm^2')}`);
    } else if (reference === 'throat') {
      if (!ctx.has('throatDiameter')) ctx.fail('throatDiameter', 'The throat reference needs the throat diameter.');
      const dt = ctx.value('throatDiameter');
      if (dt > d) ctx.warn('throatDiameter', 'The throat is wider than the valve. Check both diameters.');
      area = circleArea(dt);
      ctx.step('Reference area: the port throat', 'A_{ref} = \\frac{\\pi d_{t}^2}{4}',
        `A_{ref} = \\frac{\\pi \\times (${qty(dt, 'm')})^2}{4}`, `A_{ref} = ${qty(area, 'm^2')}`);
    } else {
      area = circleArea(d);
      ctx.step('Reference area: the inner seat', 'A_{ref} = \\frac{\\pi d^2}{4}',
        `A_{ref} = \\frac{\\pi \\times (${qty(d, 'm')})^2}{4}`, `A_{ref} = ${qty(area, 'm^2')}`);
    }
    if (reference !== 'throat' && ctx.has('throatDiameter')) {
      ctx.warn('throatDiameter', 'The throat diameter is only used with the throat reference.');
    }

    const vi = idealVelocityStep(ctx, dp, rho);
    const effectiveArea = effectiveAreaStep(ctx, q, vi);
    const cd = effectiveArea / area;
    ctx.step('Discharge coefficient: effective area over reference area',
      'C_{d} = \\frac{Q}{A_{ref}\\sqrt{2\\,\\Delta p/\\rho}} = \\frac{A_{e}}{A_{ref}}',
      `C_{d} = \\frac{${qty(effectiveArea, 'm^2')}}{${qty(area, 'm^2')}}`, `C_{d} = ${num(cd, 4)}`);
    const ld = lift / d;
    ctx.step('Lift as a share of the valve diameter', '\\frac{L}{d}', `\\frac{L}{d} = \\frac{${qty(lift, 'm')}}{${qty(d, 'm')}}`, `\\frac{L}{d} = ${num(ld, 4)}`);

    if (cd > IMPLAUSIBLE_CD) {
      ctx.warn('flow', `A coefficient of ${Number(cd.toPrecision(3))} is far above 1. Check the flow, the diameters, the lift and the test pressure.`);
    } else if (cd > 1) {
      ctx.note('The coefficient is above 1: the part passes more air than a perfect jet through the reference area. That is allowed when the reference is an agreed area, such as the curtain or the throat, and not the smallest section all the air must cross at this lift. It also happens when the pressure recovers after the smallest section. Check the inputs all the same.');
    }
    if (ld > LARGE_LIFT_RATIO) ctx.warn('lift', 'The lift is more than half the valve diameter, which is rare. Check the lift and the diameter.');
    if (reference === 'curtain' && ld > 0.25) {
      ctx.note('Past L/d = 0.25 the curtain is larger than the seat hole, so the curtain coefficient falls with lift even while the flow still rises.');
    }
    return { area, idealVelocity: vi, dischargeCoefficient: cd, liftOverDiameter: ld, effectiveArea };
  },
});

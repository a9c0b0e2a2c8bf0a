/*
 * Power potential from air flow (review gap G3), two routes:
 * 1. Mass route (textbook): the fuel the air can burn, ṁ_f = ṁ_air / AFR, turned into power by
 *    the brake specific fuel consumption, P = ṁ_f / BSFC (Heywood §2.9 defines BSFC = ṁ_f / P,
 *    from memory). In shop units hp = ṁ[lb/min] × 60 / (AFR × BSFC[lb/(hp·h)]): 9.6 hp per
 *    lb/min at AFR 12.5 and BSFC 0.50 (the BSFC figure is shop common practice).
 * 2. Head-flow route (shop folklore, from memory): hp ≈ 0.257 × cfm at 28 inH2O × cylinders, for
 *    naturally aspirated gasoline engines with a matched cam and exhaust.
 * Both give a potential, not a prediction.
 */
import { ABOVE_ZERO_PA, bound, defineCalculator } from '../define';
import { scaleFlowToPressureDrop } from '../flow';
import { num, qty } from '../latex';
import { convert } from '../units';
import { massFlow, TEST_PRESSURE_UNITS, volumeFlow } from './common-inputs';

/** The head-flow rule: 0.257 hp per cfm at 28 inH2O, per cylinder (shop folklore, from memory). */
export const HP_PER_CFM_AT_28 = 0.257;
/** The rule's W per (m³/s). */
const HEAD_RULE_SI = convert(HP_PER_CFM_AT_28, 'hp', 'W') / convert(1, 'cfm', 'm^3/s');
const RULE_TEST_PRESSURE_PA = convert(28, 'inH2O', 'Pa');
/** A head figure within 2 % of 28 inH2O counts as taken at 28 (7 kPa is 28.1 inH2O). */
const TEST_PRESSURE_TOLERANCE = 0.02;
/** Below this BSFC no car engine goes (our warning limit, about 180 g/(kW·h)). */
const LOW_BSFC = convert(0.3, 'lb/(hp h)', 'kg/J');
/** The two routes are called far apart beyond this ratio (our choice). */
const ROUTES_APART = 0.2;

export const powerPotential = defineCalculator({
  id: 'power-potential',
  title: 'Power potential from air flow',
  topic: 'Mass flow',
  summary:
    'Roughly how much power an air flow can support: the fuel the air can burn divided by the brake specific fuel consumption (P = ṁ ÷ (AFR × BSFC)), with an optional check by the shop rule of thumb from a cylinder head\'s flow at 28 inH2O. A potential, not a prediction.',
  inputs: {
    airMassFlow: {
      ...massFlow('Air mass flow', '\\dot m_{air}', { value: 16.4, unit: 'lb/min' },
        'The air the whole engine takes in at full load, from the engine-demand or mass-flow calculators, or a mass-air sensor.'),
      exampleSi: { value: 125, unit: 'g/s' },
    },
    airFuelRatio: {
      label: 'Air–fuel ratio (by mass)',
      symbol: 'AFR',
      kind: 'ratio',
      optional: true,
      default: 12.5,
      min: bound(0, '', false),
      max: bound(100, ''),
      example: 12.5,
      help: 'Mass of air per mass of fuel at full load. Empty: 12.5, a rich full-load gasoline mixture (shop common practice).',
    },
    bsfc: {
      label: 'Brake specific fuel consumption',
      symbol: 'BSFC',
      kind: 'specificFuelConsumption',
      optional: true,
      default: { value: 0.5, unit: 'lb/(hp h)' },
      min: bound(0, 'kg/J', false),
      example: { value: 0.5, unit: 'lb/(hp h)' },
      exampleSi: { value: 300, unit: 'g/(kW h)' },
      help: 'Fuel burned per unit of work at the crank. Empty: 0.50 lb/(hp·h) (about 300 g/(kW·h)), a good full-load gasoline figure (shop common practice). A lower figure means a more efficient engine.',
    },
    headFlow: {
      ...volumeFlow('Head flow per port, for the check', 'Q_{28}', { value: 160, unit: 'cfm' },
        'Best intake flow of one port on the bench, at 28 inH2O. Gives the shop rule-of-thumb figure for comparison.'),
      exampleSi: { value: 75, unit: 'L/s' },
      optional: true,
    },
    cylinders: {
      label: 'Number of cylinders',
      symbol: 'n',
      kind: 'ratio',
      optional: true,
      min: bound(1, ''),
      max: bound(32, ''),
      example: 4,
      help: 'Cylinders of the engine, for the head-flow check.',
    },
    headFlowTestPressure: {
      label: 'Test pressure of the head flow',
      symbol: '\\Delta p_{h}',
      kind: 'pressure',
      defaultUnit: TEST_PRESSURE_UNITS,
      min: ABOVE_ZERO_PA,
      optional: true,
      default: { value: 28, unit: 'inH2O' },
      help: 'The test pressure the head flow was measured at. Empty: 28 inH2O, the pressure the rule of thumb is for. Another figure is scaled to 28 inH2O by the square-root rule.',
    },
  },
  outputs: {
    power: { label: 'Power potential (mass route)', symbol: 'P', kind: 'power', us: 'hp' },
    headFlowPower: { label: 'Power potential (head-flow rule of thumb)', symbol: 'P_{h}', kind: 'power', us: 'hp' },
  },
  compute(ctx) {
    const air = ctx.value('airMassFlow');
    const afr = ctx.value('airFuelRatio');
    const bsfc = ctx.value('bsfc');
    const fuel = air / afr;
    ctx.step(ctx.has('airFuelRatio') ? 'Fuel the air can burn' : 'Fuel the air can burn (AFR 12.5, shop common practice)',
      '\\dot m_{fuel} = \\frac{\\dot m_{air}}{AFR}',
      `\\dot m_{fuel} = \\frac{${qty(air, 'kg/s')}}{${num(afr)}}`,
      `\\dot m_{fuel} = ${qty(fuel, 'kg/s')}`);
    const power = fuel / bsfc;
    ctx.step(ctx.has('bsfc') ? 'Power from the fuel flow' : 'Power from the fuel flow (BSFC 0.50 lb/(hp·h), shop common practice)',
      'P = \\frac{\\dot m_{fuel}}{BSFC} = \\frac{\\dot m_{air}}{AFR \\cdot BSFC}',
      `P = \\frac{${qty(fuel, 'kg/s')}}{${qty(bsfc, 'kg/J')}}`,
      `P = ${qty(power, 'W')} = ${qty(convert(power, 'W', 'hp'), 'hp', 4)}`);
    const perMass = power / air;
    ctx.step('The same figures as a rule of thumb per unit of air mass flow',
      '\\frac{P}{\\dot m_{air}} = \\frac{1}{AFR \\cdot BSFC}',
      `\\frac{P}{\\dot m_{air}} = \\frac{1}{${num(afr)} \\times ${qty(bsfc, 'kg/J')}}`,
      `\\frac{P}{\\dot m_{air}} = ${qty(perMass, 'J/kg')} = ${num(convert(perMass, 'J/kg', 'hp min/lb'), 3)}\\,\\mathrm{hp\\ per\\ lb/min}`);
    if (bsfc < LOW_BSFC) ctx.warn('bsfc', 'That BSFC is lower than car engines reach. Check the figure and its unit.');
    ctx.note('This is a potential, not a prediction. An engine gets there only with a good BSFC and a cam, intake and exhaust matched to its heads.');

    const result: { power: number; headFlowPower?: number } = { power };
    if (ctx.has('headFlow')) {
      if (!ctx.has('cylinders')) ctx.fail('cylinders', 'The head-flow check needs the number of cylinders.');
      const n = ctx.value('cylinders');
      if (!Number.isInteger(n)) ctx.fail('cylinders', 'The number of cylinders must be a whole number.');
      let q28 = ctx.value('headFlow');
      const dpHead = ctx.value('headFlowTestPressure');
      if (Math.abs(dpHead / RULE_TEST_PRESSURE_PA - 1) > TEST_PRESSURE_TOLERANCE) {
        const measured = q28;
        q28 = scaleFlowToPressureDrop(measured, dpHead, RULE_TEST_PRESSURE_PA);
        ctx.step('Head flow scaled to 28 inH2O (square-root rule)',
          'Q_{28} = Q\\,\\sqrt{\\frac{28\\,\\mathrm{inH_2O}}{\\Delta p_{h}}}',
          `Q_{28} = ${qty(measured, 'm^3/s')} \\times \\sqrt{\\frac{${qty(RULE_TEST_PRESSURE_PA, 'Pa')}}{${qty(dpHead, 'Pa')}}}`,
          `Q_{28} = ${qty(q28, 'm^3/s')}`);
        ctx.warn('headFlowTestPressure', 'The rule of thumb is for head flow at 28 inH2O. The figure was scaled to 28 inH2O, which makes the check rougher.');
      }
      const headPower = HEAD_RULE_SI * q28 * n;
      ctx.step('Head-flow rule of thumb: 0.257 hp per cfm at 28 inH2O, per cylinder (shop folklore)',
        `P_{h} = k\\,Q_{28}\\,n,\\quad k = ${num(HP_PER_CFM_AT_28)}\\,\\mathrm{hp/cfm} = ${num(HEAD_RULE_SI)}\\,\\mathrm{W/(m^3/s)}`,
        `P_{h} = ${num(HEAD_RULE_SI)}\\,\\mathrm{W/(m^3/s)} \\times ${qty(q28, 'm^3/s')} \\times ${num(n)}`,
        `P_{h} = ${qty(headPower, 'W')} = ${qty(convert(headPower, 'W', 'hp'), 'hp', 4)}`);
      const apart = headPower / power - 1;
      ctx.step('How far apart the two routes are', '\\frac{P_{h}}{P} - 1',
        `\\frac{${qty(headPower, 'W')}}{${qty(power, 'W')}} - 1`, `${num(apart * 100, 3)}\\,\\%`);
      ctx.note('The head-flow rule (0.257 hp per cfm at 28 inH2O, per cylinder) is shop folklore. It fits only naturally aspirated gasoline engines with a matched cam and exhaust, and only for head flow measured at 28 inH2O.');
      if (Math.abs(apart) > ROUTES_APART) {
        ctx.note(apart > 0
          ? 'The head figure is well above the mass route. The heads can flow more than this engine uses, or the air mass flow is low.'
          : 'The head figure is well below the mass route. The heads may limit this engine, or the air mass flow is high.');
      }
      result.headFlowPower = headPower;
    } else if (ctx.has('cylinders') || ctx.has('headFlowTestPressure')) {
      ctx.warn('headFlow', 'The head-flow check needs the head flow per port; the cylinders and its test pressure are not used.');
    }
    return result;
  },
});

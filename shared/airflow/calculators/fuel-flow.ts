import { bound, defineCalculator, type InputSpec } from '../define';
import { num, qty } from '../latex';
import { FUEL_HAZARD } from './hazards';

/** Stoichiometric air–fuel ratio of gasoline taken as 14.7 — shop common practice. */
export const GASOLINE_STOICH = 14.7;

const ratio = (label: string, symbol: string, help: string, extra: Partial<InputSpec>): InputSpec => ({
  label, symbol, kind: 'ratio', min: bound(0, '', false), max: bound(100, ''), help, ...extra,
});

export const fuelFlow = defineCalculator({
  id: 'fuel-flow',
  title: 'Fuel flow from air flow',
  topic: 'Mass flow',
  summary:
    'Fuel mass flow an engine needs for its air mass flow, from the air–fuel ratio or from lambda and the fuel\'s stoichiometric ratio (ṁ_fuel = ṁ_air / AFR, AFR = λ·AFR_st).',
  hazard: FUEL_HAZARD,
  inputs: {
    airMassFlow: {
      label: 'Air mass flow',
      symbol: '\\dot m_{air}',
      kind: 'massFlow',
      min: bound(0, 'kg/s', false),
      example: { value: 35, unit: 'lb/min' },
      exampleSi: { value: 250, unit: 'g/s' },
      help: 'From the mass-flow or engine-demand calculators, or a mass-air sensor.',
    },
    airFuelRatio: ratio('Air–fuel ratio (by mass)', 'AFR', 'Mass of air per mass of fuel, e.g. 12.5 for a rich full-load gasoline mixture.', { group: 'mixture', example: 12.5 }),
    lambda: ratio('Lambda', '\\lambda', 'Actual AFR over stoichiometric AFR: 1 is stoichiometric, below 1 rich, above 1 lean.', { group: 'mixture', max: bound(10, ''), example: 0.85 }),
    stoichiometricRatio: ratio('Stoichiometric air–fuel ratio', 'AFR_{st}',
      'Chemically correct AFR of the fuel; empty: 14.7, the usual gasoline figure (shop common practice). Blends differ: ask the fuel supplier.',
      { optional: true, default: GASOLINE_STOICH }),
  },
  groups: [{ id: 'mixture', label: 'Air–fuel ratio or lambda', inputs: ['airFuelRatio', 'lambda'], required: true }],
  outputs: {
    fuelMassFlow: { label: 'Fuel mass flow', symbol: '\\dot m_{fuel}', kind: 'massFlow', us: 'lb/h' },
    airFuelRatio: { label: 'Air–fuel ratio', symbol: 'AFR', kind: 'ratio', us: '' },
    lambda: { label: 'Lambda', symbol: '\\lambda', kind: 'ratio', us: '' },
  },
  compute(ctx) {
    const air = ctx.value('airMassFlow');
    const stoich = ctx.value('stoichiometricRatio');
    let afr: number;
    let lambda: number;
    if (ctx.has('lambda')) {
      lambda = ctx.value('lambda');
      afr = lambda * stoich;
      ctx.step(ctx.has('stoichiometricRatio') ? 'Air–fuel ratio from lambda' : 'Air–fuel ratio from lambda (gasoline, AFR_st = 14.7, shop common practice)',
        'AFR = \\lambda\\,AFR_{st}', `AFR = ${num(lambda)} \\times ${num(stoich)}`, `AFR = ${num(afr)}`);
    } else {
      afr = ctx.value('airFuelRatio');
      lambda = afr / stoich;
      if (ctx.has('stoichiometricRatio')) ctx.step('Lambda for reference', '\\lambda = \\frac{AFR}{AFR_{st}}', `\\lambda = \\frac{${num(afr)}}{${num(stoich)}}`, `\\lambda = ${num(lambda)}`);
      else ctx.step('Lambda for reference (gasoline, AFR_st = 14.7, shop common practice)', '\\lambda = \\frac{AFR}{AFR_{st}}', `\\lambda = \\frac{${num(afr)}}{${num(stoich)}}`, `\\lambda = ${num(lambda)}`);
    }
    const fuel = air / afr;
    ctx.step('Fuel mass flow', '\\dot m_{fuel} = \\frac{\\dot m_{air}}{AFR}',
      `\\dot m_{fuel} = \\frac{${qty(air, 'kg/s')}}{${num(afr)}}`, `\\dot m_{fuel} = ${qty(fuel, 'kg/s')}`);
    return { fuelMassFlow: fuel, airFuelRatio: afr, lambda };
  },
});

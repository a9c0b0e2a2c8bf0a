import { bound, type ComputeContext, defineCalculator, type InputSpec } from '../define';
import { num, qty } from '../latex';
import { convert } from '../units';
import { massFlow } from './common-inputs';
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
    'Fuel mass flow an engine needs for its air mass flow, from the air–fuel ratio or from lambda and the fuel\'s stoichiometric ratio (ṁ_fuel = ṁ_air / AFR, AFR = λ·AFR_st). With the number of injectors, the smallest injector rating, in lb/h and cc/min, with a duty-cycle margin and the fuel pressure allowed for.',
  hazard: FUEL_HAZARD,
  inputs: {
    airMassFlow: {
      ...massFlow('Air mass flow', '\\dot m_{air}', { value: 35, unit: 'lb/min' },
        'From the mass-flow or engine-demand calculators, or a mass-air sensor.'),
      exampleSi: { value: 250, unit: 'g/s' },
    },
    airFuelRatio: ratio('Air–fuel ratio (by mass)', 'AFR', 'Mass of air per mass of fuel, e.g. 12.5 for a rich full-load gasoline mixture.', { group: 'mixture', example: 12.5 }),
    lambda: ratio('Lambda', '\\lambda', 'Actual AFR over stoichiometric AFR: 1 is stoichiometric, below 1 rich, above 1 lean.', { group: 'mixture', max: bound(10, ''), example: 0.85 }),
    stoichiometricRatio: ratio('Stoichiometric air–fuel ratio', 'AFR_{st}',
      'Chemically correct AFR of the fuel; empty: 14.7, the usual gasoline figure (shop common practice). Blends differ: ask the fuel supplier.',
      { optional: true, default: GASOLINE_STOICH }),
    injectorCount: {
      label: 'Number of injectors (for injector sizing)',
      symbol: 'n',
      kind: 'ratio',
      min: bound(1, ''),
      max: bound(64, ''),
      optional: true,
      example: 8,
      help: 'Give it to size the injectors: usually one per cylinder. Empty: no injector sizing.',
    },
    maxDutyCycle: {
      label: 'Highest injector duty cycle',
      symbol: 'D_{max}',
      kind: 'percent',
      min: bound(0, '%', false),
      max: bound(100, '%'),
      optional: true,
      default: { value: 80, unit: '%' },
      help: 'The share of the time the injector may be open at full load. Empty: 80 %, a common shop margin so the injectors never run flat out.',
    },
    fuelDensity: {
      label: 'Fuel density',
      symbol: '\\rho_{fuel}',
      kind: 'density',
      defaultUnit: { si: 'kg/L', us: 'kg/L' },
      min: bound(0, 'kg/m^3', false),
      max: bound(2, 'kg/L'),
      optional: true,
      default: { value: 0.745, unit: 'kg/L' },
      help: 'Turns lb/h into cc/min. Empty: 0.745 kg/L, mid-range for gasoline (about 0.720–0.775 kg/L at 15 °C). Other fuels differ: ask the fuel supplier.',
    },
    ratedFuelPressure: {
      label: 'Pressure across the injector at its rating',
      symbol: '\\Delta p_{rated}',
      kind: 'pressure',
      defaultUnit: { si: 'bar', us: 'psi' },
      min: bound(0, 'Pa', false),
      optional: true,
      help: 'The fuel pressure (over manifold pressure) the injector\'s rating was measured at, from its data sheet. Give it with the pressure in use below. Empty: the same as in use.',
    },
    operatingFuelPressure: {
      label: 'Pressure across the injector in use',
      symbol: '\\Delta p_{op}',
      kind: 'pressure',
      defaultUnit: { si: 'bar', us: 'psi' },
      min: bound(0, 'Pa', false),
      optional: true,
      help: 'Rail pressure minus manifold pressure at full load. A manifold-referenced regulator keeps it steady; with a fixed (returnless) rail it falls as boost rises. Empty: the same as the rating.',
    },
  },
  groups: [{ id: 'mixture', label: 'Air–fuel ratio or lambda', inputs: ['airFuelRatio', 'lambda'], required: true }],
  outputs: {
    fuelMassFlow: { label: 'Fuel mass flow', symbol: '\\dot m_{fuel}', kind: 'massFlow', us: 'lb/h' },
    airFuelRatio: { label: 'Air–fuel ratio', symbol: 'AFR', kind: 'ratio', us: '' },
    lambda: { label: 'Lambda', symbol: '\\lambda', kind: 'ratio', us: '' },
    fuelPerInjector: { label: 'Fuel needed per injector', symbol: '\\dot m_{inj}', kind: 'massFlow', us: 'lb/h',
      help: 'What each injector must deliver at full load. This is not the injector size.' },
    minimumInjectorRating: { label: 'Smallest injector rating', symbol: '\\dot m_{rated}', kind: 'massFlow', us: 'lb/h',
      help: 'The rating to look for, at the rating pressure: the fuel needed, with the duty-cycle margin and the pressure in use allowed for.' },
    minimumInjectorRatingVolume: { label: 'Smallest injector rating (volume)', symbol: 'Q_{rated}', kind: 'volumeFlow', us: 'cc/min',
      help: 'The same rating in cc/min, through the fuel density.' },
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
    const sizing = ctx.has('injectorCount') ? injectorSizing(ctx, fuel) : {};
    return { fuelMassFlow: fuel, airFuelRatio: afr, lambda, ...sizing };
  },
});

/** Shop common practice: keep full-load duty at or below about 80 %; above this we warn. */
const HIGH_DUTY_CYCLE = 0.85;

type SizingInput = 'injectorCount' | 'maxDutyCycle' | 'fuelDensity' | 'ratedFuelPressure' | 'operatingFuelPressure';

/**
 * Injector sizing: fuel per injector, divided by the highest duty cycle (a shop margin), scaled to
 * the rating pressure by flow ∝ √(pressure across the injector) (the orifice rule of lesson 2).
 */
function injectorSizing(ctx: ComputeContext<SizingInput>, fuel: number) {
  const count = ctx.value('injectorCount');
  if (!Number.isInteger(count)) ctx.fail('injectorCount', 'The number of injectors must be a whole number.');
  const duty = ctx.value('maxDutyCycle');
  if (duty > HIGH_DUTY_CYCLE) {
    ctx.warn('maxDutyCycle', 'Above about 85 % duty there is little margin left: a hot day, a worn pump or a lean spot at full load can run the injectors flat out. Shop common practice keeps full-load duty at or below about 80 %.');
  }
  const perInjector = fuel / count;
  ctx.step('Fuel each injector must deliver', '\\dot m_{inj} = \\frac{\\dot m_{fuel}}{n}',
    `\\dot m_{inj} = \\frac{${qty(fuel, 'kg/s')}}{${num(count)}}`, `\\dot m_{inj} = ${qty(perInjector, 'kg/s')} = ${qty(convert(perInjector, 'kg/s', 'lb/h'), 'lb/h', 4)}`);
  const atOperating = perInjector / duty;
  ctx.step('Allow the duty-cycle margin: the injector is open only part of the time',
    '\\dot m_{op} = \\frac{\\dot m_{inj}}{D_{max}}',
    `\\dot m_{op} = \\frac{${qty(perInjector, 'kg/s')}}{${num(duty)}}`, `\\dot m_{op} = ${qty(atOperating, 'kg/s')} = ${qty(convert(atOperating, 'kg/s', 'lb/h'), 'lb/h', 4)}`);
  const bothPressures = ctx.has('ratedFuelPressure') && ctx.has('operatingFuelPressure');
  if (ctx.has('ratedFuelPressure') !== ctx.has('operatingFuelPressure')) {
    ctx.warn(ctx.has('ratedFuelPressure') ? 'operatingFuelPressure' : 'ratedFuelPressure', 'Give both pressures across the injector (at its rating and in use) to scale the rating; with one alone they are taken as equal.');
  }
  let rated = atOperating;
  if (bothPressures) {
    const pRated = ctx.value('ratedFuelPressure');
    const pOp = ctx.value('operatingFuelPressure');
    rated = atOperating * Math.sqrt(pRated / pOp);
    ctx.step('Refer to the rating pressure: injector flow goes with the square root of the pressure across it',
      '\\dot m_{rated} = \\dot m_{op}\\sqrt{\\frac{\\Delta p_{rated}}{\\Delta p_{op}}}',
      `\\dot m_{rated} = ${qty(atOperating, 'kg/s')} \\times \\sqrt{\\frac{${qty(pRated, 'Pa')}}{${qty(pOp, 'Pa')}}}`,
      `\\dot m_{rated} = ${qty(rated, 'kg/s')} = ${qty(convert(rated, 'kg/s', 'lb/h'), 'lb/h', 4)}`);
    if (pOp !== pRated) {
      const percent = Math.round((Math.sqrt(pOp / pRated) - 1) * 100);
      ctx.note(`At the pressure in use each injector flows about ${Math.abs(percent)} % ${percent >= 0 ? 'more' : 'less'} than its rating (flow goes with the square root of the pressure across it).`);
    }
  }
  const rho = ctx.value('fuelDensity');
  const volume = rated / rho;
  ctx.step('The same rating as a volume flow, through the fuel density',
    'Q_{rated} = \\frac{\\dot m_{rated}}{\\rho_{fuel}}',
    `Q_{rated} = \\frac{${qty(rated, 'kg/s')}}{${qty(rho, 'kg/m^3')}}`,
    `Q_{rated} = ${qty(volume, 'm^3/s')} = ${qty(convert(volume, 'm^3/s', 'cc/min'), 'cc/min', 4)}`);
  ctx.note(`The fuel needed is not the injector size. Choose injectors rated at least the smallest rating shown${bothPressures ? ' (at their rating pressure)' : ''}. Then they stay open no more than ${Math.round(duty * 100)} % of the time at full load.`);
  return { fuelPerInjector: perInjector, minimumInjectorRating: rated, minimumInjectorRatingVolume: volume };
}

/*
 * Uncertainty of a derived result (our design): first-order GUM propagation for
 *   air density ρ(T, p, h) by CIPM-2007 (plus the formula's own 22·10⁻⁶), or
 *   mass flow ṁ = ρ Q.
 * Each input comes with a ± figure; by default the figure is a sensor accuracy limit read as
 * a rectangular distribution (u = a/√3); choose "standard" if the figures already are standard
 * uncertainties. Inputs are taken as uncorrelated. Expanded uncertainty uses k = 2.
 */
import { bound, defineCalculator, type InputSpec } from '../define';
import { lines, num, qty } from '../latex';
import { CIPM_RELATIVE_UNCERTAINTY, moistAir } from '../moist-air';
import { COVERAGE_FACTOR, propagate, rectangularToStandard, type UncertainInput } from '../uncertainty';
import { absolutePressure, airTemperature, relativeHumidity } from './common-inputs';
import { warnOutsideCipm } from './moist-air-steps';

const plusMinus = (label: string, symbol: string, kind: InputSpec['kind'], unit: string, example: { value: number; unit: string }): InputSpec => ({
  label, symbol, kind, optional: true, default: { value: 0, unit }, min: bound(0, unit), example,
  help: 'The ± figure for the input above (a sensor accuracy or a standard uncertainty, see "The ± figures are"). Empty: 0.',
});

interface Term { input: UncertainInput; given: number; unit: string; sensitivityUnit: string }

export const uncertainty = defineCalculator({
  id: 'uncertainty',
  title: 'Uncertainty of air density or mass flow',
  topic: 'Sensors and uncertainty',
  summary:
    'Combined and expanded uncertainty (k = 2) of air density from temperature, pressure and humidity, or of mass flow from volume flow and density, by the first-order method of the GUM with sensitivity coefficients.',
  inputs: {
    quantity: {
      label: 'Result', symbol: '', kind: 'option', example: 'air-density',
      options: [
        { value: 'air-density', label: 'Air density from temperature, pressure and humidity (CIPM-2007)' },
        { value: 'mass-flow', label: 'Mass flow from volume flow and density' },
      ],
      help: 'The derived result whose uncertainty you want.',
    },
    convention: {
      label: 'The ± figures are', symbol: '', kind: 'option', optional: true, default: 'rectangular', example: 'rectangular',
      options: [
        { value: 'rectangular', label: 'Sensor accuracy limits (rectangular: u = a/√3)', help: 'A data-sheet "±a" with no further information.' },
        { value: 'standard', label: 'Standard uncertainties (one standard deviation)', help: 'From a calibration certificate (divide its expanded U by its k first).' },
      ],
      help: 'How to read the ± figures below.',
    },
    temperature: { ...airTemperature('Air temperature', 'T', { value: 20, unit: 'degC' }, 'For air density.'), optional: true },
    temperatureUncertainty: plusMinus('± temperature', 'a_{T}', 'temperatureDifference', 'K', { value: 0.5, unit: 'K' }),
    pressure: { ...absolutePressure('Barometric pressure (absolute)', 'p', { value: 1013, unit: 'hPa' }, 'For air density.'), optional: true },
    pressureUncertainty: plusMinus('± pressure', 'a_{p}', 'pressure', 'Pa', { value: 50, unit: 'Pa' }),
    relativeHumidity: { ...relativeHumidity({ value: 50, unit: '%' }), optional: true, default: 0 },
    relativeHumidityUncertainty: { ...plusMinus('± relative humidity', 'a_{h}', 'percent', '%', { value: 3, unit: '%' }), max: bound(100, '%') },
    volumeFlow: {
      label: 'Volume flow', symbol: 'Q', kind: 'volumeFlow', optional: true, min: bound(0, 'm^3/s'),
      example: { value: 300, unit: 'cfm' }, exampleSi: { value: 150, unit: 'L/s' }, help: 'For mass flow.',
    },
    // ±2 % of the flow in both examples.
    volumeFlowUncertainty: { ...plusMinus('± volume flow', 'a_{Q}', 'volumeFlow', 'm^3/s', { value: 6, unit: 'cfm' }), exampleSi: { value: 3, unit: 'L/s' } },
    density: { label: 'Air density', symbol: '\\rho', kind: 'density', optional: true, min: bound(0, 'kg/m^3', false), example: { value: 1.2, unit: 'kg/m^3' }, help: 'For mass flow.' },
    densityUncertainty: plusMinus('± density', 'a_{\\rho}', 'density', 'kg/m^3', { value: 0.005, unit: 'kg/m^3' }),
  },
  outputs: {
    density: { label: 'Air density', symbol: '\\rho', kind: 'density', us: 'lb/ft^3' },
    densityStandardUncertainty: { label: 'Combined standard uncertainty of density', symbol: 'u_{c}(\\rho)', kind: 'density', us: 'lb/ft^3' },
    densityExpandedUncertainty: { label: 'Expanded uncertainty of density (k = 2)', symbol: 'U(\\rho)', kind: 'density', us: 'lb/ft^3' },
    massFlow: { label: 'Mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
    massFlowStandardUncertainty: { label: 'Combined standard uncertainty of mass flow', symbol: 'u_{c}(\\dot m)', kind: 'massFlow', us: 'lb/min' },
    massFlowExpandedUncertainty: { label: 'Expanded uncertainty of mass flow (k = 2)', symbol: 'U(\\dot m)', kind: 'massFlow', us: 'lb/min' },
    relativeExpandedUncertainty: { label: 'Relative expanded uncertainty', symbol: 'U/y', kind: 'percent', us: '%' },
  },
  compute(ctx) {
    const rectangular = ctx.option('convention') !== 'standard';
    const toU = (a: number) => (rectangular ? rectangularToStandard(a) : a);
    const need = (name: 'temperature' | 'pressure' | 'volumeFlow' | 'density', what: string) => {
      if (!ctx.has(name)) ctx.fail(name, `Needed for ${what}.`);
      return ctx.value(name);
    };
    const densityResult = ctx.option('quantity') !== 'mass-flow';
    let terms: Term[];
    let f: (x: readonly number[]) => number;
    const [y, yUnit] = densityResult ? ['\\rho', 'kg/m^3'] : ['\\dot m', 'kg/s'];
    if (densityResult) {
      const T = need('temperature', 'air density');
      const p = need('pressure', 'air density');
      const h = ctx.value('relativeHumidity');
      warnOutsideCipm(ctx, T, p, 'temperature', 'pressure');
      terms = [
        { input: { symbol: 'T', value: T, standardUncertainty: toU(ctx.value('temperatureUncertainty')), step: 0.01 }, given: ctx.value('temperatureUncertainty'), unit: 'K', sensitivityUnit: 'kg/m^3/K' },
        { input: { symbol: 'p', value: p, standardUncertainty: toU(ctx.value('pressureUncertainty')), step: 1 }, given: ctx.value('pressureUncertainty'), unit: 'Pa', sensitivityUnit: 'kg/m^3/Pa' },
        { input: { symbol: 'h', value: h, standardUncertainty: toU(ctx.value('relativeHumidityUncertainty')), step: 1e-3 }, given: ctx.value('relativeHumidityUncertainty'), unit: '', sensitivityUnit: 'kg/m^3' },
      ];
      f = ([t = 0, pp = 0, hh = 0]) => moistAir(t, pp, { relativeHumidity: hh }).densityCipm;
    } else {
      const q = need('volumeFlow', 'mass flow');
      const rho = need('density', 'mass flow');
      terms = [
        { input: { symbol: 'Q', value: q, standardUncertainty: toU(ctx.value('volumeFlowUncertainty')), step: Math.max(q, 1e-6) * 1e-6 }, given: ctx.value('volumeFlowUncertainty'), unit: 'm^3/s', sensitivityUnit: 'kg/m^3' },
        { input: { symbol: '\\rho', value: rho, standardUncertainty: toU(ctx.value('densityUncertainty')), step: rho * 1e-6 }, given: ctx.value('densityUncertainty'), unit: 'kg/m^3', sensitivityUnit: 'm^3/s' },
      ];
      f = ([qq = 0, rr = 0]) => qq * rr;
    }
    if (rectangular) {
      ctx.step('Accuracy limits to standard uncertainties (rectangular distribution)', 'u(x_i) = \\frac{a_i}{\\sqrt{3}}',
        lines(terms.map((t) => `u(${t.input.symbol}) = \\frac{${qty(t.given, t.unit)}}{\\sqrt{3}}`)),
        lines(terms.map((t) => `u(${t.input.symbol}) = ${qty(t.input.standardUncertainty, t.unit)}`)));
    }
    const budget = propagate(f, terms.map((t) => t.input));
    ctx.step('Sensitivity coefficients (central differences)', `c_i = \\frac{\\partial ${y}}{\\partial x_i} \\approx \\frac{${y}(x_i + \\delta) - ${y}(x_i - \\delta)}{2\\delta}`,
      lines(terms.map((t) => `c_{${t.input.symbol}} \\text{ with } \\delta = ${qty(t.input.step, t.unit)}`)),
      lines(terms.map((t, i) => `c_{${t.input.symbol}} = ${qty(budget.sensitivities[i] ?? 0, t.sensitivityUnit)}`)));
    const contributions = [...budget.contributions];
    const labels = terms.map((t) => `c_{${t.input.symbol}}\\,u(${t.input.symbol})`);
    const values = terms.map((t, i) => `${labels[i]} = ${qty(budget.contributions[i] ?? 0, yUnit)}`);
    if (densityResult) {
      const formula = CIPM_RELATIVE_UNCERTAINTY * budget.value;
      contributions.push(formula);
      values.push(`u_{formula} = 22\\times 10^{-6}\\,\\rho = ${qty(formula, yUnit)}`);
      labels.push('u_{formula}');
    }
    const combined = Math.sqrt(contributions.reduce((s, c) => s + c * c, 0));
    ctx.step('Combined standard uncertainty (uncorrelated inputs)',
      `u_{c}(${y}) = \\sqrt{\\textstyle\\sum_i (c_i\\,u(x_i))^2}`,
      lines([...values, `u_{c} = \\sqrt{${contributions.map((c) => `(${num(c, 4)})^2`).join(' + ')}}`]),
      `u_{c}(${y}) = ${qty(combined, yUnit)}`);
    const expanded = COVERAGE_FACTOR * combined;
    const relative = expanded / budget.value;
    ctx.step('Expanded uncertainty, coverage factor k = 2 (about 95 %)', `U = k\\,u_{c}(${y})`,
      `U = 2 \\times ${qty(combined, yUnit)},\\quad ${y} = ${qty(budget.value, yUnit)}`,
      `U = ${qty(expanded, yUnit)} = ${num(relative * 100, 3)}\\,\\%\\ \\text{of}\\ ${y}`);
    return densityResult
      ? { density: budget.value, densityStandardUncertainty: combined, densityExpandedUncertainty: expanded, relativeExpandedUncertainty: relative }
      : { massFlow: budget.value, massFlowStandardUncertainty: combined, massFlowExpandedUncertainty: expanded, relativeExpandedUncertainty: relative };
  },
});

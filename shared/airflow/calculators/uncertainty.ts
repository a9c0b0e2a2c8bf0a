/*
 * Uncertainty of a derived result (our design): first-order GUM propagation for
 *   air density ρ(T, p, h) by CIPM-2007 (plus the formula's own 22·10⁻⁶), or
 *   mass flow ṁ = ρ Q.
 * Each input comes with a ± figure; by default the figure is a sensor accuracy limit read as
 * a rectangular distribution (u = a/√3); choose "standard" if the figures already are standard
 * uncertainties. Inputs are taken as uncorrelated: in the mass-flow mode that holds for a volume
 * meter independent of density, not for a pressure-drop bench, whose Q ∝ ρ^−½ makes ṁ ∝ ρ^½
 * (course review 1, E18). Repeat runs of the volume flow add a Type A term s/√n with ν = n − 1
 * (GUM §4.2); then k = t₉₅(ν_eff) by Welch–Satterthwaite (GUM G.4), otherwise k = 2.
 */
import { bound, defineCalculator, type InputSpec } from '../define';
import { lines, num, qty } from '../latex';
import { CIPM_RELATIVE_UNCERTAINTY, moistAir } from '../moist-air';
import { tFactor95, wholeDegreesOfFreedom } from '../student-t';
import { type BudgetTerm, COVERAGE_FACTOR, propagate, rectangularToStandard, type UncertainInput, welchSatterthwaite } from '../uncertainty';
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
    'Combined and expanded uncertainty (about 95 %) of air density from temperature, pressure and humidity, or of mass flow from volume flow and density, by the first-order method of the GUM with sensitivity coefficients. The scatter of repeat runs always belongs in a flow budget: give the number of runs and their standard deviation, and the coverage factor becomes the Student t factor (Welch–Satterthwaite) instead of k = 2.',
  inputs: {
    quantity: {
      label: 'Result', symbol: '', kind: 'option', example: 'air-density',
      options: [
        { value: 'air-density', label: 'Air density from temperature, pressure and humidity (CIPM-2007)' },
        { value: 'mass-flow', label: 'Mass flow from volume flow and density',
          help: 'For a volume meter that does not use the density. A pressure-drop bench works its flow out from the density (Q ∝ 1/√ρ), so its mass flow goes with √ρ: halve the density share this shows.' },
      ],
      help: 'The derived result whose uncertainty you want. The mass-flow mode treats volume flow and density as independent: right for a separate volume meter, not quite for a pressure-drop bench.',
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
      example: { value: 300, unit: 'cfm' }, exampleSi: { value: 150, unit: 'L/s' },
      help: 'For mass flow: the mean of the repeat runs, from a meter independent of the density.',
    },
    // ±2 % of the flow in both examples.
    volumeFlowUncertainty: { ...plusMinus('± volume flow', 'a_{Q}', 'volumeFlow', 'm^3/s', { value: 6, unit: 'cfm' }), exampleSi: { value: 3, unit: 'L/s' } },
    density: { label: 'Air density', symbol: '\\rho', kind: 'density', optional: true, min: bound(0, 'kg/m^3', false), example: { value: 1.2, unit: 'kg/m^3' }, help: 'For mass flow.' },
    densityUncertainty: plusMinus('± density', 'a_{\\rho}', 'density', 'kg/m^3', { value: 0.005, unit: 'kg/m^3' }),
    repeatCount: {
      label: 'Number of repeat runs', symbol: 'n', kind: 'ratio', optional: true, min: bound(2, ''), max: bound(1000, ''),
      help: 'For mass flow: how many times the flow was measured, refitting the part between runs. With their scatter below, adds s/√n to the budget and uses the t factor. Empty: no repeat term, k = 2.',
    },
    repeatScatter: {
      label: 'Scatter of the repeat runs (standard deviation s)', symbol: 's_{Q}', kind: 'volumeFlow', optional: true, min: bound(0, 'm^3/s'),
      help: 'For mass flow: the sample standard deviation of the repeat runs of the volume flow (the compare-tests calculator works it out). Always include it, unless a stated accuracy clearly already holds it.',
    },
  },
  outputs: {
    density: { label: 'Air density', symbol: '\\rho', kind: 'density', us: 'lb/ft^3' },
    densityStandardUncertainty: { label: 'Combined standard uncertainty of density', symbol: 'u_{c}(\\rho)', kind: 'density', us: 'lb/ft^3' },
    densityExpandedUncertainty: { label: 'Expanded uncertainty of density (about 95 %)', symbol: 'U(\\rho)', kind: 'density', us: 'lb/ft^3' },
    massFlow: { label: 'Mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
    massFlowStandardUncertainty: { label: 'Combined standard uncertainty of mass flow', symbol: 'u_{c}(\\dot m)', kind: 'massFlow', us: 'lb/min' },
    massFlowExpandedUncertainty: { label: 'Expanded uncertainty of mass flow (about 95 %)', symbol: 'U(\\dot m)', kind: 'massFlow', us: 'lb/min' },
    relativeExpandedUncertainty: { label: 'Relative expanded uncertainty', symbol: 'U/y', kind: 'percent', us: '%' },
    coverageFactor: { label: 'Coverage factor', symbol: 'k', kind: 'ratio', us: '',
      help: '2 when every term rests on plenty of data; the Student t factor at 95 % when repeat runs are given.' },
  },
  compute(ctx) {
    const rectangular = ctx.option('convention') !== 'standard';
    const toU = (a: number) => (rectangular ? rectangularToStandard(a) : a);
    const need = (name: 'temperature' | 'pressure' | 'volumeFlow' | 'density', what: string) => {
      if (!ctx.has(name)) ctx.fail(name, `Needed for ${what}.`);
      return ctx.value(name);
    };
    const densityResult = ctx.option('quantity') !== 'mass-flow';
    // Repeat runs of the volume flow (Type A): both or neither, a whole number of runs.
    let repeats: { n: number; s: number } | undefined;
    if (ctx.has('repeatCount') || ctx.has('repeatScatter')) {
      if (densityResult) {
        ctx.warn(ctx.has('repeatCount') ? 'repeatCount' : 'repeatScatter', 'Repeat runs are used for a mass-flow result only (they scatter the volume flow); they were left out.');
      } else {
        if (!ctx.has('repeatScatter')) ctx.fail('repeatScatter', 'Give the scatter (standard deviation) of the repeat runs too.');
        if (!ctx.has('repeatCount')) ctx.fail('repeatCount', 'Give the number of repeat runs too.');
        const n = ctx.value('repeatCount');
        if (!Number.isInteger(n)) ctx.fail('repeatCount', 'Number of repeat runs must be a whole number, 2 or more.');
        repeats = { n, s: ctx.value('repeatScatter') };
      }
    }
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
    const degrees: number[] = contributions.map(() => Number.POSITIVE_INFINITY);
    if (repeats !== undefined) {
      const typeA = repeats.s / Math.sqrt(repeats.n);
      const cQ = budget.sensitivities[0] ?? 0;
      ctx.step('Repeatability of the volume flow (Type A, GUM 4.2)', 'u_{A}(Q) = \\frac{s_{Q}}{\\sqrt{n}},\\quad \\nu = n - 1',
        `u_{A}(Q) = \\frac{${qty(repeats.s, 'm^3/s')}}{\\sqrt{${repeats.n}}}`,
        `u_{A}(Q) = ${qty(typeA, 'm^3/s')},\\quad \\nu = ${repeats.n - 1}`);
      contributions.push(Math.abs(cQ * typeA));
      degrees.push(repeats.n - 1);
      values.push(`c_{Q}\\,u_{A}(Q) = ${qty(Math.abs(cQ * typeA), yUnit)}`);
    }
    const combined = Math.sqrt(contributions.reduce((s, c) => s + c * c, 0));
    ctx.step('Combined standard uncertainty (uncorrelated inputs)',
      `u_{c}(${y}) = \\sqrt{\\textstyle\\sum_i (c_i\\,u(x_i))^2}`,
      lines([...values, `u_{c} = \\sqrt{${contributions.map((c) => `(${num(c, 4)})^2`).join(' + ')}}`]),
      `u_{c}(${y}) = ${qty(combined, yUnit)}`);
    let k = COVERAGE_FACTOR;
    if (repeats !== undefined) {
      const budgetTerms: BudgetTerm[] = contributions.map((c, i) => ({ contribution: c, degreesOfFreedom: degrees[i] ?? Number.POSITIVE_INFINITY }));
      const nuEff = welchSatterthwaite(budgetTerms);
      const whole = wholeDegreesOfFreedom(nuEff);
      const typeA = contributions.at(-1) ?? 0;
      ctx.step('Effective degrees of freedom (Welch–Satterthwaite, GUM G.4.2)',
        `\\nu_{eff} = \\frac{u_{c}^4}{\\sum_i (c_i\\,u_i)^4/\\nu_i}`,
        `\\nu_{eff} = \\frac{(${num(combined, 4)})^4}{(${num(typeA, 4)})^4/${repeats.n - 1}} \\quad (\\nu = \\infty \\text{ for the data-sheet terms})`,
        !Number.isFinite(nuEff) ? '\\nu_{eff} = \\infty'
          : `\\nu_{eff} = ${num(nuEff, 4)}${Math.abs(whole - nuEff) < 1e-9 * nuEff ? '' : ` \\rightarrow ${whole}\\ \\text{(next lower whole number, GUM G.4.1)}`}`);
      k = tFactor95(nuEff);
    }
    const expanded = k * combined;
    const relative = expanded / budget.value;
    ctx.step(repeats === undefined ? 'Expanded uncertainty, coverage factor k = 2 (about 95 %)' : 'Expanded uncertainty, coverage factor k = t95 (Student t, GUM Table G.2)',
      repeats === undefined ? `U = k\\,u_{c}(${y})` : `U = t_{95}(\\nu_{eff})\\,u_{c}(${y})`,
      `U = ${num(k, 4)} \\times ${qty(combined, yUnit)},\\quad ${y} = ${qty(budget.value, yUnit)}`,
      `U = ${qty(expanded, yUnit)} = ${num(relative * 100, 3)}\\,\\%\\ \\text{of}\\ ${y}`);
    if (!densityResult) {
      ctx.note('This treats volume flow and density as independent, as for a separate volume meter. A pressure-drop bench works its flow out from the density, so its mass flow goes only with the square root of density: the density share is half what is shown.');
      if (repeats === undefined) ctx.note('No repeat runs are included. The scatter of repeat runs always belongs in the budget: give their number and standard deviation.');
    }
    return densityResult
      ? { density: budget.value, densityStandardUncertainty: combined, densityExpandedUncertainty: expanded, relativeExpandedUncertainty: relative, coverageFactor: k }
      : { massFlow: budget.value, massFlowStandardUncertainty: combined, massFlowExpandedUncertainty: expanded, relativeExpandedUncertainty: relative, coverageFactor: k };
  },
});

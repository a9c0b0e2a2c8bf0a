import { defineCalculator } from '../define';
import { num, paren, qty } from '../latex';
import { FLUID_RANGES, MERCURY_DENSITY_0C, MERCURY_EXPANSION_PER_K, mercuryDensity, waterDensity } from '../manometer-fluids';
import { STANDARD_GRAVITY } from '../units';
import { MERCURY_HAZARD } from './hazards';

export const manometer = defineCalculator({
  id: 'manometer',
  title: 'Manometer: column height and pressure',
  topic: 'Pressure',
  hazard: MERCURY_HAZARD,
  summary:
    'Turns the height difference of a water or mercury column into a pressure difference, or a pressure into a column height, with the fluid density at its actual temperature and standard gravity.',
  inputs: {
    height: {
      label: 'Column height difference',
      symbol: 'h',
      kind: 'length',
      group: 'column',
      example: { value: 10, unit: 'in' },
      // About 2.45 kPa of water: the same job as the 10 in example, in a metric rule's figure.
      exampleSi: { value: 250, unit: 'mm' },
      help: 'Difference between the two liquid levels (read both legs of a U-tube). Negative for suction if you keep the sign.',
    },
    pressure: {
      label: 'Pressure difference',
      symbol: '\\Delta p',
      kind: 'pressure',
      group: 'column',
      defaultUnit: { si: 'kPa', us: 'inH2O' },
      example: { value: 2.5, unit: 'kPa' },
      help: 'Give a pressure instead of a height to find the column it would hold up.',
    },
    fluid: {
      label: 'Manometer fluid',
      symbol: '',
      kind: 'option',
      options: [
        { value: 'water', label: 'Water', help: 'Density by Tanaka et al. (2001), valid 0–40 °C.' },
        { value: 'mercury', label: 'Mercury', help: '13 595.1 kg/m³ at 0 °C with thermal expansion.' },
      ],
      example: 'water',
      help: 'The liquid in the tube.',
    },
    fluidTemperature: {
      label: 'Fluid temperature',
      symbol: 't_{f}',
      kind: 'temperature',
      example: { value: 20, unit: 'degC' },
      help: 'Temperature of the liquid in the tube (usually room temperature): warm water is lighter and reads a taller column.',
    },
  },
  groups: [{ id: 'column', label: 'Height or pressure', inputs: ['height', 'pressure'], required: true }],
  outputs: {
    pressure: { label: 'Pressure difference', symbol: '\\Delta p', kind: 'pressure', us: 'inH2O' },
    height: { label: 'Column height difference', symbol: 'h', kind: 'length', us: 'in' },
    fluidDensity: { label: 'Fluid density', symbol: '\\rho_{f}', kind: 'density', us: 'lb/ft^3' },
  },
  compute(ctx) {
    const fluid = ctx.option('fluid') === 'mercury' ? 'mercury' : 'water';
    const tK = ctx.value('fluidTemperature');
    const t = tK - 273.15;
    const range = FLUID_RANGES[fluid];
    if (t < range.hardMinC || t > range.hardMaxC) {
      ctx.fail('fluidTemperature', fluid === 'water'
        ? 'Water is only liquid between 0 °C and 100 °C.'
        : 'This calculator takes mercury between −38.83 °C (its freezing point) and 100 °C.');
    }
    if (t < range.validMinC || t > range.validMaxC) {
      ctx.warn('fluidTemperature', `The ${fluid} density formula is stated for ${range.validMinC}–${range.validMaxC} °C; outside that the result is an extrapolation.`);
    }
    let rho: number;
    if (fluid === 'water') {
      rho = waterDensity(t);
      ctx.step('Density of water at its temperature (Tanaka et al. 2001)',
        '\\rho_{w} = a_5\\left[1 - \\frac{(t + a_1)^2 (t + a_2)}{a_3 (t + a_4)}\\right]',
        `\\rho_{w} = 999.97495\\left[1 - \\frac{(${num(t)} - 3.983035)^2 (${num(t)} + 301.797)}{522528.9\\,(${num(t)} + 69.34881)}\\right]`,
        `\\rho_{w} = ${qty(rho, 'kg/m^3', 7)}`);
    } else {
      rho = mercuryDensity(t);
      ctx.step('Density of mercury at its temperature (thermal expansion from 0 °C)',
        '\\rho_{Hg} = \\frac{\\rho_{0}}{1 + \\beta\\,t}',
        `\\rho_{Hg} = \\frac{${num(MERCURY_DENSITY_0C, 6)}}{1 + ${num(MERCURY_EXPANSION_PER_K)} \\times ${num(t)}}`,
        `\\rho_{Hg} = ${qty(rho, 'kg/m^3', 7)}`);
    }
    const g = STANDARD_GRAVITY;
    const rhoG = rho * g;
    if (ctx.has('height')) {
      const h = ctx.value('height');
      const dp = rhoG * h;
      ctx.step('Pressure held up by the column (standard gravity, air above the liquid neglected)',
        '\\Delta p = \\rho_{f}\\,g_{n}\\,h',
        `\\Delta p = ${qty(rho, 'kg/m^3', 7)} \\times ${qty(g, 'm/s^2', 6)} \\times ${paren(qty(h, 'm'))}`,
        `\\Delta p = ${qty(dp, 'Pa')}`);
      return { pressure: dp, height: h, fluidDensity: rho };
    }
    const dp = ctx.value('pressure');
    const h = dp / rhoG;
    ctx.step('Column height for the pressure (standard gravity, air above the liquid neglected)',
      'h = \\frac{\\Delta p}{\\rho_{f}\\,g_{n}}',
      `h = \\frac{${qty(dp, 'Pa')}}{${qty(rho, 'kg/m^3', 7)} \\times ${qty(g, 'm/s^2', 6)}}`,
      `h = ${qty(h, 'm')}`);
    return { pressure: dp, height: h, fluidDensity: rho };
  },
});

import { bound, defineCalculator } from '../define';
import { ISA, standardAtmosphere, TROPOPAUSE, TROPOSPHERE_EXPONENT } from '../atmosphere';
import { num, qty } from '../latex';

export const altitudePressure = defineCalculator({
  id: 'altitude-pressure',
  title: 'Standard atmosphere at an altitude',
  topic: 'Air density',
  summary:
    'Pressure, temperature and density of the ISO 2533 / US 1976 standard atmosphere at a geopotential altitude, troposphere and lower stratosphere (to 20 km). Real weather differs: use it to compare, not instead of a barometer.',
  inputs: {
    altitude: {
      label: 'Altitude (geopotential)',
      symbol: 'H',
      kind: 'length',
      defaultUnit: { si: 'm', us: 'ft' },
      min: bound(-5000, 'm'),
      max: bound(32000, 'm'),
      example: { value: 1500, unit: 'm' },
      help: 'Height above mean sea level. The standard uses geopotential altitude, which differs from the height on a map by under 0.1 % below 6 km.',
    },
  },
  outputs: {
    pressure: { label: 'Pressure', symbol: 'p', kind: 'pressure', us: 'inHg' },
    temperature: { label: 'Temperature', symbol: 'T', kind: 'temperature', us: 'degF' },
    density: { label: 'Density', symbol: '\\rho', kind: 'density', us: 'lb/ft^3' },
  },
  compute(ctx) {
    const H = ctx.value('altitude');
    if (H < ISA.bottom || H > ISA.top) {
      ctx.warn('altitude', 'The standard atmosphere here is modelled from −2000 m to 20 000 m; outside that the layer formulas are extrapolated.');
    }
    const s = standardAtmosphere(H);
    if (s.layer === 'troposphere') {
      ctx.step('Temperature falls 6.5 K per km in the troposphere',
        'T = T_{0} + L\\,H',
        `T = ${qty(ISA.T0, 'K')} + (${qty(ISA.lapse, 'K/m')}) \\times ${qty(H, 'm')}`,
        `T = ${qty(s.temperatureK, 'K')}`);
      ctx.step('Pressure from the hydrostatic equation with a constant lapse rate',
        'p = p_{0}\\left(\\frac{T}{T_{0}}\\right)^{-g_{0}/(L\\,R)}',
        `p = ${qty(ISA.p0, 'Pa')} \\times \\left(\\frac{${num(s.temperatureK, 6)}}{${num(ISA.T0, 6)}}\\right)^{${num(TROPOSPHERE_EXPONENT, 6)}}`,
        `p = ${qty(s.pressurePa, 'Pa')}`);
    } else {
      ctx.step('Above 11 km the temperature is constant', 'T = T_{11}', `T = ${qty(TROPOPAUSE.temperatureK, 'K')}`, `T = ${qty(s.temperatureK, 'K')}`);
      ctx.step('Pressure in the isothermal layer',
        'p = p_{11}\\exp\\left(-\\frac{g_{0}\\,(H - H_{11})}{R\\,T_{11}}\\right)',
        `p = ${qty(TROPOPAUSE.pressurePa, 'Pa')} \\times \\exp\\left(-\\frac{${num(ISA.g0, 6)} \\times (${num(H)} - 11\\,000)}{${num(ISA.R, 8)} \\times ${num(TROPOPAUSE.temperatureK)}}\\right)`,
        `p = ${qty(s.pressurePa, 'Pa')}`);
    }
    ctx.step('Density from the ideal gas law (ISO 2533 gas constant)',
      '\\rho = \\frac{p}{R\\,T}',
      `\\rho = \\frac{${qty(s.pressurePa, 'Pa')}}{${num(ISA.R, 8)}\\,\\mathrm{J/(kg\\,K)} \\times ${qty(s.temperatureK, 'K')}}`,
      `\\rho = ${qty(s.densityKgM3, 'kg/m^3')}`);
    return { pressure: s.pressurePa, temperature: s.temperatureK, density: s.densityKgM3 };
  },
});

import { defineCalculator } from '../define';
import { num, qty } from '../latex';
import { densityIdealDry, type Humidity, moistAir, R_DRY_AIR } from '../moist-air';
import { absolutePressure, airTemperature, relativeHumidity } from './common-inputs';
import { cipmDensitySteps, humiditySteps, vaporSteps, warnOutsideCipm } from './moist-air-steps';

export const airDensity = defineCalculator({
  id: 'air-density',
  title: 'Air density from temperature, pressure and humidity',
  topic: 'Air density',
  summary:
    'Density of moist air by the CIPM-2007 formula (the reference used by metrology labs), or of dry air by the ideal gas law for comparison, with vapour pressure, dew point and humidity ratio.',
  inputs: {
    temperature: airTemperature('Air temperature', 'T', { value: 20, unit: 'degC' },
      'Dry-bulb temperature of the air entering the bench or engine.'),
    pressure: {
      ...absolutePressure('Barometric pressure (absolute)', 'p', { value: 1013.25, unit: 'hPa' },
        'Station pressure from a barometer, absolute — not the sea-level figure of a weather report.'),
      // A barometer read to the whole hectopascal; the example keeps ISO 2533's 1013.25 hPa for lessons.
      exampleSi: { value: 1013, unit: 'hPa' },
    },
    relativeHumidity: { ...relativeHumidity({ value: 50, unit: '%' }), group: 'humidity' },
    dewPoint: {
      ...airTemperature('Dew point', 'T_{d}', { value: 10, unit: 'degC' },
        'Instead of relative humidity: the temperature at which the air would start to form dew (over water).'),
      group: 'humidity',
    },
    method: {
      label: 'Method',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'cipm2007',
      options: [
        { value: 'cipm2007', label: 'Moist air, CIPM-2007', help: 'Real-gas formula with water vapour; stated for 15–27 °C, 600–1100 hPa.' },
        { value: 'ideal-dry', label: 'Ideal gas, dry air', help: 'ρ = p/(R_d T) with R_d = 287.048 J/(kg·K); ignores humidity.' },
      ],
      example: 'cipm2007',
      help: 'CIPM-2007 for real work; the ideal-gas dry-air method to see what the simple law gives.',
    },
  },
  groups: [{ id: 'humidity', label: 'Relative humidity or dew point (empty: dry air)', inputs: ['relativeHumidity', 'dewPoint'], required: false }],
  outputs: {
    density: { label: 'Air density', symbol: '\\rho', kind: 'density', us: 'lb/ft^3' },
    vaporPressure: { label: 'Water vapour partial pressure', symbol: 'p_{v}', kind: 'pressure', us: 'inHg' },
    saturationVaporPressure: { label: 'Saturation vapour pressure', symbol: 'p_{sv}', kind: 'pressure', us: 'inHg' },
    dewPoint: { label: 'Dew point', symbol: 'T_{d}', kind: 'temperature', us: 'degF', help: 'Over liquid water, also below 0 °C.' },
    relativeHumidity: { label: 'Relative humidity', symbol: 'h', kind: 'percent', us: '%' },
    humidityRatio: { label: 'Humidity ratio', symbol: 'W', kind: 'ratio', us: '', help: 'kg of water per kg of dry air.' },
  },
  compute(ctx) {
    const T = ctx.value('temperature');
    const p = ctx.value('pressure');
    const method = ctx.option('method');
    let humidity: Humidity = { relativeHumidity: 0 };
    if (ctx.has('relativeHumidity')) humidity = { relativeHumidity: ctx.value('relativeHumidity') };
    if (ctx.has('dewPoint')) {
      const td = ctx.value('dewPoint');
      if (td > T + 1e-9) ctx.fail('dewPoint', 'The dew point cannot be above the air temperature (that would be more than 100 % relative humidity).');
      humidity = { dewPointK: td };
    }
    const s = moistAir(T, p, humidity);
    const dry = !ctx.has('relativeHumidity') && !ctx.has('dewPoint');
    if (dry) ctx.step('No humidity given: the air is taken as dry', 'x_{v} = 0', 'h = 0', 'x_{v} = 0,\\quad p_{v} = 0,\\quad W = 0');
    else vaporSteps(ctx, s, 'dewPointK' in humidity ? 'dew-point' : 'relative-humidity');
    let density: number;
    if (method === 'ideal-dry') {
      density = densityIdealDry(p, T);
      ctx.step('Ideal gas law for dry air',
        '\\rho = \\frac{p}{R_{d}\\,T},\\quad R_{d} = \\frac{R}{M_{a}}',
        `\\rho = \\frac{${qty(p, 'Pa')}}{${num(R_DRY_AIR, 6)}\\,\\mathrm{J/(kg\\,K)} \\times ${qty(T, 'K')}}`,
        `\\rho = ${qty(density, 'kg/m^3')}`);
      if (s.moleFractionVapor > 0) {
        ctx.warn(ctx.has('dewPoint') ? 'dewPoint' : 'relativeHumidity', 'The ideal-gas dry-air method leaves humidity out of the density; choose CIPM-2007 to include it.');
      }
    } else {
      warnOutsideCipm(ctx, T, p, 'temperature', 'pressure');
      cipmDensitySteps(ctx, s);
      density = s.densityCipm;
    }
    if (!dry) humiditySteps(ctx, s);
    if (ctx.has('relativeHumidity') && s.moleFractionVapor === 0) {
      ctx.warn('relativeHumidity', 'Perfectly dry air has no dew point, so none is reported.');
    }
    return {
      density,
      vaporPressure: s.vaporPressurePa,
      saturationVaporPressure: s.saturationVaporPressurePa,
      ...(Number.isFinite(s.dewPointK) ? { dewPoint: s.dewPointK } : {}),
      relativeHumidity: s.relativeHumidity,
      humidityRatio: s.humidityRatio,
    };
  },
});

/* Worked steps and validity warnings for the CIPM-2007 moist-air formula, shared by calculators. */
import type { ComputeContext } from '../define';
import { num, qty } from '../latex';
import { CIPM_RANGE, compressibilityTerms, M_DRY_AIR, M_WATER, type MoistAirState, R_MOLAR } from '../moist-air';

type Ctx = ComputeContext<string>;

/** Warns when T or p lies outside the CIPM-2007 range (the result is still computed). */
export function warnOutsideCipm(ctx: Ctx, temperatureK: number, pressurePa: number, temperatureField: string, pressureField: string): void {
  if (temperatureK < CIPM_RANGE.tMinK || temperatureK > CIPM_RANGE.tMaxK) {
    ctx.warn(temperatureField, 'CIPM-2007 is stated for 15–27 °C; outside it the density is an extrapolation with a larger uncertainty (still a good engineering figure).');
  }
  if (pressurePa < CIPM_RANGE.pMinPa || pressurePa > CIPM_RANGE.pMaxPa) {
    ctx.warn(pressureField, 'CIPM-2007 is stated for 600–1100 hPa; outside it the density is an extrapolation with a larger uncertainty.');
  }
}

const DENSITY_FORMULA =
  '\\rho = \\frac{p\\,M_{a}}{Z\\,R\\,T}\\left[1 - x_{v}\\left(1 - \\frac{M_{v}}{M_{a}}\\right)\\right]';

/** One step: the CIPM-2007 density with x_v and Z already known. */
export function densityStep(ctx: Ctx, title: string, s: MoistAirState, symbol = '\\rho'): void {
  ctx.step(title,
    DENSITY_FORMULA.replace('\\rho', symbol),
    `${symbol} = \\frac{${qty(s.pressurePa, 'Pa')} \\times ${num(M_DRY_AIR * 1000, 7)}\\times 10^{-3}\\,\\mathrm{kg/mol}}{${num(s.compressibility, 6)} \\times ${num(R_MOLAR, 7)}\\,\\mathrm{J/(mol\\,K)} \\times ${qty(s.temperatureK, 'K')}}\\left[1 - ${num(s.moleFractionVapor)}\\left(1 - \\frac{${num(M_WATER * 1000, 7)}}{${num(M_DRY_AIR * 1000, 7)}}\\right)\\right]`,
    `${symbol} = ${qty(s.densityCipm, 'kg/m^3')}`);
}

/** Water vapour content: p_sv, f and x_v. `source` says where the water vapour came from. */
export function vaporSteps(ctx: Ctx, s: MoistAirState, source: 'relative-humidity' | 'dew-point'): void {
  const T = s.temperatureK;
  const tC = T - 273.15;
  ctx.step('Saturation vapour pressure over water at the air temperature (CIPM-2007, Davis 1992)',
    'p_{sv} = \\exp\\left(A T^2 + B T + C + \\frac{D}{T}\\right)',
    `p_{sv} = \\exp\\left(1.2378847\\times 10^{-5} \\times ${num(T, 6)}^2 - 1.9121316\\times 10^{-2} \\times ${num(T, 6)} + 33.93711047 - \\frac{6343.1645}{${num(T, 6)}}\\right)`,
    `p_{sv} = ${qty(s.saturationVaporPressurePa, 'Pa')}`);
  ctx.step('Enhancement factor (water vapour in air, not alone)',
    'f = \\alpha + \\beta p + \\gamma t^2',
    `f = 1.00062 + 3.14\\times 10^{-8} \\times ${num(s.pressurePa)} + 5.6\\times 10^{-7} \\times (${num(tC)})^2`,
    `f = ${num(s.enhancementFactor, 6)}`);
  if (source === 'relative-humidity') {
    ctx.step('Mole fraction of water vapour from relative humidity',
      'x_{v} = h\\,f\\,\\frac{p_{sv}}{p}',
      `x_{v} = ${num(s.relativeHumidity)} \\times ${num(s.enhancementFactor, 6)} \\times \\frac{${qty(s.saturationVaporPressurePa, 'Pa')}}{${qty(s.pressurePa, 'Pa')}}`,
      `x_{v} = ${num(s.moleFractionVapor)}`);
  } else {
    const td = s.dewPointK;
    const fd = s.moleFractionVapor * s.pressurePa;
    ctx.step('Mole fraction of water vapour from the dew point',
      'x_{v} = f(p, t_{d})\\,\\frac{p_{sv}(T_{d})}{p}',
      `x_{v} = \\frac{f(p, ${num(td - 273.15)}\\,{}^{\\circ}\\mathrm{C})\\,p_{sv}(${qty(td, 'K')})}{${qty(s.pressurePa, 'Pa')}} = \\frac{${qty(fd, 'Pa')}}{${qty(s.pressurePa, 'Pa')}}`,
      `x_{v} = ${num(s.moleFractionVapor)}`);
  }
}

/** Compressibility and density by CIPM-2007, with x_v already known. */
export function cipmDensitySteps(ctx: Ctx, s: MoistAirState): void {
  const T = s.temperatureK;
  const tC = T - 273.15;
  const z = compressibilityTerms(T, s.moleFractionVapor);
  ctx.step('Compressibility factor of moist air (CIPM-2007)',
    'Z = 1 - \\frac{p}{T}\\left[a_0 + a_1 t + a_2 t^2 + (b_0 + b_1 t)\\,x_{v} + (c_0 + c_1 t)\\,x_{v}^2\\right] + \\frac{p^2}{T^2}\\left(d + e\\,x_{v}^2\\right)',
    `Z = 1 - \\frac{${num(s.pressurePa)}}{${num(T, 6)}} \\times ${num(z.first)} + \\left(\\frac{${num(s.pressurePa)}}{${num(T, 6)}}\\right)^2 \\times ${num(z.second)}\\quad (t = ${num(tC)},\\ x_{v} = ${num(s.moleFractionVapor)})`,
    `Z = ${num(s.compressibility, 7)}`);
  densityStep(ctx, 'Density of moist air (CIPM-2007)', s);
}

/** Dew point and humidity ratio steps, from the vapour already found. */
export function humiditySteps(ctx: Ctx, s: MoistAirState): void {
  const pv = s.vaporPressurePa;
  ctx.step('Partial pressure of water vapour', 'p_{v} = x_{v}\\,p',
    `p_{v} = ${num(s.moleFractionVapor)} \\times ${qty(s.pressurePa, 'Pa')}`, `p_{v} = ${qty(pv, 'Pa')}`);
  if (Number.isFinite(s.dewPointK)) {
    const below = s.dewPointK < 273.15 ? '\\ \\text{(over supercooled water)}' : '';
    ctx.step('Dew point: the temperature at which this vapour would saturate (solved by Newton iteration)',
      'f(p, t_{d})\\,p_{sv}(T_{d}) = p_{v}',
      `f(p, t_{d})\\,p_{sv}(T_{d}) = ${qty(pv, 'Pa')}`,
      `T_{d} = ${qty(s.dewPointK, 'K')} = ${qty(s.dewPointK - 273.15, 'degC', 4)}${below}`);
  }
  ctx.step('Humidity ratio (mass of water per mass of dry air)',
    'W = \\frac{M_{v}}{M_{a}}\\,\\frac{x_{v}}{1 - x_{v}}',
    `W = \\frac{${num(M_WATER * 1000, 7)}}{${num(M_DRY_AIR * 1000, 7)}} \\times \\frac{${num(s.moleFractionVapor)}}{1 - ${num(s.moleFractionVapor)}}`,
    `W = ${num(s.humidityRatio)}\\,\\mathrm{kg/kg}`);
}

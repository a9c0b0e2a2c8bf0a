/* Input specs several calculators share, so a barometer or thermometer reads the same everywhere. */
import { ABOVE_ZERO_K, ABOVE_ZERO_PA, bound, type InputSpec } from '../define';
import type { InputValue } from '../types';

export const BAROMETER_UNITS = { si: 'hPa', us: 'inHg' } as const;
export const TEST_PRESSURE_UNITS = { si: 'kPa', us: 'inH2O' } as const;

/** An absolute air temperature (above absolute zero). */
export function airTemperature(label: string, symbol: string, example: InputValue, help: string): InputSpec {
  return { label, symbol, kind: 'temperature', min: ABOVE_ZERO_K, example, help };
}

/** An absolute pressure (above a perfect vacuum). */
export function absolutePressure(label: string, symbol: string, example: InputValue, help: string): InputSpec {
  return { label, symbol, kind: 'pressure', min: ABOVE_ZERO_PA, defaultUnit: BAROMETER_UNITS, example, help };
}

/** A pressure drop across a part or orifice (a differential pressure, above zero). */
export function pressureDrop(label: string, symbol: string, example: InputValue, help: string): InputSpec {
  return { label, symbol, kind: 'pressure', min: ABOVE_ZERO_PA, defaultUnit: TEST_PRESSURE_UNITS, example, help };
}

/** Relative humidity 0–100 % (over liquid water). */
export function relativeHumidity(example: InputValue | undefined, extra: Partial<InputSpec> = {}): InputSpec {
  return {
    label: 'Relative humidity',
    symbol: 'h',
    kind: 'percent',
    min: bound(0, '%'),
    max: bound(100, '%'),
    ...(example === undefined ? {} : { example }),
    help: 'From a hygrometer, 0–100 %. Relative to saturation over liquid water, also below 0 °C.',
    ...extra,
  };
}

/** A density, above zero. */
export function density(label: string, example: InputValue, help: string): InputSpec {
  return { label, symbol: '\\rho', kind: 'density', min: bound(0, 'kg/m^3', false), example, help };
}

/** An efficiency: above 0 %, at most 100 %. */
export function efficiency(label: string, symbol: string, example: InputValue, help: string): InputSpec {
  return { label, symbol, kind: 'percent', min: bound(0, '%', false), max: bound(100, '%'), example, help };
}

/** A volume flow (a bench reading, a demand), above zero. */
export function volumeFlow(label: string, symbol: string, example: InputValue | undefined, help: string): InputSpec {
  return { label, symbol, kind: 'volumeFlow', min: bound(0, 'm^3/s', false), ...(example === undefined ? {} : { example }), help };
}

/** A mass flow of air or fuel, above zero. */
export function massFlow(label: string, symbol: string, example: InputValue | undefined, help: string): InputSpec {
  return { label, symbol, kind: 'massFlow', min: bound(0, 'kg/s', false), ...(example === undefined ? {} : { example }), help };
}

/** An engine's swept volume, all cylinders, in litres or cubic inches. */
export function displacement(example: InputValue): InputSpec {
  return {
    label: 'Displacement (all cylinders)',
    symbol: 'V_{d}',
    kind: 'volume',
    defaultUnit: { si: 'L', us: 'in^3' },
    min: bound(0, 'm^3', false),
    example,
    help: 'Total swept volume of the engine.',
  };
}

/** Crankshaft speed, above zero and below a sanity limit no engine reaches. */
export function engineSpeed(help: string): InputSpec {
  return {
    label: 'Engine speed',
    symbol: 'N',
    kind: 'speed',
    min: bound(0, 'rpm', false),
    max: bound(100000, 'rpm'),
    example: { value: 6000, unit: 'rpm' },
    help,
  };
}

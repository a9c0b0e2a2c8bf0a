/*
 * Named standard (reference) conditions for "standard flow". Each is a stated temperature,
 * pressure and humidity; its density comes from the same CIPM-2007 formula as the actual air,
 * so a correction never mixes two density models.
 */
import { moistAir } from './moist-air';
import { convert } from './units';

export interface StandardCondition {
  value: string;
  label: string;
  definition: string;
  temperatureK: number;
  pressurePa: number;
  relativeHumidity: number;
  densityKgM3: number;
}

function condition(value: string, label: string, definition: string, temperatureK: number, pressurePa: number, relativeHumidity: number): StandardCondition {
  const densityKgM3 = moistAir(temperatureK, pressurePa, { relativeHumidity }).densityCipm;
  return { value, label, definition, temperatureK, pressurePa, relativeHumidity, densityKgM3 };
}

export const STANDARD_CONDITIONS: readonly StandardCondition[] = [
  condition('iso-13443', '15 °C, 101.325 kPa, dry (ISO 13443)',
    'ISO 13443 standard reference conditions: 288.15 K, 101 325 Pa, dry air.', 288.15, 101325, 0),
  condition('iso-2533-sea-level', '59 °F, 14.696 psia, dry (ISO 2533 sea level)',
    'Sea level of the ISO 2533 / US 1976 standard atmosphere as the US trade writes it: 59 °F, 14.696 psia, dry air (the same air as ISO 13443 to five figures).',
    288.15, convert(14.696, 'psi', 'Pa'), 0),
  condition('20c-dry', '20 °C, 101.325 kPa, dry',
    'A common industrial reference: 293.15 K, 101 325 Pa, dry air.', 293.15, 101325, 0),
  condition('din-1343', '0 °C, 101.325 kPa, dry (DIN 1343 "normal")',
    'DIN 1343 normal conditions, behind "normal cubic metres" (Nm³): 273.15 K, 101 325 Pa, dry air.', 273.15, 101325, 0),
  // ASME's definition of standard air (its displacement-compressor test code; from memory, review E22):
  // 68 °F, 14.696 psia, 36 % RH, 0.075 lb/ft³. Other "standard air" definitions exist (70 °F dry; 68 °F at 50 % RH).
  // We keep 29.92 inHg, the figure US shops write: 14.6954 psia, 0.004 % below 14.696 psia, too little to matter.
  condition('us-standard-air', '68 °F, 29.92 inHg (14.696 psia), 36 % RH (US standard air)',
    'US standard air as ASME defines it (its displacement-compressor test code): 68 °F, 14.696 psia (29.92 inHg), 36 % relative humidity, about 0.075 lb/ft³ (1.20 kg/m³). Other "standard air" definitions exist, such as 70 °F dry air or 68 °F at 50 % RH: always say which one you used.',
    293.15, convert(29.92, 'inHg', 'Pa'), 0.36),
];

export function findStandard(value: string): StandardCondition | undefined {
  return STANDARD_CONDITIONS.find((s) => s.value === value);
}

/* Short safety cautions shown with calculators whose topic can hurt someone. Each defers to local
   codes, the maker's instructions and licensed practice; lessons carry the full safety notes. */

export const COMPRESSED_AIR_HAZARD =
  'Compressed air can drive debris into eyes and skin and can burst hoses, tanks and parts: depressurise before disconnecting, wear eye protection, and follow local codes and the equipment maker\'s instructions.';

export const BENCH_SUCTION_HAZARD =
  'A running flow bench pulls hard enough to trap hands, hair and loose clothing at the inlet and to pull debris into the machine: keep clear of openings, wear hearing protection, and follow the bench maker\'s instructions and local codes.';

export const CHARGE_AIR_HAZARD =
  'Turbochargers, exhaust parts and charge-air pipes get hot enough to burn, and a charge-air joint that lets go under boost can whip: let parts cool, keep clear of rotating parts, and follow the vehicle maker\'s instructions and licensed practice.';

export const FUEL_HAZARD =
  'Fuel and fuel vapour catch fire easily: work in ventilated space away from sparks and hot parts, keep an extinguisher at hand, and follow local fire codes, the maker\'s instructions and licensed practice when handling fuel systems.';

export const MERCURY_HAZARD =
  'Mercury and its vapour are toxic: prefer a water or digital manometer, never heat or spill mercury, and follow local codes and your shop\'s spill procedure if a mercury instrument breaks.';

import * as fc from 'fast-check';
import { standardAtmosphere } from './atmosphere';

/** Geopotential altitude for a geometric one (US Standard Atmosphere 1976, r0 = 6 356 766 m). */
const geopotential = (z: number) => (6356766 * z) / (6356766 + z);

describe('ISO 2533 / US Standard Atmosphere 1976 (geopotential altitude)', () => {
  it.each([
    // US Standard Atmosphere 1976 / ISO 2533 table, H = 0 m (from memory of the table): 101 325 Pa, 288.15 K, 1.2250 kg/m³
    [0, 101325, 288.15, 1.225],
    // same table, H = 1000 m (from memory of the table): 89 874.6 Pa, 281.65 K, 1.1117 kg/m³
    [1000, 89874.6, 281.65, 1.1117],
    // same table, H = 2000 m (from memory of the table): 79 495.2 Pa, 275.15 K, 1.0065 kg/m³
    [2000, 79495.2, 275.15, 1.0065],
    // same table, H = 5000 m (from memory of the table): 54 019.9 Pa, 255.65 K, 0.73612 kg/m³
    [5000, 54019.9, 255.65, 0.73612],
    // same table, H = 11 000 m (from memory of the table): 22 632.1 Pa, 216.65 K, 0.36392 kg/m³
    [11000, 22632.1, 216.65, 0.36392],
    // same table, H = 15 000 m (from memory of the table): 12 044.6 Pa, 216.65 K, 0.19367 kg/m³
    [15000, 12044.6, 216.65, 0.19367],
    // same table, H = 20 000 m (from memory of the table): 5474.9 Pa, 216.65 K, 0.088035 kg/m³
    [20000, 5474.9, 216.65, 0.088035],
    // same table, H = −1000 m (from memory of the table): 113 929 Pa, 294.65 K, 1.3470 kg/m³
    [-1000, 113929, 294.65, 1.347],
  ])('H = %d m', (h, p, t, rho) => {
    const s = standardAtmosphere(h);
    expect(Math.abs(s.pressurePa / p - 1)).toBeLessThan(1e-5);
    expect(s.temperatureK).toBeCloseTo(t, 6);
    expect(Math.abs(s.densityKgM3 / rho - 1)).toBeLessThan(1e-4);
  });

  it('reproduces the geometric 15 km row when the altitude is converted first', () => {
    // US Standard Atmosphere 1976 table by geometric altitude, z = 15 000 m (from memory of the
    // table): 12 111 Pa, 0.19476 kg/m³ — the 0.19475 figure sometimes paired with 12 044.6 Pa
    // belongs to this geometric row, not to geopotential 15 000 m.
    const s = standardAtmosphere(geopotential(15000));
    expect(Math.abs(s.pressurePa / 12111 - 1)).toBeLessThan(1e-4);
    expect(Math.abs(s.densityKgM3 / 0.19476 - 1)).toBeLessThan(1e-4);
  });

  it('pressure falls with altitude (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -5000, max: 32000, noNaN: true }), fc.double({ min: 1, max: 5000, noNaN: true }), (h, dh) => {
        expect(standardAtmosphere(h + dh).pressurePa).toBeLessThan(standardAtmosphere(h).pressurePa);
      }),
      { numRuns: 200 },
    );
  });
});

import * as fc from 'fast-check';
import { evaluate } from '../index';
import { out, q, run } from './run-calculator.spec-support';


describe('mass-flow', () => {
  it('450 cfm of standard air is 33.75 lb/min', () => {
    const r = run('mass-flow', { volumeFlow: q(450, 'cfm'), density: q(0.075, 'lb/ft^3') }, { massFlow: 'lb/min' });
    // shop common practice: 0.075 lb/ft³ standard air; by hand 450 × 0.075 = 33.75 lb/min
    expect(out(r, 'massFlow')).toBeCloseTo(33.75, 10);
  });

  it('SI by hand, and back from mass flow', () => {
    const r = run('mass-flow', { volumeFlow: q(0.2, 'm^3/s'), density: q(1.2, 'kg/m^3') }, { massFlow: 'g/s' });
    // by hand: 0.2 m³/s × 1.2 kg/m³ = 0.24 kg/s = 240 g/s
    expect(out(r, 'massFlow')).toBeCloseTo(240, 10);
    const back = run('mass-flow', { massFlow: q(240, 'g/s'), density: q(1.2, 'kg/m^3') }, { volumeFlow: 'L/s' });
    expect(out(back, 'volumeFlow')).toBeCloseTo(200, 10);
  });

  it('mass flow is proportional to volume flow (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2000, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }), (cfm, rho) => {
        const r = run('mass-flow', { volumeFlow: q(cfm, 'cfm'), density: q(rho, 'kg/m^3') });
        expect(out(r, 'massFlow')).toBeCloseTo(cfm * 4.719474432e-4 * rho, 12);
      }),
      { numRuns: 50 },
    );
  });
});

describe('fuel-flow', () => {
  it('35 lb/min of air at AFR 12.5 needs 2.8 lb/min of fuel', () => {
    const r = run('fuel-flow', { airMassFlow: q(35, 'lb/min'), airFuelRatio: 12.5 }, { fuelMassFlow: 'lb/h' });
    // by hand: 35 / 12.5 = 2.8 lb/min = 168 lb/h
    expect(out(r, 'fuelMassFlow')).toBeCloseTo(168, 9);
  });

  it('lambda 1 with the gasoline default of 14.7', () => {
    const r = run('fuel-flow', { airMassFlow: q(600, 'g/s'), lambda: 1 }, { fuelMassFlow: 'g/s' });
    // shop common practice: gasoline stoichiometric AFR 14.7; by hand 600 / 14.7 = 40.816 g/s
    expect(out(r, 'fuelMassFlow')).toBeCloseTo(600 / 14.7, 9);
    expect(out(r, 'airFuelRatio')).toBeCloseTo(14.7, 12);
  });

  it('lambda with a stated stoichiometric ratio', () => {
    const r = run('fuel-flow', { airMassFlow: q(100, 'g/s'), lambda: 0.8, stoichiometricRatio: 9.8 }, { fuelMassFlow: 'g/s' });
    // by hand: AFR = 0.8 × 9.8 = 7.84; 100 / 7.84 = 12.755 g/s
    expect(out(r, 'fuelMassFlow')).toBeCloseTo(100 / 7.84, 9);
  });

  // NIST SP 811 B.8: pound (avoirdupois) = 0.453 592 37 kg (exact)
  const LB_G = 453.59237;
  const sams = { airMassFlow: q(100.2, 'g/s'), airFuelRatio: 12.5, injectorCount: 4 };

  it('lesson 6: 15.9 lb/h per cylinder at 80 % duty needs injectors of at least 19.9 lb/h', () => {
    const r = run('fuel-flow', sams, { fuelPerInjector: 'lb/h', minimumInjectorRating: 'lb/h', minimumInjectorRatingVolume: 'cc/min' });
    // lesson 6 / review E6: 100.2 g/s ÷ 12.5 ÷ 4 = 2.004 g/s = 15.9 lb/h per cylinder; ÷ 0.80 (shop common practice) ≈ 19.9 lb/h
    const perInjector = (100.2 / 12.5 / 4) * 3600 / LB_G;
    expect(out(r, 'fuelPerInjector')).toBeCloseTo(perInjector, 9);
    expect(out(r, 'fuelPerInjector')).toBeCloseTo(15.9, 1);
    expect(out(r, 'minimumInjectorRating')).toBeCloseTo(perInjector / 0.8, 9);
    expect(out(r, 'minimumInjectorRating')).toBeCloseTo(19.9, 1);
    // by hand: lb/h → cc/min = × 453.592 37 g/lb ÷ 60 min/h ÷ 0.745 g/cm³ (mid-range EN 228 gasoline, from memory): 201.7 cc/min
    expect(out(r, 'minimumInjectorRatingVolume')).toBeCloseTo(((perInjector / 0.8) * LB_G) / 60 / 0.745, 6);
    expect(out(r, 'minimumInjectorRatingVolume')).toBeCloseTo(201.7, 1);
    expect(r.notes).toEqual([expect.stringContaining('The fuel needed is not the injector size')]);
    expect(r.warnings).toEqual([]);
  });

  it('refers the rating to its own fuel pressure: flow goes with the square root of the pressure across the injector', () => {
    const r = run('fuel-flow', { ...sams, maxDutyCycle: q(75, '%'), fuelDensity: q(0.72, 'kg/L'), ratedFuelPressure: q(3, 'bar'), operatingFuelPressure: q(4, 'bar') },
      { minimumInjectorRating: 'g/s', minimumInjectorRatingVolume: 'cc/min' });
    // lesson 2's square-root rule: an injector rated at 3 bar flows √(4/3) times as much at 4 bar, so the rating needed is smaller
    const rated = (100.2 / 12.5 / 4 / 0.75) * Math.sqrt(3 / 4);
    expect(out(r, 'minimumInjectorRating')).toBeCloseTo(rated, 12);
    // by hand: g/s ÷ 0.72 g/cm³ × 60 s/min
    expect(out(r, 'minimumInjectorRatingVolume')).toBeCloseTo((rated / 0.72) * 60, 9);
    expect(r.notes.some((n) => n.includes('about 15 % more than its rating'))).toBe(true);
  });

  it('warns when only one fuel pressure is given, or the duty cycle leaves little margin', () => {
    const one = run('fuel-flow', { ...sams, operatingFuelPressure: q(58, 'psi') });
    expect(one.warnings.map((w) => w.field)).toEqual(['ratedFuelPressure']);
    const flatOut = run('fuel-flow', { ...sams, maxDutyCycle: q(95, '%') });
    expect(flatOut.warnings.map((w) => w.field)).toEqual(['maxDutyCycle']);
    const half = evaluate('fuel-flow', { inputs: { ...sams, injectorCount: 4.5 } });
    expect(half.ok ? [] : half.errors.map((e) => e.field)).toEqual(['injectorCount']);
  });

  it('no injector count, no sizing', () => {
    const r = run('fuel-flow', { airMassFlow: q(100.2, 'g/s'), airFuelRatio: 12.5 });
    expect(Object.keys(r.outputs).sort()).toEqual(['airFuelRatio', 'fuelMassFlow', 'lambda']);
    expect(r.notes).toEqual([]);
  });

  it('the rating needed falls as the duty cycle or the pressure in use rises (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 30, max: 95, noNaN: true }), fc.double({ min: 1, max: 5, noNaN: true }), fc.double({ min: 2, max: 6, noNaN: true }), (duty, more, bar) => {
        const rating = (d: number, p: number) => out(run('fuel-flow', { ...sams, maxDutyCycle: q(d, '%'), ratedFuelPressure: q(3, 'bar'), operatingFuelPressure: q(p, 'bar') }), 'minimumInjectorRating');
        expect(rating(duty + more, bar)).toBeLessThan(rating(duty, bar));
        expect(rating(duty, bar + 0.5)).toBeLessThan(rating(duty, bar));
      }),
      { numRuns: 50 },
    );
  });

  it('needs one of AFR or lambda, not both', () => {
    const both = evaluate('fuel-flow', { inputs: { airMassFlow: q(1, 'kg/s'), airFuelRatio: 12, lambda: 0.9 } });
    expect(both.ok ? [] : both.errors.map((e) => e.field)).toEqual(['lambda']);
  });
});

describe('gas-compression', () => {
  it('one pound of air squeezed from 10 to 100 psi absolute at constant temperature takes a tenth of the volume', () => {
    // shop common practice: Boyle's law, 10 → 100 psia at constant temperature → V/10
    // (a pound of air at 10 psia and 68 °F is about 16.2 ft³: the volume is given, the mass is fixed)
    const r = run('gas-compression', { pressure1: q(10, 'psi'), volume1: q(16.2, 'ft^3'), temperature1: q(68, 'degF'), pressure2: q(100, 'psi') }, { volume2: 'ft^3' });
    expect(out(r, 'volume2')).toBeCloseTo(1.62, 10);
  });

  it('Charles: doubling the absolute temperature at constant pressure doubles the volume', () => {
    const r = run('gas-compression', { pressure1: q(1, 'bar'), volume1: q(1, 'L'), temperature1: q(300, 'K'), pressure2: q(1, 'bar'), temperature2: q(600, 'K') }, { volume2: 'L' });
    expect(out(r, 'volume2')).toBeCloseTo(2, 12);
  });

  it('combined gas law by hand', () => {
    const r = run('gas-compression', { pressure1: q(100, 'kPa'), volume1: q(1, 'm^3'), temperature1: q(300, 'K'), pressure2: q(200, 'kPa'), temperature2: q(330, 'K') });
    // by hand: 1 × (100/200) × (330/300) = 0.55 m³
    expect(out(r, 'volume2')).toBeCloseTo(0.55, 12);
  });

  it('volume falls as pressure rises (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 200, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (p2, dp) => {
        const at = (p: number) => out(run('gas-compression', { pressure1: q(14.7, 'psi'), volume1: q(1, 'ft^3'), temperature1: q(20, 'degC'), pressure2: q(p, 'psi') }), 'volume2');
        expect(at(p2 + dp)).toBeLessThan(at(p2));
      }),
      { numRuns: 50 },
    );
  });
});

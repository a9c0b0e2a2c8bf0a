import * as fc from 'fast-check';
import { convert, evaluate } from '../index';
import type { InputValue } from '../index';
import { out, q, run } from './run-calculator.spec-support';

const fields = (r: { warnings: { field: string }[] }) => r.warnings.map((w) => w.field);
const hp = { power: 'hp', headFlowPower: 'hp' };

describe('power-potential: reference values', () => {
  it('9.6 hp per lb/min at AFR 12.5 and BSFC 0.50 lb/(hp·h)', () => {
    const r = run('power-potential', { airMassFlow: q(1, 'lb/min'), airFuelRatio: 12.5, bsfc: q(0.5, 'lb/(hp h)') }, hp);
    // course-review-1 §2 G3 (Heywood §2.9 BSFC definition; the BSFC value is shop practice): hp ≈ ṁ[lb/min] × 60/(AFR × BSFC) = 9.6 hp per lb/min
    expect(out(r, 'power')).toBeCloseTo(60 / (12.5 * 0.5), 9);
    expect(out(r, 'power')).toBeCloseTo(9.6, 9);
  });

  it('AFR 12.5 and BSFC 0.50 lb/(hp·h) are the defaults', () => {
    const r = run('power-potential', { airMassFlow: q(1, 'lb/min') }, hp);
    expect(out(r, 'power')).toBeCloseTo(9.6, 9);
    expect(r.steps.map((s) => s.title).join(' ')).toMatch(/shop common practice/);
  });

  it('the lesson 3 engine gives about 160 hp both ways', () => {
    // content/lessons/03-volume-flow.md: 2.0 L four-cylinder at 7000 rpm, 90 % VE, 1.18 kg/m³ (222.5 cfm); one port ~160.2 cfm at 28 inH2O
    const demand = run('engine-demand', { displacement: q(2.0, 'L'), speed: q(7000, 'rpm'), volumetricEfficiency: q(90, '%'), density: q(1.18, 'kg/m^3') },
      { massFlow: 'lb/min' });
    // course-review-1 E17: 16.4 lb/min for the L3 engine
    expect(out(demand, 'massFlow')).toBeCloseTo(16.39, 2);
    const r = run('power-potential', { airMassFlow: q(out(demand, 'massFlow'), 'lb/min'), headFlow: q(160.2, 'cfm'), cylinders: 4 }, hp);
    // course-review-1 E17 and G3 (shop rules of thumb, from memory): 16.4 lb/min × ~10 hp per lb/min ≈ 160 hp; 160 cfm × 0.257 × 4 ≈ 164 hp
    // by hand: 16.392 × 60 / 6.25 = 157.36 hp; 160.2 × 0.257 × 4 = 164.69 hp
    expect(out(r, 'power')).toBeCloseTo(157.36, 1);
    expect(out(r, 'headFlowPower')).toBeCloseTo(164.69, 1);
    for (const name of ['power', 'headFlowPower']) expect(Math.abs(out(r, name) / 160 - 1)).toBeLessThan(0.05);
    expect(r.warnings).toEqual([]);
  });

  it('works in SI: 125 g/s at 300 g/(kW·h) and AFR 12.5 is 120 kW', () => {
    // by hand: fuel 125/12.5 = 10 g/s = 36 000 g/h; 36 000 / 300 = 120 kW
    const r = run('power-potential', { airMassFlow: q(125, 'g/s'), bsfc: q(300, 'g/(kW h)') }, { power: 'kW' });
    expect(out(r, 'power')).toBeCloseTo(120, 9);
  });

  it('scales a head flow taken at another test pressure to 28 inH2O, with a warning', () => {
    const r = run('power-potential', { airMassFlow: q(16.4, 'lb/min'), headFlow: q(100, 'cfm'), cylinders: 4, headFlowTestPressure: q(10, 'inH2O') }, hp);
    // by hand: 100 × √(28/10) = 167.332 cfm at 28 inH2O; × 0.257 × 4 = 172.017 hp
    expect(out(r, 'headFlowPower')).toBeCloseTo(172.017, 2);
    expect(fields(r)).toEqual(['headFlowTestPressure']);
  });

  it('takes 7 kPa as 28 inH2O (28.1 inH2O, within 2 %)', () => {
    const r = run('power-potential', { airMassFlow: q(125, 'g/s'), headFlow: q(75, 'L/s'), cylinders: 4, headFlowTestPressure: q(7, 'kPa') });
    expect(r.warnings).toEqual([]);
  });

  it('states its caveats as notes', () => {
    const r = run('power-potential', { airMassFlow: q(16.4, 'lb/min'), headFlow: q(160, 'cfm'), cylinders: 4 });
    const notes = r.notes.join(' ');
    for (const words of [/potential, not a prediction/, /BSFC/, /cam/, /exhaust/, /naturally aspirated/, /28 inH2O/]) expect(notes).toMatch(words);
  });

  it('says when the two routes are far apart', () => {
    const r = run('power-potential', { airMassFlow: q(10, 'lb/min'), headFlow: q(160, 'cfm'), cylinders: 4 });
    expect(r.notes.join(' ')).toMatch(/well above the mass route/);
  });

  it('needs whole cylinders for the head-flow check', () => {
    const base: Record<string, InputValue> = { airMassFlow: q(16.4, 'lb/min'), headFlow: q(160, 'cfm') };
    const missing = evaluate('power-potential', { inputs: base });
    expect(missing.ok ? [] : missing.errors.map((e) => e.field)).toEqual(['cylinders']);
    const half = evaluate('power-potential', { inputs: { ...base, cylinders: 4.5 } });
    expect(half.ok ? [] : half.errors.map((e) => e.field)).toEqual(['cylinders']);
    expect(fields(run('power-potential', { airMassFlow: q(16.4, 'lb/min'), cylinders: 4 }))).toEqual(['headFlow']);
  });

  it('warns on a BSFC no car engine reaches', () => {
    expect(fields(run('power-potential', { airMassFlow: q(16.4, 'lb/min'), bsfc: q(0.25, 'lb/(hp h)') }))).toEqual(['bsfc']);
    expect(convert(0.3, 'lb/(hp h)', 'g/(kW h)')).toBeCloseTo(182.5, 1);
  });
});

describe('power-potential: properties', () => {
  it('power is linear in air mass flow and inverse in AFR × BSFC', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 100, noNaN: true }),
        fc.double({ min: 1.1, max: 5, noNaN: true }),
        fc.double({ min: 8, max: 18, noNaN: true }),
        fc.double({ min: 0.35, max: 1.2, noNaN: true }),
        (m, k, afr, bsfc) => {
          const p = (mass: number, a: number, b: number) =>
            out(run('power-potential', { airMassFlow: q(mass, 'lb/min'), airFuelRatio: a, bsfc: q(b, 'lb/(hp h)') }, hp), 'power');
          expect(p(k * m, afr, bsfc) / p(m, afr, bsfc)).toBeCloseTo(k, 9);
          expect(p(m, afr, bsfc)).toBeCloseTo((m * 60) / (afr * bsfc), 6);
        },
      ),
      { numRuns: 50 },
    );
  });

  it('the head-flow figure is linear in cylinders and in head flow', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 16 }), fc.double({ min: 20, max: 400, noNaN: true }), (n, cfm) => {
        const r = run('power-potential', { airMassFlow: q(16.4, 'lb/min'), headFlow: q(cfm, 'cfm'), cylinders: n }, hp);
        // shop folklore (from memory): 0.257 hp per cfm at 28 inH2O per cylinder
        expect(out(r, 'headFlowPower')).toBeCloseTo(0.257 * cfm * n, 6);
      }),
      { numRuns: 50 },
    );
  });
});

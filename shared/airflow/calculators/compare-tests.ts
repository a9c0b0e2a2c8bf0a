/*
 * Comparing two tests (our design, after the GUM, JCGM 100:2008): did a change to a part (a
 * port job, a new throttle body) change its flow? Each configuration is flowed n times, refitted
 * between runs. The difference of the means Δ = x̄_B − x̄_A has (GUM §5.2, correlated inputs)
 *   u²(Δ) = u²(x̄_A) + u²(x̄_B) − 2 r u(x̄_A) u(x̄_B).
 * Components both tests share (the bench calibration, the same orifice, the same ambient sensors
 * on the same day) have r ≈ 1 and equal size, so they cancel from the difference. What is left is
 * repeatability: the Type A term s/√n of each mean, with ν = n − 1 (GUM §4.2). Tests on different
 * days add each day's ambient-correction term; on different benches, each bench's calibration
 * too (r = 0 between them). U₉₅ = t₉₅(ν_eff)·u(Δ), ν_eff by Welch–Satterthwaite (GUM G.4.2).
 * A change is shown when |Δ| > U₉₅ (course review 1, E1).
 */
import { bound, defineCalculator, type InputSpec } from '../define';
import { lines, num, qty, unitTex } from '../latex';
import { tFactor95, wholeDegreesOfFreedom } from '../student-t';
import { type BudgetTerm, mean, sampleStandardDeviation, welchSatterthwaite } from '../uncertainty';
import { convert } from '../units';

/*
 * The defaults come from the course's uncertainty budget (lesson 9,
 * content/lessons/09-comparing-tests.md; lesson 8's before the split). Ambient: air density
 * 1.1837 kg/m³ with a standard uncertainty of 0.00163 kg/m³ (±0.5 K, ±1.5 hPa, ±3 % RH read as
 * rectangular), 0.138 % relative. The bench-reading correction Q·√(ρ/ρ_std) of lesson 5 has a
 * relative sensitivity of ½ to ρ, so one day's ambient correction carries ½ × 0.138 % ≈ 0.07 %
 * of the flow. Calibration: the lesson's bench is good to ±2 % of reading, read as rectangular:
 * 2 %/√3 = 1.15 %.
 */
export const AMBIENT_RELATIVE_UNCERTAINTY_PERCENT = 0.07;
export const CALIBRATION_RELATIVE_UNCERTAINTY_PERCENT = 1.15;

const READINGS = { min: 2, max: 30 } as const;
const SI = 'm^3/s';

const readings = (label: string, symbol: string, example: number[], exampleSi: number[], help: string): InputSpec => ({
  label, symbol, kind: 'volumeFlow', list: READINGS, min: bound(0, SI, false),
  example: { values: example, unit: 'cfm' }, exampleSi: { values: exampleSi, unit: 'L/s' }, help,
});

const relative = (label: string, symbol: string, fallback: number, help: string): InputSpec => ({
  label, symbol, kind: 'percent', optional: true, default: { value: fallback, unit: '%' }, min: bound(0, '%'), max: bound(20, '%'), help,
});

interface SetStats { name: 'A' | 'B'; n: number; sum: number; mean: number; squares: number; s: number; u: number }

function describeSet(name: 'A' | 'B', x: readonly number[]): SetStats {
  const m = mean(x);
  const s = sampleStandardDeviation(x);
  return { name, n: x.length, sum: x.reduce((t, v) => t + v, 0), mean: m, squares: x.reduce((t, v) => t + (v - m) ** 2, 0), s, u: s / Math.sqrt(x.length) };
}

/** Δ and U rounded alike: U to two significant figures (GUM 7.2.6), Δ to the same decimal place. */
function rounded(delta: number, expanded: number): [string, string] {
  const decimals = expanded > 0 ? Math.min(12, Math.max(0, 1 - Math.floor(Math.log10(expanded)))) : 1;
  const d = delta.toFixed(decimals);
  return [/^-0(\.0*)?$/.test(d) ? d.slice(1) : d.replace('-', '−'), expanded.toFixed(decimals)];
}

/** A unit as plain text: `m^3/h` → `m³/h`. */
const plainUnit = (unit: string) => unit.replace(/\^2/g, '²').replace(/\^3/g, '³');

export const compareTests = defineCalculator({
  id: 'compare-tests',
  title: 'Comparing two tests: is the change real?',
  topic: 'Sensors and uncertainty',
  summary:
    'Whether a change in flow between two sets of repeat runs (before and after porting) is shown: means, standard deviations, the difference with its uncertainty, Welch–Satterthwaite degrees of freedom, the Student t factor and a 95 % expanded uncertainty (GUM §5.2 and Annex G). Components both tests share cancel from the difference.',
  inputs: {
    readingsA: readings('Readings A (before, or stock)', 'x_{A}', [248.8, 250.0, 251.2], [117, 118, 119],
      'The flow of each run of the first part or setup, at one test pressure and corrected the same way. Refit the part between runs.'),
    readingsB: readings('Readings B (after, or ported)', 'x_{B}', [252.8, 254.0, 255.2], [120, 121, 122],
      'The flow of each run of the second part or setup, tested the same way as A.'),
    setup: {
      label: 'How the two tests were made', symbol: '', kind: 'option', optional: true, default: 'same-day', example: 'same-day',
      options: [
        { value: 'same-day', label: 'Same bench, orifice and day', help: 'Calibration, orifice and ambient sensors are shared, so they cancel. Only the scatter of the runs counts.' },
        { value: 'different-days', label: 'Same bench and orifice, different days', help: "The calibration still cancels. Each day's ambient correction adds its own uncertainty." },
        { value: 'different-benches', label: 'Different benches', help: "Nothing cancels: each bench's calibration and each day's ambient correction add their uncertainty." },
      ],
      help: 'Which parts of the measurement the two tests share. Shared parts cancel from the difference.',
    },
    ambientUncertainty: relative('Ambient uncertainty, one day', 'w_{amb}', AMBIENT_RELATIVE_UNCERTAINTY_PERCENT,
      "Relative standard uncertainty of one day's correction to standard conditions, from the ambient sensors. Empty: 0.07 %, from the density budget of lesson 9. Used for different days or benches."),
    calibrationUncertainty: relative('Bench calibration uncertainty', 'w_{cal}', CALIBRATION_RELATIVE_UNCERTAINTY_PERCENT,
      "Relative standard uncertainty of one bench's calibration. Empty: 1.15 %, a ±2 % calibration read as rectangular (2 %/√3), as in lesson 9. Used for different benches only."),
  },
  outputs: {
    meanA: { label: 'Mean of A', symbol: '\\bar x_{A}', kind: 'volumeFlow', us: 'cfm' },
    meanB: { label: 'Mean of B', symbol: '\\bar x_{B}', kind: 'volumeFlow', us: 'cfm' },
    stdDevA: { label: 'Standard deviation of A (scatter of the runs)', symbol: 's_{A}', kind: 'volumeFlow', us: 'cfm' },
    stdDevB: { label: 'Standard deviation of B (scatter of the runs)', symbol: 's_{B}', kind: 'volumeFlow', us: 'cfm' },
    difference: { label: 'Difference B − A', symbol: '\\Delta', kind: 'volumeFlow', us: 'cfm', help: 'Positive: B flows more than A.' },
    differenceStandardUncertainty: { label: 'Standard uncertainty of the difference', symbol: 'u(\\Delta)', kind: 'volumeFlow', us: 'cfm' },
    effectiveDegreesOfFreedom: { label: 'Effective degrees of freedom', symbol: '\\nu_{eff}', kind: 'ratio', us: '',
      help: 'Welch–Satterthwaite. Left out when it is infinite (no scatter in the runs).' },
    coverageFactor: { label: 'Coverage factor (Student t, 95 %)', symbol: 'k', kind: 'ratio', us: '' },
    differenceExpandedUncertainty: { label: 'Expanded uncertainty of the difference (95 %)', symbol: 'U_{95}', kind: 'volumeFlow', us: 'cfm' },
  },
  compute(ctx) {
    const sets = [describeSet('A', ctx.values('readingsA')), describeSet('B', ctx.values('readingsB'))] as const;
    const [a, b] = sets;
    for (const s of sets) {
      // Only absurd figures (beyond about 1e150 m³/s) overflow the sum of squares.
      if (!Number.isFinite(s.s)) ctx.fail(`readings${s.name}`, `Readings ${s.name} are too large to work with. Check the readings and their unit.`);
    }
    const si = (x: number, sig = 5) => qty(x, SI, sig);
    const per = (f: (s: SetStats) => string) => lines(sets.map(f));
    ctx.step('Mean of each set of readings', '\\bar x = \\frac{1}{n}\\sum_{i=1}^{n} x_i',
      per((s) => `\\bar x_{${s.name}} = \\frac{${si(s.sum, 6)}}{${s.n}}`), per((s) => `\\bar x_{${s.name}} = ${si(s.mean, 6)}`));
    ctx.step('Scatter of each set: the sample standard deviation', 's = \\sqrt{\\frac{\\sum_i (x_i - \\bar x)^2}{n - 1}}',
      per((s) => `s_{${s.name}} = \\sqrt{\\frac{${num(s.squares, 4)}\\,(${unitTex(SI)})^{2}}{${s.n - 1}}}`), per((s) => `s_{${s.name}} = ${si(s.s, 4)}`));
    ctx.step('Standard uncertainty of each mean (Type A, GUM 4.2)', 'u(\\bar x) = \\frac{s}{\\sqrt{n}},\\quad \\nu = n - 1',
      per((s) => `u(\\bar x_{${s.name}}) = \\frac{${si(s.s, 4)}}{\\sqrt{${s.n}}}`),
      per((s) => `u(\\bar x_{${s.name}}) = ${si(s.u, 4)},\\quad \\nu_{${s.name}} = ${s.n - 1}`));
    for (const s of sets) {
      if (s.s === 0) ctx.warn(`readings${s.name}`, `Readings ${s.name} do not scatter at all. Real runs always differ a little: record them to more digits.`);
    }
    const difference = b.mean - a.mean;
    ctx.step('Difference of the means', '\\Delta = \\bar x_{B} - \\bar x_{A}',
      `\\Delta = ${si(b.mean, 6)} - ${si(a.mean, 6)}`, `\\Delta = ${si(difference, 4)}`);

    const setup = ctx.option('setup');
    const terms: BudgetTerm[] = sets.map((s) => ({ contribution: s.u, degreesOfFreedom: s.n - 1 }));
    const termTex = sets.map((s) => `u(\\bar x_{${s.name}})`);
    const added: string[] = [];
    const addShare = (symbol: string, w: number, what: string) => {
      for (const s of sets) {
        const u = w * s.mean;
        terms.push({ contribution: u, degreesOfFreedom: Number.POSITIVE_INFINITY });
        termTex.push(`u_{${what},${s.name}}`);
        added.push(`u_{${what},${s.name}} = ${symbol}\\,\\bar x_{${s.name}} = ${num(w * 100, 3)}\\,\\% \\times ${si(s.mean)} = ${si(u, 4)}`);
      }
    };
    const notes: Record<string, string> = {
      'same-day': 'Same bench, orifice and day: the calibration and the ambient correction are shared and cancel, so only the scatter of the runs counts.',
      'different-days': "Different days: each day's ambient correction is counted. The bench calibration is shared and still cancels.",
      'different-benches': "Different benches: each bench's calibration and each day's ambient correction are counted. Nothing cancels.",
    };
    const reasons: string[] = [];
    if (setup === 'same-day') {
      reasons.push('\\text{calibration, orifice, ambient sensors: shared, } r \\approx 1,\\ \\text{equal size} \\Rightarrow \\text{they cancel}');
    } else if (setup === 'different-days') {
      reasons.push('\\text{calibration, orifice: shared, } r \\approx 1 \\Rightarrow \\text{they cancel}',
        '\\text{ambient correction: one per day, } r = 0 \\Rightarrow \\text{add each}');
      addShare('w_{amb}', ctx.value('ambientUncertainty'), 'amb');
    } else {
      reasons.push('\\text{different benches: nothing shared, } r = 0 \\Rightarrow \\text{add each term}');
      addShare('w_{amb}', ctx.value('ambientUncertainty'), 'amb');
      addShare('w_{cal}', ctx.value('calibrationUncertainty'), 'cal');
    }
    ctx.step('Which components cancel (GUM 5.2, correlated inputs)',
      'u^2(\\Delta) = u^2(\\bar x_{A}) + u^2(\\bar x_{B}) - 2\\,r\\,u(\\bar x_{A})\\,u(\\bar x_{B})',
      lines(reasons), lines(added.length > 0 ? added : ['u^2(\\Delta) = u^2(\\bar x_{A}) + u^2(\\bar x_{B})']));

    const combined = Math.sqrt(terms.reduce((t, term) => t + term.contribution ** 2, 0));
    ctx.step('Standard uncertainty of the difference', `u(\\Delta) = \\sqrt{${termTex.map((t) => `${t}^2`).join(' + ')}}`,
      `u(\\Delta) = \\sqrt{${terms.map((t) => `(${num(t.contribution, 4)})^2`).join(' + ')}}\\,${unitTex(SI)}`, `u(\\Delta) = ${si(combined, 4)}`);

    const nuEff = welchSatterthwaite(terms);
    const whole = wholeDegreesOfFreedom(nuEff);
    const typeB = terms.length > 2 ? ' \\quad (\\nu = \\infty \\text{ for the other terms})' : '';
    ctx.step('Effective degrees of freedom (Welch–Satterthwaite, GUM G.4.2)', '\\nu_{eff} = \\frac{u^4(\\Delta)}{\\sum_i u_i^4/\\nu_i}',
      `\\nu_{eff} = \\frac{(${num(combined, 4)})^4}{${sets.map((s) => `(${num(s.u, 4)})^4/${s.n - 1}`).join(' + ')}}${typeB}`,
      Number.isFinite(nuEff) ? `\\nu_{eff} = ${num(nuEff, 4)}${Math.abs(whole - nuEff) < 1e-9 * nuEff ? '' : ` \\rightarrow ${whole}\\ \\text{(next lower whole number, GUM G.4.1)}`}` : '\\nu_{eff} = \\infty');

    const k = tFactor95(nuEff);
    ctx.step('Coverage factor for 95 %: Student t (GUM Table G.2)', 'k = t_{95}(\\nu_{eff})',
      `k = t_{95}(${Number.isFinite(nuEff) ? whole : '\\infty'})`, `k = ${num(k, 4)}`);
    const expanded = k * combined;
    ctx.step('Expanded uncertainty of the difference (95 %)', 'U_{95} = k\\,u(\\Delta)',
      `U_{95} = ${num(k, 4)} \\times ${si(combined, 4)}`, `U_{95} = ${si(expanded, 3)}`);

    const shown = Math.abs(difference) > expanded;
    const verdictTex = shown ? (difference > 0 ? '\\text{a gain is shown}' : '\\text{a loss is shown}') : '\\text{no change is shown}';
    ctx.step('Is the change shown?', '|\\Delta| > U_{95} \\Rightarrow \\text{shown}',
      `|\\Delta| = ${si(Math.abs(difference), 3)},\\quad U_{95} = ${si(expanded, 3)}`, verdictTex);

    const unit = ctx.unit('readingsA');
    const [d, u] = rounded(convert(shown ? Math.abs(difference) : difference, SI, unit), convert(expanded, SI, unit));
    const text = `${d} ± ${u} ${plainUnit(unit)}`;
    ctx.note(shown
      ? `A ${difference > 0 ? 'gain' : 'loss'} of ${text} is shown (95 % confidence).`
      : `A difference of ${text} is not shown: it is no larger than its uncertainty.`);
    ctx.note(notes[setup] ?? '');
    if (Math.min(a.n, b.n) === 2) ctx.note('With only two runs of a set, the t factor is large. Three or more runs of each make the uncertainty much smaller.');
    ctx.note('This covers the scatter of these runs and the terms above. It does not cover a change to the setup between the tests, such as another adapter, seal or test pressure.');

    return {
      meanA: a.mean, meanB: b.mean, stdDevA: a.s, stdDevB: b.s, difference,
      differenceStandardUncertainty: combined,
      ...(Number.isFinite(nuEff) ? { effectiveDegreesOfFreedom: nuEff } : {}),
      coverageFactor: k,
      differenceExpandedUncertainty: expanded,
    };
  },
});

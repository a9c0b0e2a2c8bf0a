import { join } from 'node:path';

import { describeCalculator, evaluate, withExampleDefaults } from '../../shared/airflow';
import { brokenLinks, loadLessonLibrary } from './lesson-library';

// The content test suite: a lesson that would not render, or that states a number the engine
// does not reproduce, fails here instead of reaching a reader.
const library = loadLessonLibrary(join(__dirname, '../../content/lessons'));
const only = process.env['LESSON'];
const lessons = library.lessons.filter((l) => !only || l.meta.slug === only);
const HAZARDS = /compressed air|suction|noise|hot |rotating|electrical|mains|fuel/i;

describe('the course content', () => {
  it('renders every lesson file without an error (front matter, KaTeX, blocks)', () => {
    expect(library.errors).toEqual([]);
  });

  it('has the ten lessons of the course, unique slugs and orders 1…10, and a free first lesson', () => {
    if (only) return;
    expect(library.lessons).toHaveLength(10);
    const orders = library.lessons.map((l) => l.meta.order);
    expect(orders).toEqual(orders.map((_, i) => i + 1));
    expect(new Set(library.lessons.map((l) => l.meta.slug)).size).toBe(library.lessons.length);
    expect(library.lessons[0]?.meta.free).toBe(true);
  });

  it('has no broken link inside the course', () => {
    expect(brokenLinks(library).filter((line) => !only || line.startsWith(`${only}:`))).toEqual([]);
  });
});

describe.each(lessons.map((l) => [l.meta.slug, l] as const))('lesson %s', (_slug, lesson) => {
  it('has at least 900 words of prose', () => {
    expect(lesson.wordCount).toBeGreaterThanOrEqual(900);
  });

  it('has at least two worked examples with result lines and one live calculator', () => {
    expect(lesson.results.length).toBeGreaterThanOrEqual(2);
    expect(lesson.embeds.length).toBeGreaterThanOrEqual(1);
  });

  it('embeds only calculators that exist, with presets the engine accepts', () => {
    for (const embed of lesson.embeds) {
      expect(describeCalculator(embed.calculator)).toBeDefined();
      const request = withExampleDefaults(embed.calculator, embed.inputs) ?? { inputs: embed.inputs };
      const outcome = evaluate(embed.calculator, request);
      expect({ calculator: embed.calculator, errors: outcome.ok ? [] : outcome.errors }).toEqual({ calculator: embed.calculator, errors: [] });
    }
  });

  it('states worked-example results that the engine reproduces within their rounding', () => {
    for (const result of lesson.results) {
      const request = { ...(withExampleDefaults(result.calculator, result.inputs) ?? { inputs: result.inputs }), outputUnits: { [result.output]: result.unit } };
      const outcome = evaluate(result.calculator, request);
      const label = `${result.calculator} → ${result.output} = ${result.value} ${result.unit}`;
      expect({ label, errors: outcome.ok ? [] : outcome.errors }).toEqual({ label, errors: [] });
      if (!outcome.ok) continue;
      const computed = outcome.result.outputs[result.output]?.value;
      expect({ label, computed, close: computed !== undefined && Math.abs(computed - result.value) <= result.tolerance + 1e-12 }).toEqual({ label, computed, close: true });
    }
  });

  it('shows a caution wherever a hazard appears', () => {
    if (HAZARDS.test(lesson.html.replace(/<[^>]+>/g, ' '))) expect(lesson.html).toContain('class="lesson-caution"');
  });

  it('typesets its mathematics with KaTeX', () => {
    expect(lesson.html).toContain('class="katex"');
    expect(lesson.html).not.toContain('katex-error');
  });
});

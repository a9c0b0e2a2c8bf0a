import { parsePresetValue } from './preset-values';
import { renderLesson } from './render-lesson';

const frontMatter = `---
title: A lesson for testing
slug: testing
order: 1
summary: A lesson written inside a test to exercise the renderer.
minutes: 10
free: true
objectives:
  - Read a pressure gauge
  - Convert a flow reading
  - Work safely
---
`;

describe('renderLesson', () => {
  it('strips script, event handlers and javascript: links from a lesson', () => {
    const lesson = renderLesson(
      `${frontMatter}\n## Hello\n\n<script>alert('x')</script>\n\n<img src="x" onerror="alert(1)">\n\n[click](javascript:alert(2))\n\n<a href="/course" onclick="steal()">course</a>\n`,
      'evil.md',
    );
    expect(lesson.html).not.toMatch(/<script|onerror|onclick|javascript:/i);
    expect(lesson.html).toContain('<h2 id="hello">Hello</h2>');
  });

  it('keeps KaTeX markup through the sanitiser', () => {
    const lesson = renderLesson(`${frontMatter}\nInline $Q = C_d A$ and display:\n\n$$\n\\sqrt{\\frac{a}{b}}\n$$\n`, 'math.md');
    expect(lesson.html).toContain('class="katex"');
    expect(lesson.html).toContain('<math');
    expect(lesson.html).toContain('style="height:');
    expect(lesson.html).toContain('<annotation encoding="application/x-tex">');
  });

  it('fails on mathematics KaTeX cannot parse', () => {
    expect(() => renderLesson(`${frontMatter}\nBroken $\\frac{1}{$ here.\n`, 'bad-math.md')).toThrow(/bad-math\.md/);
  });

  it('fails on missing front matter fields and on unknown blocks', () => {
    expect(() => renderLesson('---\ntitle: x\n---\nHi', 'thin.md')).toThrow(/thin\.md: front matter/);
    expect(() => renderLesson(`${frontMatter}\n:::sidebar\nx\n:::\n`, 'block.md')).toThrow(/unknown block ":::sidebar"/);
    expect(() => renderLesson(`${frontMatter}\n:::example No result\nprose\n:::\n`, 'ex.md')).toThrow(/no result line/);
  });

  it('collects embeds and result lines in order, leaving placeholders in the HTML', () => {
    const lesson = renderLesson(
      `${frontMatter}\n:::example Two readings\nText.\n\n=> mass-flow | volumeFlow=100 cfm, density=1.2 kg/m^3 | massFlow = 0.0566 kg/s\n:::\n\n:::calculator air-density\ntemperature: 68 degF\nmethod: ideal-dry\n:::\n\n:::check Why?\nBecause.\n:::\n`,
      'blocks.md',
    );
    expect(lesson.results).toEqual([
      expect.objectContaining({ index: 0, calculator: 'mass-flow', output: 'massFlow', value: 0.0566, unit: 'kg/s', tolerance: 0.00005 }),
    ]);
    expect(lesson.embeds).toEqual([{ index: 0, calculator: 'air-density', inputs: { temperature: { value: 68, unit: 'degF' }, method: 'ideal-dry' } }]);
    expect(lesson.html).toContain('data-try="0"');
    expect(lesson.html).toContain('data-embed="0"');
    expect(lesson.html).toContain('<details class="lesson-check"><summary>Check yourself: Why?</summary>');
  });

  it('renders a common-mistakes box', () => {
    const lesson = renderLesson(`${frontMatter}\n:::mistakes\n- Reading one leg of a U-tube: read both.\n:::\n`, 'mistakes.md');
    expect(lesson.html).toContain('<aside class="lesson-mistakes" aria-label="Common mistakes"><p class="lesson-block-label">Common mistakes</p><ul>');
  });

  it('inlines a figure as sanitised SVG with its text alternative and caption', () => {
    const svg = `<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10" role="img" aria-labelledby="f-t f-d"><title id="f-t">A box</title><desc id="f-d">One square.</desc><script>alert(1)</script><rect width="5" height="5" onclick="steal()" fill="currentColor"/></svg>`;
    const lesson = renderLesson(`${frontMatter}\n:::figure box\nThe *box*.\n:::\n`, 'figure.md', { figure: (stem) => (stem === 'box' ? svg : undefined) });
    expect(lesson.html).toMatch(/^<figure class="lesson-figure"><svg [^>]*role="img"[^>]*>/);
    expect(lesson.html).toContain('aria-labelledby="f-t f-d"');
    expect(lesson.html).toContain('<title id="f-t">A box</title><desc id="f-d">One square.</desc>');
    expect(lesson.html).toContain('<figcaption><p>The <em>box</em>.</p>\n</figcaption></figure>');
    expect(lesson.html).not.toMatch(/<script|onclick|<\?xml/);
  });

  it('fails on a figure without a file, a text alternative or a caption', () => {
    const untitled = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1 1"><rect width="1" height="1"/></svg>';
    expect(() => renderLesson(`${frontMatter}\n:::figure none\nCaption.\n:::\n`, 'f.md')).toThrow(/no file content\/figures\/none\.svg/);
    expect(() => renderLesson(`${frontMatter}\n:::figure bare\nCaption.\n:::\n`, 'f.md', { figure: () => untitled })).toThrow(/needs a <title> and a <desc>/);
    expect(() =>
      renderLesson(`${frontMatter}\n:::figure ok\n\n:::\n`, 'f.md', { figure: () => '<svg><title>t</title><desc>d</desc></svg>' }),
    ).toThrow(/needs a caption/);
  });

  it('reads objectives assessed on the lab sheet', () => {
    const withLab = frontMatter.replace('---\n', '---\nlabObjectives:\n  - Lock out the bench supply\n');
    expect(renderLesson(`${withLab}\nText $x$.\n`, 'lab.md').meta.labObjectives).toEqual(['Lock out the bench supply']);
    expect(renderLesson(`${frontMatter}\nText $x$.\n`, 'plain.md').meta.labObjectives).toEqual([]);
  });

  it('reads a list of readings in presets and result lines: numbers separated by spaces, then one unit', () => {
    const lesson = renderLesson(
      `${frontMatter}\n:::example Two sets of runs\nText.\n\n=> compare-tests | readingsA=248.8 250.0 251.2 cfm, readingsB=252.8 254.0 255.2 cfm | differenceExpandedUncertainty = 2.7 cfm\n:::\n\n:::calculator compare-tests\nreadingsA: 248.8 250.0 251.2 cfm\nreadingsB: 252.8 254.0 255.2 L/s\nsetup: different-days\n:::\n`,
      'lists.md',
    );
    expect(lesson.results).toEqual([
      expect.objectContaining({
        calculator: 'compare-tests',
        inputs: { readingsA: { values: [248.8, 250, 251.2], unit: 'cfm' }, readingsB: { values: [252.8, 254, 255.2], unit: 'cfm' } },
        output: 'differenceExpandedUncertainty',
        value: 2.7,
        unit: 'cfm',
      }),
    ]);
    expect(lesson.embeds[0]?.inputs).toEqual({
      readingsA: { values: [248.8, 250, 251.2], unit: 'cfm' },
      readingsB: { values: [252.8, 254, 255.2], unit: 'L/s' },
      setup: 'different-days',
    });
  });
});

describe('parsePresetValue', () => {
  it.each([
    ['200 cfm', { value: 200, unit: 'cfm' }],
    ['0.62', 0.62],
    ['-3 kPa', { value: -3, unit: 'kPa' }],
    ['1.5e3 Pa', { value: 1500, unit: 'Pa' }],
    ['6000 1/min', { value: 6000, unit: '1/min' }],
    ['cipm2007', 'cipm2007'],
    ['248.8 250.0 251.2 cfm', { values: [248.8, 250, 251.2], unit: 'cfm' }],
    ['  -1 2e1   3.5 m^3/h ', { values: [-1, 20, 3.5], unit: 'm^3/h' }],
    ['1 2 3', { values: [1, 2, 3], unit: '' }],
  ])('reads "%s"', (text, expected) => {
    expect(parsePresetValue(text)).toEqual(expected);
  });
});

import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import { loadQuizFile, loadQuizLibrary, parseCheckLine } from './quiz-library';

const FIXTURES = join(__dirname, 'fixtures');
const SLUGS = ['pressure', 'pressure-drop', 'volume-flow'];

describe('loadQuizLibrary on the fixtures', () => {
  const library = loadQuizLibrary(FIXTURES, SLUGS);
  const pressure = library.quizzes.get('pressure')!;
  const drop = library.quizzes.get('pressure-drop')!;
  const question = (id: string) => [...pressure.definition.questions, ...drop.definition.questions].find((q) => q.id === id)!;

  it('loads both quizzes without an error and lists the lesson without a quiz', () => {
    expect(library.errors).toEqual([]);
    expect([...library.quizzes.keys()]).toEqual(['pressure', 'pressure-drop']);
    expect(library.missing).toEqual(['volume-flow']);
    expect(pressure.file).toBe('01-pressure.yaml');
  });

  it('applies the defaults and reads the settings', () => {
    expect(pressure.definition).toMatchObject({ lesson: 'pressure', title: 'Pressure (fixture)', passMark: 80, attemptLimit: 3 });
    expect(pressure.definition).not.toHaveProperty('timeLimitMinutes');
    expect(drop.definition).toMatchObject({ passMark: 70, attemptLimit: 2, timeLimitMinutes: 20 });
  });

  it('reads keys, tolerances, check lines and fresh inputs into their typed form', () => {
    expect(question('column-to-kpa')).toMatchObject({
      key: { value: 6.975, unit: 'kPa' },
      tolerance: { kind: 'absolute', amount: { value: 0.05, unit: 'kPa' } },
      check: { calculator: 'pressure-convert', inputs: { pressure: { value: 28, unit: 'inH2O' }, kind: 'gauge' }, output: 'gauge' },
    });
    expect(question('fresh-conversion')).toMatchObject({
      tolerance: { kind: 'relative', percent: 1 },
      inputs: { flow: { from: 120, to: 260, step: 1, unit: 'cfm' }, toPressureDrop: { value: 28, unit: 'inH2O' }, model: 'square-root' },
    });
    expect(question('fresh-density')).toMatchObject({ inputs: { relativeHumidity: 50 }, tolerance: { kind: 'absolute', amount: { value: 0.005, unit: 'kg/m^3' } } });
    // A written question's points are its rubric's total, stated or not.
    expect(question('explain-gauge-zero').points).toBe(2);
    expect(question('explain-overlap').points).toBe(3);
    expect(question('which-are-differential')).toMatchObject({ partialCredit: 'per-choice' });
  });

  it('renders Markdown and KaTeX, sanitised, with raw HTML shown as text', () => {
    const html = pressure.html.get('gauge-or-absolute')!;
    expect(html.stem).toContain('<strong>29.6 inHg</strong>');
    expect(html.choices!['c']).toContain('class="katex"');
    expect(html.choices!['a']).toBe('Absolute');
    expect(pressure.html.get('which-are-differential')!.choices!['d']).toBe('A tyre gauge &lt;b&gt;reading&lt;/b&gt;');
    expect(pressure.html.get('column-to-kpa')!.explanation).toContain('class="katex"');
    expect(drop.html.get('fresh-conversion')!.stem).toContain('{flow}');
    expect(pressure.html.get('explain-gauge-zero')!.choices).toBeUndefined();
  });

  it('fingerprints every question; a reload gives the same, an edit changes only that question', () => {
    for (const quiz of [pressure, drop]) {
      expect([...quiz.fingerprints.keys()]).toEqual(quiz.definition.questions.map((q) => q.id));
      for (const f of quiz.fingerprints.values()) expect(f).toMatch(/^[0-9a-f]{64}$/);
    }
    expect(loadQuizLibrary(FIXTURES, SLUGS).quizzes.get('pressure')!.fingerprints).toEqual(pressure.fingerprints);

    const dir = mkdtempSync(join(tmpdir(), 'quiz-library-'));
    try {
      cpSync(FIXTURES, dir, { recursive: true });
      const file = join(dir, '01-pressure.yaml');
      // Re-laid-out YAML (a comment, other spacing) is the same question.
      writeFileSync(file, `# edited\n${readFileSync(file, 'utf8').replace('key: 6.975 kPa', 'key:   6.975 kPa')}`);
      expect(loadQuizLibrary(dir, SLUGS).quizzes.get('pressure')!.fingerprints).toEqual(pressure.fingerprints);
      writeFileSync(file, readFileSync(file, 'utf8').replace('key:   6.975 kPa', 'key: 6.974 kPa'));
      const edited = loadQuizLibrary(dir, SLUGS).quizzes.get('pressure')!.fingerprints;
      for (const [id, fingerprint] of pressure.fingerprints) {
        expect({ id, changed: edited.get(id) !== fingerprint }).toEqual({ id, changed: id === 'column-to-kpa' });
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('reports an empty folder, and a second quiz for one lesson', () => {
    const dir = mkdtempSync(join(tmpdir(), 'quiz-library-'));
    try {
      expect(loadQuizLibrary(dir, SLUGS).errors).toEqual([`no quiz files (*.yaml) in ${dir}`]);
      cpSync(join(FIXTURES, '01-pressure.yaml'), join(dir, '01-pressure.yaml'));
      cpSync(join(FIXTURES, '01-pressure.yaml'), join(dir, 'pressure.yaml'));
      expect(loadQuizLibrary(dir, SLUGS).errors).toEqual(['pressure.yaml: lesson "pressure" already has a quiz, 01-pressure.yaml']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('loadQuizFile: every problem names the file, the question and the field', () => {
  const HEAD = 'lesson: pressure\ntitle: T\nquestions:\n';
  const single = `  - id: q1
    kind: single
    points: 1
    stem: S
    choices: [{ id: a, text: A, correct: true }, { id: b, text: B, correct: false }]
    explanation: E
`;
  const load = (questions: string, head = HEAD, file = '01-pressure.yaml') => () => loadQuizFile(`${head}${questions}`, file, SLUGS);
  const fresh = (inputs: string, stem: string, extra = '') => `  - id: f1
    kind: fresh
    points: 2
    calculator: flow-at-test-pressure
    output: flow
    answerUnit: cfm
    inputs:
${inputs}
    tolerance: 1 %
    stem: "${stem}"
    explanation: E
${extra}`;
  const FLOW = '      flow: { from: 120, to: 260, step: 1, unit: cfm }\n      toPressureDrop: 28 inH2O';

  it('accepts a minimal valid quiz', () => {
    expect(load(single)().definition.questions).toHaveLength(1);
  });

  it.each([
    ['bad YAML', 'questions: [', /^01-pressure\.yaml: YAML: /, 'lesson: pressure\ntitle: T\n'],
    ['an unknown lesson', single, /01-pressure\.yaml: lesson: no lesson "pumps"/, 'lesson: pumps\ntitle: T\nquestions:\n'],
    ['a misnamed file', single, /02-other\.yaml: is named for another lesson than "pressure"/, HEAD, '02-other.yaml'],
    ['a pass mark over 100', single, /01-pressure\.yaml: passMark: is a percent/, 'lesson: pressure\ntitle: T\npassMark: 120\nquestions:\n'],
    ['a misspelt setting', single, /01-pressure\.yaml: .*attemptlimit/i, 'lesson: pressure\ntitle: T\nattemptlimit: 2\nquestions:\n'],
  ])('%s', (_name, questions, message, head = HEAD, file = '01-pressure.yaml') => {
    expect(load(questions, head, file)).toThrow(message);
  });

  it.each([
    ['an unknown kind', single.replace('kind: single', 'kind: essay'), /question "q1": kind: /],
    ['a missing field', single.replace('    stem: S\n', ''), /question "q1": stem: /],
    ['a misspelt field', single.replace('stem: S', 'stem: S\n    stme: x'), /question "q1": .*stme/],
    ['a bad id', single.replace('id: q1', 'id: Q 1'), /question "Q 1": id: lower-case/],
    ['two correct single choices', single.replace('correct: false', 'correct: true'), /question "q1": choices: a single-choice question needs exactly one correct choice \(has 2\)/],
    ['a duplicate choice id', single.replace('id: b', 'id: a'), /question "q1": choices: the id "a" is used twice/],
    ['a duplicate question id', single + single, /question "q1": the id is used twice/],
    ['multiple without its rule', single.replace('kind: single', 'kind: multiple'), /question "q1": partialCredit: /],
    ['KaTeX that does not parse', single.replace('stem: S', 'stem: "$\\\\frac{1}{$"'), /question "q1": stem: .*KaTeX/],
    ['written points not the rubric total', `  - id: w1
    kind: written
    points: 4
    stem: S
    rubric: [{ criterion: A, points: 1 }, { criterion: B, points: 2 }]
    explanation: E
`, /question "w1": points: 4 is not the rubric's total, 3/],
  ])('%s', (_name, questions, message) => {
    expect(load(questions)).toThrow(message);
  });

  const numeric = (key: string, tolerance: string, check: string) => `  - id: n1
    kind: numeric
    points: 2
    stem: S
    key: ${key}
    tolerance: ${tolerance}
    check: ${check}
    explanation: E
`;
  const CHECK = 'flow-at-test-pressure | flow=180 cfm, fromPressureDrop=10 inH2O, toPressureDrop=28 inH2O | flow';

  it('reads a numeric question', () => {
    const q = load(numeric('301.2 cfm', '2 L/s', CHECK))().definition.questions[0];
    expect(q).toMatchObject({ key: { value: 301.2, unit: 'cfm' }, tolerance: { kind: 'absolute', amount: { value: 2, unit: 'L/s' } } });
  });

  it.each([
    ['a tolerance in another quantity', numeric('301.2 cfm', '2 psi', CHECK), /question "n1": tolerance: "psi" does not measure the same quantity as the key's "cfm"/],
    ['a tolerance without a unit', numeric('301.2 cfm', '2', CHECK), /question "n1": tolerance: write "1 %"/],
    ['a relative tolerance over 50 %', numeric('301.2 cfm', '60 %', CHECK), /question "n1": tolerance: a relative tolerance/],
    ['a key in a wrong unit', numeric('301.2 psi', '1 %', CHECK), /question "n1": key: "psi" is not a unit of flow-at-test-pressure's output "flow"/],
    ['a key in an unknown unit', numeric('301.2 furlongs', '1 %', CHECK), /question "n1": key: unknown unit "furlongs"/],
    ['an unknown calculator', numeric('301.2 cfm', '1 %', 'flow-magic | flow=1 cfm | flow'), /question "n1": check: unknown calculator "flow-magic"/],
    ['an unknown output', numeric('301.2 cfm', '1 %', 'flow-at-test-pressure | flow=1 cfm | speed'), /question "n1": check: flow-at-test-pressure has no output "speed"/],
    ['an unknown input', numeric('301.2 cfm', '1 %', 'flow-at-test-pressure | flw=1 cfm | flow'), /question "n1": check.flw: flow-at-test-pressure has no input "flw"/],
    ['a check line without its parts', numeric('301.2 cfm', '1 %', 'flow-at-test-pressure | flow'), /question "n1": check: .*three parts/],
  ])('%s', (_name, questions, message) => {
    expect(load(questions)).toThrow(message);
  });

  it.each([
    ['a drawn input not shown in the stem', fresh(FLOW, 'At 10 inH2O?'), /question "f1": stem: the drawn input flow is not shown/],
    ['a placeholder inside mathematics', fresh(FLOW, 'Find $Q = {flow}$ at {toPressureDrop}, shown {flow}.'), /question "f1": stem: \{flow\} sits inside mathematics/],
    ['a placeholder that is no input', fresh(FLOW, '{flow} at {drop}'), /question "f1": stem: \{drop\} is not one of the question's inputs/],
    ['a drawn input with a unit of another quantity', fresh('      flow: { from: 1, to: 3, step: 1, unit: psi }', '{flow}'), /question "f1": inputs.flow: "psi" is not a unit of volume flow/],
    ['a drawn range with one value', fresh('      flow: { from: 1, to: 1.5, step: 1, unit: cfm }', '{flow}'), /question "f1": inputs.flow: from 1 to 1.5 in steps of 1 leaves one value only/],
    ['a drawn range upside down', fresh('      flow: { from: 3, to: 1, step: 1, unit: cfm }', '{flow}'), /question "f1": inputs.flow: "to" \(1\) is below "from" \(3\)/],
    ['a drawn option', fresh(`${FLOW}\n      model: { from: 1, to: 3, step: 1, unit: cfm }`, '{flow} {model}'), /question "f1": inputs.model: an option cannot be drawn/],
    ['numbers the engine refuses', fresh('      flow: { from: -20, to: -10, step: 1, unit: cfm }', '{flow}'), /question "f1": inputs: the engine refuses a draw: .*flow/],
    ['an unknown input', fresh(`${FLOW}\n      speed: 3000 rpm`, '{flow}'), /question "f1": inputs.speed: flow-at-test-pressure has no input "speed"/],
  ])('%s', (_name, questions, message) => {
    expect(load(questions)).toThrow(message);
  });

  it('lists every problem of a file, not only the first', () => {
    expect(load(single.replace('correct: false', 'correct: true') + numeric('301.2 cfm', '2 psi', CHECK))).toThrow(
      /question "q1": choices: [\s\S]*\n01-pressure\.yaml: question "n1": tolerance: /,
    );
  });
});

describe('parseCheckLine', () => {
  it('reads a check like a result line without its value', () => {
    expect(parseCheckLine('air-density | temperature=20 degC, relativeHumidity=50, method=ideal-dry | density')).toEqual({
      calculator: 'air-density',
      inputs: { temperature: { value: 20, unit: 'degC' }, relativeHumidity: 50, method: 'ideal-dry' },
      output: 'density',
    });
    expect(() => parseCheckLine('air-density | density')).toThrow(/three parts/);
  });
});

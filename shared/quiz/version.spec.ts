import { createHash } from 'node:crypto';

import type { NumericQuestion } from './definition';
import { canonicalJson, questionFingerprint, sha256Hex } from './version';

const question: NumericQuestion = {
  id: 'convert-reading', kind: 'numeric', points: 2, stem: 'A port flows 180 cfm at 10 inH2O…', explanation: '…',
  key: { value: 301.2, unit: 'cfm' }, tolerance: { kind: 'relative', percent: 1 },
  check: { calculator: 'flow-at-test-pressure', inputs: { flow: { value: 180, unit: 'cfm' } }, output: 'flow' },
};

describe('question fingerprints', () => {
  it('SHA-256 matches node:crypto (FIPS 180-4 test vector "abc", empty, multi-block, UTF-8)', () => {
    // FIPS 180-4 / NIST CSRC example "abc": ba7816bf 8f01cfea 414140de 5dae2223 b00361a3 96177a9c b410ff61 f20015ad.
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    for (const text of ['', 'x'.repeat(55), 'x'.repeat(56), 'x'.repeat(64), 'Δp₂ 28 inH2O, 0.075 lb/ft³ 🌬', 'y'.repeat(1000)]) {
      expect(sha256Hex(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
    }
  });

  it('ignores key order and undefined members; changes with any content', () => {
    expect(canonicalJson({ b: 1, a: [2, { d: undefined, c: 'x' }] })).toBe('{"a":[2,{"c":"x"}],"b":1}');
    const reordered = Object.fromEntries(Object.entries(question).reverse()) as unknown as NumericQuestion;
    expect(questionFingerprint(reordered)).toBe(questionFingerprint(question));
    expect(questionFingerprint(question)).toMatch(/^[0-9a-f]{64}$/);
    expect(questionFingerprint({ ...question, key: { value: 301.3, unit: 'cfm' } })).not.toBe(questionFingerprint(question));
    expect(questionFingerprint({ ...question, stem: `${question.stem} ` })).not.toBe(questionFingerprint(question));
  });
});

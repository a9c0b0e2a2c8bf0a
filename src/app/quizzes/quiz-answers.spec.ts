import { draftKindOf, draftOf, formatRemaining, isAnnouncedMoment, remainingInWords, serialiseAnswer } from './quiz-answers';

describe('quiz answers', () => {
  it('start from the saved draft, or empty with the question’s own unit', () => {
    expect(draftOf({ kind: 'fresh', answer: null, answerUnit: 'cfm', units: ['L/s', 'cfm'] })).toEqual({ kind: 'number', text: '', unit: 'cfm' });
    expect(draftOf({ kind: 'numeric', answer: { value: 0.1 + 0.2, unit: 'kPa' }, answerUnit: 'inH2O' })).toEqual({ kind: 'number', text: '0.3', unit: 'kPa' });
    expect(draftOf({ kind: 'single', answer: { choiceId: 'c' } })).toEqual({ kind: 'single', choiceId: 'c' });
    expect(draftOf({ kind: 'single', answer: null })).toEqual({ kind: 'single', choiceId: null });
    expect(draftOf({ kind: 'multiple', answer: { choiceIds: ['a', 'd'] } })).toEqual({ kind: 'multiple', choiceIds: ['a', 'd'] });
    expect(draftOf({ kind: 'written', answer: { text: 'Ask first.' } })).toEqual({ kind: 'written', text: 'Ask first.' });
    expect(draftKindOf('fresh')).toBe('number');
    expect(draftKindOf('multiple')).toBe('multiple');
  });

  it('serialise to what the API takes; empty fields clear the draft', () => {
    expect(serialiseAnswer({ kind: 'number', text: ' 247.7 ', unit: 'cfm' })).toEqual({ ok: true, answer: { value: 247.7, unit: 'cfm' } });
    expect(serialiseAnswer({ kind: 'number', text: '−1.5e3', unit: 'Pa' })).toEqual({ ok: true, answer: { value: -1500, unit: 'Pa' } });
    expect(serialiseAnswer({ kind: 'number', text: '', unit: 'cfm' })).toEqual({ ok: true, answer: null });
    expect(serialiseAnswer({ kind: 'single', choiceId: 'b' })).toEqual({ ok: true, answer: { choiceId: 'b' } });
    expect(serialiseAnswer({ kind: 'single', choiceId: null })).toEqual({ ok: true, answer: null });
    expect(serialiseAnswer({ kind: 'multiple', choiceIds: [] })).toEqual({ ok: true, answer: { choiceIds: [] } });
    expect(serialiseAnswer({ kind: 'written', text: '  ' })).toEqual({ ok: true, answer: null });
    expect(serialiseAnswer({ kind: 'written', text: 'Ask for the test pressure.' })).toEqual({ ok: true, answer: { text: 'Ask for the test pressure.' } });
  });

  it('do not send a number field that holds no number, and say why', () => {
    expect(serialiseAnswer({ kind: 'number', text: '247,7', unit: 'cfm' })).toEqual({ ok: false, message: expect.stringContaining('point') });
    expect(serialiseAnswer({ kind: 'number', text: 'about 250', unit: 'cfm' })).toEqual({ ok: false, message: expect.stringContaining('must be a number') });
  });

  it('format the countdown as a clock and in words', () => {
    expect(formatRemaining(0)).toBe('0:00');
    expect(formatRemaining(-5000)).toBe('0:00');
    expect(formatRemaining(1)).toBe('0:01');
    expect(formatRemaining(65_000)).toBe('1:05');
    expect(formatRemaining(20 * 60_000)).toBe('20:00');
    expect(formatRemaining(3_723_000)).toBe('1:02:03');
    expect(remainingInWords(600_000)).toBe('10 minutes left');
    expect(remainingInWords(60_000)).toBe('1 minute left');
    expect(remainingInWords(61_000)).toBe('2 minutes left');
    expect(remainingInWords(30_000)).toBe('30 seconds left');
    expect(remainingInWords(0)).toBe('Time is up.');
    expect(isAnnouncedMoment(300_000)).toBe(true);
    expect(isAnnouncedMoment(299_500)).toBe(true);
    expect(isAnnouncedMoment(299_000)).toBe(false);
  });
});

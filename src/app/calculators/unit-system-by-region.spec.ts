import { unitSystemForLanguages } from './unit-system-by-region';

describe('the first visit’s unit system from the browser’s languages', () => {
  it('is US customary for the United States, its territories, Liberia and Myanmar', () => {
    for (const tag of ['en-US', 'es-US', 'es-PR', 'en-GU', 'en-VI', 'en-LR', 'my-MM', 'en-Latn-US']) {
      expect([tag, unitSystemForLanguages([tag])]).toEqual([tag, 'us']);
    }
  });

  it('is SI for other regions', () => {
    for (const tag of ['en-GB', 'de-DE', 'fr-CA', 'en-CA', 'en-AU', 'en-IN', 'es-419', 'en-001']) {
      expect([tag, unitSystemForLanguages([tag])]).toEqual([tag, 'si']);
    }
  });

  it('is SI for a language without a region, unless a later tag of that language names one', () => {
    expect(unitSystemForLanguages(['en'])).toBe('si');
    expect(unitSystemForLanguages(['my'])).toBe('si');
    expect(unitSystemForLanguages(['en', 'en-US'])).toBe('us');
    expect(unitSystemForLanguages(['en', 'en-GB', 'en-US'])).toBe('si');
    // The reader's first language decides: a German reader with English (US) second is not in the US.
    expect(unitSystemForLanguages(['de', 'en-US'])).toBe('si');
    expect(unitSystemForLanguages(['de-DE', 'en-US'])).toBe('si');
    expect(unitSystemForLanguages(['en-US', 'de-DE'])).toBe('us');
  });

  it('is SI with no languages or only malformed ones, and skips a malformed tag', () => {
    expect(unitSystemForLanguages([])).toBe('si');
    expect(unitSystemForLanguages(['not a tag!', ''])).toBe('si');
    expect(unitSystemForLanguages(['x_y!', 'en-US'])).toBe('us');
  });
});

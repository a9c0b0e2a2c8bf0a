import { countReadings, parseReadings, parseTyped, readingsHint, readingsProblem, splitReadings } from './typed-numbers';

describe('a typed number', () => {
  it('is read with digit-group spaces and a typographic minus, and junk is refused', () => {
    expect(parseTyped(' 1013.25 ')).toBe(1013.25);
    expect(parseTyped('101 325')).toBe(101325);
    expect(parseTyped('−40')).toBe(-40);
    expect(parseTyped('1.5e3')).toBe(1500);
    for (const junk of ['', '1,5', '0x10', 'Infinity', '1.2.3', 'abc']) expect(parseTyped(junk)).toBeUndefined();
  });
});

describe('readings typed into one field', () => {
  it('are separated by spaces, semicolons, or a comma and a space', () => {
    expect(parseReadings('248.8 250.0 251.2')).toEqual([248.8, 250, 251.2]);
    expect(parseReadings('  248.8   250.0\t251.2 ')).toEqual([248.8, 250, 251.2]);
    expect(parseReadings('248.8; 250.0;251.2')).toEqual([248.8, 250, 251.2]);
    expect(parseReadings('250, 252, 254')).toEqual([250, 252, 254]);
    expect(parseReadings('−1.5 2e3')).toEqual([-1.5, 2000]);
  });

  it('take a bare comma as a separator only when decimals are written with a point', () => {
    expect(parseReadings('248.8,250.0,251.2')).toEqual([248.8, 250, 251.2]);
    expect(parseReadings('248.8,250,251.2')).toEqual([248.8, 250, 251.2]);
    // "248,8" may be a decimal comma: one piece, refused, never read as 248 and 8.
    expect(splitReadings('248,8 250,0')).toEqual(['248,8', '250,0']);
    expect(parseReadings('248,8 250,0')).toBeUndefined();
    expect(parseReadings('250,252')).toBeUndefined();
  });

  it('refuse text with a piece that is no number, and empty text', () => {
    for (const junk of ['', '  ', '248.8 25O 251.2', '248.8 abc', '1.2.3 4']) expect(parseReadings(junk)).toBeUndefined();
  });

  it('say which piece is wrong, or that decimals take a point', () => {
    expect(readingsProblem('Readings A', '248.8 25O 251.2')).toBe(
      'Readings A: “25O” is not a number. Type the readings as numbers with a space between them, such as 12.5 12.7 12.6.',
    );
    expect(readingsProblem('Readings A', '248,8 250,0')).toBe('Readings A: write decimals with a point (248.8) and put a space between readings.');
  });

  it('are counted as typed, and the hint says how many a list takes', () => {
    expect(countReadings('')).toBe(0);
    expect(countReadings('248.8 250.0 x')).toBe(3);
    expect(readingsHint({ min: 2, max: 30 })).toBe('Type 2 to 30 readings with a space between them.');
    expect(readingsHint({ min: 3, max: 3 })).toBe('Type 3 readings with a space between them.');
  });
});

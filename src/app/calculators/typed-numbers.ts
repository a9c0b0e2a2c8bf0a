/*
 * Numbers as the reader types them into a calculator form: one value, or a list of readings in
 * one field ("248.8 250.0 251.2"), and the messages for what cannot be read. Text only: the
 * engine judges the values.
 */

/** A converted value as the reader would type it: six significant figures, no trailing noise. */
export function formatTyped(value: number): string {
  return String(Number(value.toPrecision(6)));
}

const numberPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A typed number: spaces between digit groups and a typographic minus are allowed; '' and junk are not. */
export function parseTyped(text: string): number | undefined {
  const compact = text.trim().replace(/[\s\u00a0\u202f]/g, '').replace(/^\u2212/, '-');
  if (!numberPattern.test(compact)) return undefined;
  const value = Number(compact);
  return Number.isFinite(value) ? value : undefined;
}

export function typingProblem(label: string, text: string): string {
  return text.includes(',')
    ? `${label}: write decimals with a point (1.5) and no thousands separators.`
    : `${label} must be a number, such as 20, 0.75 or 1.5e3.`;
}

/**
 * A list of readings cut into its pieces: spaces, semicolons, or a comma with a space after it
 * separate them. A comma with no space after it separates too when the text writes decimals with
 * a point; otherwise "248,8" might be a decimal comma, so it stays one piece and is refused
 * rather than read as two readings.
 */
export function splitReadings(text: string): string[] {
  const separators = text.includes('.') ? /[\s;,]+/ : /[\s;]+|,(?:[\s;,]+|$)/;
  return text.split(separators).filter((piece) => piece !== '');
}

/** Typed readings as numbers; undefined when a piece is not a number, or nothing is typed. */
export function parseReadings(text: string): number[] | undefined {
  const values: number[] = [];
  for (const piece of splitReadings(text)) {
    const value = parseTyped(piece);
    if (value === undefined) return undefined;
    values.push(value);
  }
  return values.length > 0 ? values : undefined;
}

/** How many readings the reader has typed so far, numbers or not. */
export function countReadings(text: string): number {
  return splitReadings(text).length;
}

/** How a list input says what it takes: "Type 2 to 30 readings with a space between them." */
export function readingsHint(list: { readonly min: number; readonly max: number }): string {
  const count = list.min === list.max ? `${list.min}` : `${list.min} to ${list.max}`;
  return `Type ${count} readings with a space between them.`;
}

/** The message for readings that cannot be read, naming the first piece that is not a number. */
export function readingsProblem(label: string, text: string): string {
  const bad = splitReadings(text).find((piece) => parseTyped(piece) === undefined);
  if (bad === undefined) return `${label}: type the readings as numbers with a space between them, such as 12.5 12.7 12.6.`;
  return /\d,\d/.test(bad)
    ? `${label}: write decimals with a point (248.8) and put a space between readings.`
    : `${label}: “${bad}” is not a number. Type the readings as numbers with a space between them, such as 12.5 12.7 12.6.`;
}

import { GRADEBOOK_STATUS_WORDS, needsHelpWords, type GradebookQuizColumn, type GradebookRow } from '../../shared/api/gradebook';

/** UTF-8's byte order mark: spreadsheets then read the file as UTF-8, not the local code page. */
export const CSV_BOM = '\uFEFF';

/**
 * A cell a spreadsheet would take for a formula (it starts with `=`, `+`, `-`, `@`, a tab or a
 * carriage return) gets a leading apostrophe, so it is shown as text and never run.
 */
export function neutralise(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** One field as RFC 4180 writes it: quoted (with quotes doubled) when it holds a comma, quote, CR or LF. */
export function csvField(value: string | number | null | undefined): string {
  const text = neutralise(value === null || value === undefined ? '' : String(value));
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One record, CRLF-terminated. */
export function csvRecord(fields: ReadonlyArray<string | number | null | undefined>): string {
  return `${fields.map(csvField).join(',')}\r\n`;
}

export function gradebookCsvHeader(columns: readonly GradebookQuizColumn[], lessonCount: number): string {
  return csvRecord([
    'Apprentice',
    'E-mail',
    ...columns.flatMap((c) => [`${c.title}: best score (%)`, `${c.title}: status`]),
    `Lessons finished (of ${lessonCount})`,
    `Quizzes passed (of ${columns.length})`,
    'Last activity (UTC)',
    'Needs help',
  ]);
}

export function gradebookCsvRow(row: GradebookRow, columns: readonly GradebookQuizColumn[]): string {
  const title = (slug: string) => columns.find((c) => c.slug === slug)?.title ?? slug;
  return csvRecord([
    row.displayName,
    row.email,
    ...columns.flatMap((c) => {
      const cell = row.quizzes[c.slug]!;
      return [cell.bestPercent === null ? '' : cell.bestPercent.toFixed(1), GRADEBOOK_STATUS_WORDS[cell.status]];
    }),
    row.lessonsFinished,
    row.quizzesPassed,
    row.lastActivity ?? '',
    row.needsHelp ? `Yes: ${row.needsHelpReasons.map((r) => needsHelpWords(r, title)).join('; ')}` : 'No',
  ]);
}

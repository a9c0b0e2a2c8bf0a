// The ten slowest tests of a `npm test` run, jest and Playwright together, read from their JSON
// reports in test-results/ (git-ignored). test.mjs prints the table at the end of every run, failed or
// not, so a test creeping towards its time limit shows up before it starts failing.
//   node server/devstack/slowest-tests.mjs [count]    prints the table of the last run again
import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

import { log } from './process.mjs';
import { root } from './paths.mjs';

export const resultsDir = join(root, 'test-results');
export const jestReport = join(resultsDir, 'jest.json');
export const playwrightReport = join(resultsDir, 'playwright.json');

/** A test that used more than this share of its limit is flagged: on a quiet run it should stay under half. */
const WARN_SHARE = 0.5;
const TITLE_WIDTH = 100;

function readReport(file) {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    return undefined; // not written: that suite did not run (or died before reporting)
  }
}

/** Tests that ran, from jest's `--json` report (jest does not report per-test limits). */
export function jestTimes(report) {
  return (report?.testResults ?? []).flatMap((file) =>
    (file.assertionResults ?? [])
      .filter((test) => typeof test.duration === 'number' && (test.status === 'passed' || test.status === 'failed'))
      .map((test) => ({
        runner: 'jest',
        title: [relative(root, file.name), ...(test.ancestorTitles ?? []), test.title].join(' › '),
        durationMs: test.duration,
        timeoutMs: undefined,
        status: test.status,
      })),
  );
}

/** Tests that ran, from Playwright's json reporter; `timeout` is the limit the test ran under (test.slow() included). */
export function playwrightTimes(report) {
  const testDir = report?.config?.rootDir ?? join(root, 'e2e');
  const rows = [];
  const visit = (suite, path) => {
    for (const spec of suite.specs ?? []) {
      for (const test of spec.tests ?? []) {
        const result = test.results?.at(-1);
        if (!result || result.status === 'skipped') continue;
        rows.push({
          runner: 'playwright',
          title: [...path, spec.title].join(' › '),
          durationMs: result.duration,
          timeoutMs: test.timeout,
          status: result.status,
        });
      }
    }
    for (const child of suite.suites ?? []) visit(child, [...path, child.title]);
  };
  for (const file of report?.suites ?? []) visit(file, [relative(root, join(testDir, file.file))]);
  return rows;
}

export function slowest(rows, count = 10) {
  return [...rows].sort((a, b) => b.durationMs - a.durationMs).slice(0, count);
}

const seconds = (ms) => `${(ms / 1000).toFixed(1)} s`;

function limitCells(row) {
  if (row.timeoutMs === undefined) return ['—', ''];
  if (row.timeoutMs === 0) return ['none', ''];
  const share = row.durationMs / row.timeoutMs;
  return [`${Math.round(row.timeoutMs / 1000)} s`, `${Math.round(share * 100)} %${share > WARN_SHARE ? ' !' : '  '}`];
}

/** Shortens a long title in the middle: the file comes first and the distinguishing words often last. */
function clip(text) {
  if (text.length <= TITLE_WIDTH) return text;
  const head = Math.ceil((TITLE_WIDTH - 1) * 0.6);
  return `${text.slice(0, head)}…${text.slice(text.length - (TITLE_WIDTH - 1 - head))}`;
}

/** jest's default per-test limit: testTimeout in package.json, else jest's own 5 s. */
function jestTimeoutMs() {
  return readReport(join(root, 'package.json'))?.jest?.testTimeout ?? 5000;
}

/** The table as lines of text. */
export function slowestTable(rows) {
  const header = ['time', 'limit', 'used', 'result', 'runner', 'test'];
  const body = rows.map((row) => [seconds(row.durationMs), ...limitCells(row), row.status, row.runner, clip(row.title)]);
  const widths = header.map((_, i) => Math.max(header[i].length, ...body.map((cells) => cells[i].length)));
  const line = (cells) =>
    cells
      .map((cell, i) => (i < 3 ? cell.padStart(widths[i]) : i === cells.length - 1 ? cell : cell.padEnd(widths[i])))
      .join('  ');
  return [line(header), ...body.map(line)];
}

/** Prints the ten slowest tests of the last run, as far as the reports exist; never throws. */
export function printSlowestTests(count = 10) {
  try {
    printTable(count);
  } catch (error) {
    log(`could not list the slowest tests: ${error.message}`);
  }
}

function printTable(count) {
  const rows = [...jestTimes(readReport(jestReport)), ...playwrightTimes(readReport(playwrightReport))];
  if (rows.length === 0) {
    log('no test timings to show (neither jest nor Playwright wrote a report)');
    return;
  }
  log(`the ${Math.min(count, rows.length)} slowest tests (of ${rows.length}):`);
  process.stdout.write(`${slowestTable(slowest(rows, count)).map((l) => `  ${l}`).join('\n')}\n`);
  process.stdout.write(
    `  limit: Playwright's per-test timeout as run (test.slow() triples it); "!" marks a test past ${WARN_SHARE * 100} % of it.\n` +
      `  jest's limit is ${jestTimeoutMs() / 1000} s (package.json) unless the test gives its own; its report does not say.\n` +
      `  reports: ${relative(root, jestReport)}, ${relative(root, playwrightReport)}, e2e/report/\n`,
  );
}

if (import.meta.url === `file://${process.argv[1]}`) printSlowestTests(Number(process.argv[2] ?? 10));

// `npm run bench:pages`: what a first-time visitor downloads, and Lighthouse's scores, for the pages
// an apprentice opens first. Starts the built server (dist/) on a free port against the checkout's
// own PostgreSQL, loads each page in Debian's Chromium with a cold cache, and prints bytes over the
// wire by type, read from the browser's network log (encoded bytes as received: headers + body
// after Content-Encoding), then Lighthouse's performance and accessibility scores under its
// default mobile settings (simulated slow 4G and a 4× slower CPU). A benchmark, not a test: it
// prints its figures and the goals beside them, and exits 0 unless something could not be measured.
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';

import { chromium } from '@playwright/test';

import { openLocalDatabase } from '../devstack/local-database.mjs';
import { root } from '../devstack/paths.mjs';
import { run } from '../devstack/process.mjs';

const CHROMIUM = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const CHROMIUM_FLAGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];
const KB = 1000;

/** The goals: total bytes over the wire, Lighthouse performance and accessibility. */
const PAGES = [
  { path: '/', maxKB: 250, performance: 90, accessibility: 100 },
  { path: '/course/air-density', maxKB: 550, performance: 85, accessibility: 100 },
  { path: '/calculators/air-density', maxKB: 500, performance: 85, accessibility: 100 },
];

async function main() {
  const db = await openLocalDatabase('flowlore_bench');
  const env = { ...process.env, DATABASE_URL: db.url, NODE_ENV: 'test', LOG_LEVEL: 'warn', PORT: '0', HOST: '127.0.0.1' };
  let server;
  try {
    await run('node', ['dist/api/server/cli.js', 'migrate'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
    server = await startServer(env);
    console.log(`\nFlowlore pages, first visit, cold cache — server ${server.base} (built app in dist/)\n`);
    const rows = [];
    for (const page of PAGES) rows.push({ page, transfer: await measureTransfer(server.base + page.path) });
    printTransfer(rows);
    const scores = [];
    for (const page of PAGES) scores.push({ page, ...(await lighthouseScores(server.base + page.path)) });
    printScores(scores);
  } finally {
    server?.stop();
    await db.stop();
  }
}

function startServer(env) {
  return new Promise((resolve, reject) => {
    const child = spawn('node', [join(root, 'dist/api/server/main.js')], { cwd: root, env, stdio: ['ignore', 'pipe', 'inherit'] });
    let output = '';
    child.on('exit', (code) => reject(new Error(`the server exited (${code}) before it listened:\n${output}`)));
    child.stdout.on('data', (chunk) => {
      output += chunk;
      const found = /running at (http:\/\/[^\s/]+)\//.exec(output);
      if (found) resolve({ base: found[1], stop: () => child.kill('SIGTERM') });
    });
  });
}

/** Loads the page in a fresh context (empty cache) and sums encoded bytes per resource type. */
async function measureTransfer(url) {
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS });
  try {
    // Service workers blocked here: this is the page load itself. What the service worker copies
    // for offline use afterwards is measured on its own below (it downloads once, in the background).
    const context = await browser.newContext({ serviceWorkers: 'block', viewport: { width: 800, height: 1100 } });
    const page = await context.newPage();
    const pageLoad = await collect(page, async () => {
      await page.goto(url, { waitUntil: 'networkidle' });
    });
    await context.close();

    const offline = await measureOfflineCopy(browser, url);
    return { ...pageLoad, offlineCopy: offline };
  } finally {
    await browser.close();
  }
}

async function collect(page, action) {
  const byType = {};
  const fonts = [];
  const pending = [];
  let requests = 0;
  page.on('requestfinished', (request) => {
    pending.push(
      request.sizes().then((sizes) => {
        const type = typeOf(request);
        const bytes = sizes.responseHeadersSize + sizes.responseBodySize;
        byType[type] = (byType[type] ?? 0) + bytes;
        if (type === 'font') fonts.push(`${new URL(request.url()).pathname.replace(/^\/media\//, '').replace(/-[A-Z0-9]{8}\./, '.')} ${kb(bytes)}`);
        requests += 1;
      }),
    );
  });
  await action();
  await Promise.all(pending);
  const total = Object.values(byType).reduce((a, b) => a + b, 0);
  return { byType, total, requests, fonts };
}

/** The service worker's own download after a first visit (its prefetch of the app for offline use). */
async function measureOfflineCopy(browser, url) {
  const context = await browser.newContext({ viewport: { width: 800, height: 1100 } });
  let bytes = 0;
  let requests = 0;
  const pending = [];
  context.on('requestfinished', (request) => {
    if (!request.serviceWorker()) return;
    pending.push(
      request.sizes().then((sizes) => {
        bytes += sizes.responseHeadersSize + sizes.responseBodySize;
        requests += 1;
      }),
    );
  });
  const page = await context.newPage();
  await page.goto(url, { waitUntil: 'networkidle' });
  const hasWorker = await page.evaluate(async () => {
    if (!('serviceWorker' in navigator) || !(await navigator.serviceWorker.getRegistration())) return false;
    await navigator.serviceWorker.ready;
    return true;
  });
  if (hasWorker) {
    // The worker copies the app from its idle-time task queue (~5 s after the last request, away
    // from localhost); its status page says when that queue has run and is empty.
    for (let i = 0; i < 120 && !(await copied(page)); i++) await sleep(500);
  }
  await Promise.all(pending);
  await context.close();
  return hasWorker ? { bytes, requests } : undefined;
}

async function copied(page) {
  return page.evaluate(async () => {
    if (!navigator.serviceWorker.controller) return false;
    const state = await (await fetch('/ngsw/state')).text();
    const queue = state.split('Task queue:')[1]?.split('Debug log:')[0]?.trim();
    return /Latest manifest hash: [0-9a-f]{6,}/.test(state) && !/Last update run: never/.test(state) && queue === '';
  });
}

function typeOf(request) {
  const type = request.resourceType();
  if (type === 'fetch' || type === 'xhr') return new URL(request.url()).pathname.startsWith('/api/') ? 'api' : 'fetch';
  return type;
}

async function lighthouseScores(url) {
  const { default: lighthouse } = await import('lighthouse');
  const chromeLauncher = await import('chrome-launcher');
  const chrome = await chromeLauncher.launch({ chromePath: CHROMIUM, chromeFlags: ['--headless=new', ...CHROMIUM_FLAGS] });
  try {
    // Default config: mobile form factor, simulated throttling (slow 4G, 4× CPU slowdown).
    const result = await lighthouse(url, { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility'] });
    const { categories, audits } = result.lhr;
    return {
      performance: Math.round(categories.performance.score * 100),
      accessibility: Math.round(categories.accessibility.score * 100),
      fcp: audits['first-contentful-paint'].displayValue,
      lcp: audits['largest-contentful-paint'].displayValue,
      tbt: audits['total-blocking-time'].displayValue,
      failedA11y: categories.accessibility.auditRefs.filter((ref) => ref.weight > 0 && audits[ref.id].score !== null && audits[ref.id].score < 1).map((ref) => ref.id),
    };
  } finally {
    await chrome.kill();
  }
}

const kb = (bytes) => `${(bytes / KB).toFixed(1)} KB`;
const verdict = (ok) => (ok ? 'met' : 'NOT met');

function printTransfer(rows) {
  console.log('Bytes over the wire (encoded, from Chromium\'s network log; 1 KB = 1000 bytes):');
  for (const { page, transfer } of rows) {
    const parts = Object.entries(transfer.byType).sort((a, b) => b[1] - a[1]).map(([type, bytes]) => `${type} ${kb(bytes)}`);
    console.log(`  ${page.path.padEnd(26)} total ${kb(transfer.total).padStart(10)}  (goal ≤ ${page.maxKB} KB: ${verdict(transfer.total <= page.maxKB * KB)})  ${transfer.requests} requests`);
    console.log(`  ${''.padEnd(26)} ${parts.join(', ')}`);
    if (transfer.fonts.length) console.log(`  ${''.padEnd(26)} fonts: ${transfer.fonts.sort().join(', ')}`);
    if (transfer.offlineCopy) {
      console.log(`  ${''.padEnd(26)} then, in the background, the service worker's offline copy: ${kb(transfer.offlineCopy.bytes)} in ${transfer.offlineCopy.requests} requests`);
    }
  }
  console.log('');
}

function printScores(scores) {
  console.log('Lighthouse 12 (default mobile: simulated slow 4G, 4× CPU slowdown):');
  for (const s of scores) {
    console.log(
      `  ${s.page.path.padEnd(26)} performance ${String(s.performance).padStart(3)} (goal ≥ ${s.page.performance}: ${verdict(s.performance >= s.page.performance)})` +
        `   accessibility ${String(s.accessibility).padStart(3)} (goal ${s.page.accessibility}: ${verdict(s.accessibility >= s.page.accessibility)})` +
        `   FCP ${s.fcp}, LCP ${s.lcp}, TBT ${s.tbt}`,
    );
    if (s.failedA11y.length) console.log(`  ${''.padEnd(26)} accessibility audits not passed: ${s.failedA11y.join(', ')}`);
  }
  console.log('');
}

main().catch((error) => {
  console.error(`bench:pages could not measure: ${error.stack ?? error.message}`);
  process.exit(1);
});

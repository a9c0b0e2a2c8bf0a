// The steps after `ng build` (run by `npm run build:client`), on dist/client/browser:
//  1. index.html preloads the fonts the first paint sets its text in, so the text does not wait for
//     the stylesheet to be read before they are asked for;
//  2. the service worker's manifest (ngsw.json) is made again, since step 1 changed index.html and
//     the worker checks every file against the hash it lists;
//  3. every compressible file gets Brotli and gzip copies beside it (name.br, name.gz), made once
//     here at the highest settings, so the server never compresses a static file per request
//     (server/http/client-app.ts serves the best copy the browser accepts).
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { brotliCompressSync, constants as zlib, gzipSync } from 'node:zlib';

import { log, run } from './process.mjs';
import { root } from './paths.mjs';

const browserDir = join(root, 'dist', 'client', 'browser');
/**
 * The faces every page's first paint sets text in (src/styles/_fonts.scss): Merriweather 400 for
 * the text, Source Sans 3 600 for the top bar and the headings. Asked for at once, they are in by
 * the time the app first renders (it waits for its scripts, which are larger), so no heading
 * reflows when a face arrives late (a layout shift). Source Sans 400 (form fields, hints) is left
 * to the pages that use it.
 */
const FIRST_PAINT_FONTS = [/^merriweather-latin-400-normal-[A-Z0-9]{8}\.woff2$/, /^source-sans-3-latin-600-normal-[A-Z0-9]{8}\.woff2$/];
/** Text formats worth compressing; woff2, png and the like are compressed already. */
const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|webmanifest|txt|ttf|woff|xml|map)$/;
const MIN_BYTES = 1024;

function preloadFirstPaintFonts() {
  const media = readdirSync(join(browserDir, 'media'));
  const fonts = FIRST_PAINT_FONTS.map((pattern) => {
    const font = media.find((name) => pattern.test(name));
    if (!font) throw new Error(`client build: no first-paint font ${pattern} in dist/client/browser/media`);
    return font;
  });
  const indexFile = join(browserDir, 'index.html');
  const html = readFileSync(indexFile, 'utf8').replace(/\s*<link rel="preload" as="font"[^>]*>/g, '');
  const link = fonts.map((font) => `<link rel="preload" as="font" type="font/woff2" href="media/${font}" crossorigin>`).join('\n    ');
  // After <base href>: a relative address resolves against it only from there on.
  const base = /<base href="[^"]*"\s*\/?>/.exec(html);
  if (!base) throw new Error('client build: index.html has no <base href>');
  writeFileSync(indexFile, html.replace(base[0], `${base[0]}\n    ${link}`));
}

async function rebuildWorkerManifest() {
  const config = join(root, 'src', 'ngsw-config.json');
  const cli = join(root, 'node_modules', '@angular', 'service-worker', 'ngsw-config.js');
  await run(process.execPath, [cli, relative(root, browserDir), relative(root, config), '/'], { cwd: root });
}

function* filesUnder(dir) {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* filesUnder(path);
    else yield path;
  }
}

function writeCompressedCopies() {
  let files = 0;
  let before = 0;
  let after = 0;
  for (const path of filesUnder(browserDir)) {
    if (!COMPRESSIBLE.test(path) || statSync(path).size < MIN_BYTES) continue;
    const data = readFileSync(path);
    const br = brotliCompressSync(data, {
      params: { [zlib.BROTLI_PARAM_QUALITY]: zlib.BROTLI_MAX_QUALITY, [zlib.BROTLI_PARAM_SIZE_HINT]: data.length },
    });
    const gz = gzipSync(data, { level: zlib.Z_BEST_COMPRESSION });
    // A copy that is not smaller is not worth a second representation.
    if (br.length < data.length) writeFileSync(`${path}.br`, br);
    if (gz.length < data.length) writeFileSync(`${path}.gz`, gz);
    files += 1;
    before += data.length;
    after += Math.min(br.length, data.length);
  }
  log(`compressed copies of ${files} files: ${(before / 1e3).toFixed(0)} kB → ${(after / 1e3).toFixed(0)} kB with Brotli`);
}

preloadFirstPaintFonts();
await rebuildWorkerManifest();
writeCompressedCopies();

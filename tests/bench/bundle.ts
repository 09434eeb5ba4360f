/**
 * Bundle sizes of the built client: the JavaScript that the sign-in and home pages load
 * before they draw, and what each lazily loaded route adds on its first visit, raw and
 * gzipped (node:zlib at its default level, as a server would send it). The sign-in and
 * home pages have a budget of 200 kB gzipped. A report, not a test: it never fails.
 * Run: npm run bench:bundle (builds first), or tsx tests/bench/bundle.ts on an existing build.
 *
 * The chunk graph comes from Vite's build manifest (dist/client/.vite/manifest.json,
 * `build.manifest` in vite.config.ts); index.html's module script and preloads are read
 * too, as a check that the manifest tells the same story as the page.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

const DIST = 'dist/client';
const BUDGET_BYTES = 200_000;

interface Chunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}

const manifestPath = join(DIST, '.vite/manifest.json');
if (!existsSync(manifestPath)) {
  console.error(`There is no ${manifestPath}. Build first (npm run bench:bundle does), with build.manifest on in vite.config.ts.`);
  process.exit(1);
}
const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Record<string, Chunk>;

const sizes = new Map<string, { raw: number; gzip: number }>();
function sizeOf(file: string) {
  let size = sizes.get(file);
  if (!size) {
    const bytes = readFileSync(join(DIST, file));
    size = { raw: bytes.length, gzip: gzipSync(bytes).length };
    sizes.set(file, size);
  }
  return size;
}

/** Every JavaScript file a chunk needs before it runs: itself and its static imports, all the way down. */
function staticClosure(key: string, into = new Set<string>()): Set<string> {
  const chunk = manifest[key];
  if (!chunk || into.has(chunk.file)) return into;
  into.add(chunk.file);
  for (const dep of chunk.imports ?? []) staticClosure(dep, into);
  return into;
}

function total(files: Iterable<string>) {
  let raw = 0;
  let gzip = 0;
  for (const f of files) {
    const s = sizeOf(f);
    raw += s.raw;
    gzip += s.gzip;
  }
  return { raw, gzip };
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

// The entry: what index.html loads, which is everything the sign-in and home pages need (both are in the main chunk).
const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
if (!entryKey) {
  console.error('The manifest names no entry chunk.');
  process.exit(1);
}
const initial = staticClosure(entryKey);

// Cross-check against the page itself: its module script and modulepreload links.
const html = readFileSync(join(DIST, 'index.html'), 'utf8');
const fromHtml = new Set(
  [...html.matchAll(/<(?:script[^>]*\bsrc|link[^>]*rel="modulepreload"[^>]*\bhref)="\/([^"]+\.js)"/g)].map((m) => m[1]),
);
const missing = [...initial].filter((f) => !fromHtml.has(f));
const extra = [...fromHtml].filter((f) => !initial.has(f));

// Route paths, read from the router, so each lazy chunk is shown with the addresses that load it.
const routerSource = readFileSync('src/router.tsx', 'utf8');
const pathsByModule = new Map<string, string[]>();
for (const m of routerSource.matchAll(/path: '([^']+)'[^\n]*?import\('\.\/([\w/]+)'\)/g)) {
  const key = `src/${m[2]}.tsx`;
  pathsByModule.set(key, [...(pathsByModule.get(key) ?? []), m[1]]);
}

interface Row {
  name: string;
  paths: string;
  files: number;
  raw: number;
  gzip: number;
  firstVisitGzip: number;
}
const rows: Row[] = [];
for (const [key, chunk] of Object.entries(manifest)) {
  if (!chunk.isDynamicEntry) continue;
  const added = [...staticClosure(key)].filter((f) => !initial.has(f));
  const size = total(added);
  const name = key.replace(/^src\/(features\/\w+\/routes\/)?/, '').replace(/\.tsx?$/, '');
  rows.push({ name, paths: (pathsByModule.get(key) ?? ['(loaded on demand)']).join(' '), files: added.length, ...size, firstVisitGzip: 0 });
}
const initialSize = total(initial);
for (const row of rows) row.firstVisitGzip = initialSize.gzip + row.gzip;
rows.sort((a, b) => b.gzip - a.gzip);

const css = total(manifest[entryKey].css ?? []);

function table(header: string[], body: string[][]) {
  const widths = header.map((h, i) => Math.max(h.length, ...body.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 || i === 1 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join('  ');
  console.log(line(header));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const r of body) console.log(line(r));
}

console.log('\nRackside client bundle (dist/client); 1 kB = 1,000 bytes; gzip is node:zlib at its default level.\n');
console.log('Loaded first by every page, so by sign-in and home:');
table(
  ['file', '', 'raw', 'gzip'],
  [...initial].sort((a, b) => sizeOf(b).gzip - sizeOf(a).gzip).map((f) => [f, '', kB(sizeOf(f).raw), kB(sizeOf(f).gzip)]),
);
console.log('');
const met = initialSize.gzip <= BUDGET_BYTES;
console.log(
  `Sign-in and home: ${kB(initialSize.gzip)} of JavaScript gzipped (${kB(initialSize.raw)} raw, ${initial.size} files) — ` +
    `budget ${kB(BUDGET_BYTES)}: ${met ? 'MET' : 'NOT MET'} (${met ? `${kB(BUDGET_BYTES - initialSize.gzip)} to spare` : `${kB(initialSize.gzip - BUDGET_BYTES)} over`})`,
);
// React's development build greets the console with this line; a production bundle never carries it.
if ([...initial].some((f) => readFileSync(join(DIST, f), 'utf8').includes('Download the React DevTools'))) {
  console.log('Warning: this is a development build of React (NODE_ENV was set and not "production" when it was built); the figures are not what users load.');
}
console.log(`Stylesheet, for reference: ${kB(css.gzip)} gzipped (${kB(css.raw)} raw).`);
if (missing.length || extra.length) {
  console.log(`Note: index.html and the manifest disagree — not in the page: ${missing.join(', ') || 'none'}; only in the page: ${extra.join(', ') || 'none'}.`);
} else {
  console.log('index.html loads exactly these files (its module script and modulepreload links agree with the manifest).');
}

console.log('\nLoaded lazily, per route, on top of the above (shared chunks count for every route that needs them):');
table(
  ['route chunk', 'paths', 'files', 'raw', 'gzip', 'first visit, gzip'],
  rows.map((r) => [r.name, r.paths, String(r.files), kB(r.raw), kB(r.gzip), kB(r.firstVisitGzip)]),
);
console.log('');

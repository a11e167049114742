// Reports the JavaScript a first visit downloads before any route loads: the entry script
// of the built index.html and the modules it preloads, each gzipped (level 9) and summed.
// Usage: node scripts/report-bundle-size.mjs [build folder, default dist/client]
import { readFileSync } from 'node:fs';
import { resolve, join } from 'node:path';
import { gzipSync } from 'node:zlib';

const TARGET_KB = 200;
const dist = resolve(process.argv[2] ?? 'dist/client');
const html = readFileSync(join(dist, 'index.html'), 'utf8');

const scripts = [...html.matchAll(/<script[^>]+type="module"[^>]+src="([^"]+)"/g)].map((m) => m[1]);
const preloads = [...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
const styles = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => m[1]);

const sizeOf = (href) => {
  const bytes = readFileSync(join(dist, href.replace(/^\//, '')));
  return { href, raw: bytes.length, gzip: gzipSync(bytes, { level: 9 }).length };
};
const kb = (n) => (n / 1024).toFixed(1);

const js = [...new Set([...scripts, ...preloads])].map(sizeOf);
const css = styles.map(sizeOf);
const total = js.reduce((s, f) => s + f.gzip, 0);

for (const f of js) console.log(`js   ${kb(f.gzip).padStart(7)} KB gzip  ${kb(f.raw).padStart(7)} KB raw  ${f.href}`);
for (const f of css) console.log(`css  ${kb(f.gzip).padStart(7)} KB gzip  ${kb(f.raw).padStart(7)} KB raw  ${f.href}`);
console.log(`Initial JavaScript: ${kb(total)} KB gzipped (${js.length} files); target under ${TARGET_KB} KB: ${total / 1024 < TARGET_KB ? 'met' : 'NOT met'}.`);

// Builds the client with Vite when dist/ is missing or older than any client or shared source.
import { existsSync, statSync, readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { resolve, join } from 'node:path';
import { log } from './log.mjs';
import { repoRoot } from './postgres-cluster.mjs';

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    const mtime = entry.isDirectory() ? newestMtime(path) : statSync(path).mtimeMs;
    if (mtime > newest) newest = mtime;
  }
  return newest;
}

export function ensureClientBuilt({ force = false, outDir = 'dist/client' } = {}) {
  const builtIndex = resolve(repoRoot, outDir, 'index.html');
  const sources = ['client', 'shared', 'vite.config.ts', 'package-lock.json'].map((p) => resolve(repoRoot, p));
  const newestSource = Math.max(...sources.map((p) => (statSync(p).isDirectory() ? newestMtime(p) : statSync(p).mtimeMs)));
  if (!force && existsSync(builtIndex) && statSync(builtIndex).mtimeMs >= newestSource) return;
  log('building the client (vite build)');
  execFileSync(process.execPath, [resolve(repoRoot, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: repoRoot, stdio: 'inherit', env: { ...process.env, POLLENPACT_CLIENT_DIST: outDir },
  });
}

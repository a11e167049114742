// Compiles the server (and the shared code it imports) with tsc into dist/server when it is
// missing or older than any server or shared source; `npm start` then runs it with plain node.
import { existsSync, statSync, readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { resolve, join } from 'node:path';
import { log } from './log.mjs';
import { repoRoot } from './postgres-cluster.mjs';

export const serverEntry = 'dist/server/server/src/index.js';
export const fakesEntry = 'dist/server/server/src/fakes/run.js';

function newestMtime(path) {
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = 0;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

export function ensureServerBuilt({ force = false } = {}) {
  const built = resolve(repoRoot, serverEntry);
  const sources = ['server/src', 'server/tsconfig.json', 'server/tsconfig.build.json', 'shared', 'package-lock.json'].map((p) => resolve(repoRoot, p));
  if (!force && existsSync(built) && statSync(built).mtimeMs >= Math.max(...sources.map(newestMtime))) return;
  log('compiling the server (tsc -p server/tsconfig.build.json)');
  execFileSync(process.execPath, [resolve(repoRoot, 'node_modules/typescript/bin/tsc'), '-p', 'server/tsconfig.build.json'], { cwd: repoRoot, stdio: 'inherit' });
}

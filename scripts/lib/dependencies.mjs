// Installs npm dependencies from the lock file when node_modules is missing or older
// than package-lock.json, so a fresh clone needs nothing but Node and npm.
import { existsSync, statSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { resolve } from 'node:path';
import { log } from './log.mjs';
import { repoRoot } from './postgres-cluster.mjs';

export function ensureDependencies() {
  const marker = resolve(repoRoot, 'node_modules/.package-lock.json');
  const lock = resolve(repoRoot, 'package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  log('installing npm dependencies (npm ci)');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: repoRoot, stdio: 'inherit' });
}

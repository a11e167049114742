// Installs npm dependencies from the lock file (npm ci) when node_modules was not installed
// from this very lock file, so a fresh clone needs nothing but Node and npm. The check is
// by content (a hash of package-lock.json stamped after the install), not by file times:
// a checkout, an editor or a second run must not trigger a reinstall under a running one.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { resolve } from 'node:path';
import { log } from './log.mjs';
import { repoRoot } from './postgres-cluster.mjs';

const stamp = resolve(repoRoot, 'node_modules/.pollenpact-installed-lock');
const lockHash = () => createHash('sha256').update(readFileSync(resolve(repoRoot, 'package-lock.json'))).digest('hex');

export function ensureDependencies() {
  const wanted = lockHash();
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted) return;
  log('installing npm dependencies (npm ci)');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: repoRoot, stdio: 'inherit' });
  writeFileSync(stamp, `${wanted}\n`);
}

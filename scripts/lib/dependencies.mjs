// Installs npm dependencies from the lock file (npm ci) when node_modules was not installed
// from this very lock file, so a fresh clone needs nothing but Node and npm. The check is
// by content (a hash of package-lock.json stamped after the install), not by file times:
// a checkout, an editor or a second run must not trigger a reinstall under a running one.
// Two runs started at once take turns: the first holds a lock directory while it installs,
// the second waits for it and then finds the stamp current.
import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { resolve } from 'node:path';
import { log } from './log.mjs';
import { repoRoot } from './postgres-cluster.mjs';

const stamp = resolve(repoRoot, 'node_modules/.pollenpact-installed-lock');
const installLock = resolve(repoRoot, '.pollenpact-installing');
const staleLockMs = 15 * 60_000;
const lockHash = () => createHash('sha256').update(readFileSync(resolve(repoRoot, 'package-lock.json'))).digest('hex');
const installed = (wanted) => existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted;
const sleep = (ms) => Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);

function takeLock() {
  for (let waited = false; ; waited = true) {
    try {
      mkdirSync(installLock);
      return;
    } catch (err) {
      if (err.code !== 'EEXIST') throw err;
      const since = statSync(installLock, { throwIfNoEntry: false })?.mtimeMs ?? Date.now();
      if (Date.now() - since > staleLockMs) rmSync(installLock, { recursive: true, force: true });
      else {
        if (!waited) log('another run is installing npm dependencies; waiting for it');
        sleep(1000);
      }
    }
  }
}

export function ensureDependencies() {
  const wanted = lockHash();
  if (installed(wanted)) return;
  takeLock();
  try {
    if (installed(wanted)) return;
    log('installing npm dependencies (npm ci)');
    execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: repoRoot, stdio: 'inherit' });
    writeFileSync(stamp, `${wanted}\n`);
  } finally {
    rmSync(installLock, { recursive: true, force: true });
  }
}

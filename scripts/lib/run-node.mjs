// Runs a TypeScript entry point with tsx in a child process and waits for it.
import { spawn } from 'node:child_process';
import { repoRoot } from './postgres-cluster.mjs';

export function runTs(file, args = [], env = {}) {
  return new Promise((resolvePromise, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', file, ...args], {
      cwd: repoRoot, stdio: 'inherit', env: { ...process.env, ...env },
    });
    child.on('exit', (code) => (code === 0 ? resolvePromise() : reject(new Error(`${file} exited with ${code}`))));
  });
}

export function spawnTs(file, env = {}) {
  return spawn(process.execPath, ['--import', 'tsx', file], {
    cwd: repoRoot, stdio: 'inherit', env: { ...process.env, ...env },
  });
}

/** Runs compiled JavaScript with plain node; stack traces map back to the TypeScript sources. */
export function spawnNode(file, env = {}) {
  return spawn(process.execPath, ['--enable-source-maps', file], {
    cwd: repoRoot, stdio: 'inherit', env: { ...process.env, ...env },
  });
}

// A private PostgreSQL cluster for Pollenpact, listening on 127.0.0.1 only, kept in a
// git-ignored project folder. Trust authentication is acceptable only because nothing
// but this machine can reach it; bring your own server with DATABASE_URL otherwise.
import { existsSync, mkdirSync, chownSync, statSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { resolve } from 'node:path';
import { log } from './log.mjs';
import { isRoot, ensurePostgresInstalled } from './system-packages.mjs';

export const repoRoot = resolve(new URL('../..', import.meta.url).pathname);
export const clusterPort = Number(process.env.POLLENPACT_PG_PORT ?? 54329);
export const appRole = 'pollenpact';
export const appDatabase = 'pollenpact';
// Several test runs may share one cluster (e.g. in development): each names its own template.
export const testTemplateDatabase = process.env.POLLENPACT_TEST_TEMPLATE ?? 'pollenpact_test';

function postgresUid() {
  const line = execFileSync('id', ['-u', 'postgres']).toString().trim();
  return { uid: Number(line), gid: Number(execFileSync('id', ['-g', 'postgres']).toString().trim()) };
}

function asClusterOwner(bin, args, options = {}) {
  const command = `${bin}/${args[0]}`;
  const rest = args.slice(1);
  const opts = { cwd: '/tmp', stdio: ['ignore', 'pipe', 'pipe'], ...options };
  return isRoot()
    ? execFileSync('runuser', ['-u', 'postgres', '--', command, ...rest], opts)
    : execFileSync(command, rest, opts);
}

function reachableByPostgres(dir) {
  try {
    execFileSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]);
    return true;
  } catch {
    return false;
  }
}

/** Where the cluster lives: .data/pg, or a folder under /var/tmp when the postgres user cannot reach the checkout. */
export function clusterDir() {
  const inRepo = resolve(repoRoot, '.data/pg');
  if (!isRoot()) return inRepo;
  mkdirSync(resolve(repoRoot, '.data'), { recursive: true });
  if (reachableByPostgres(resolve(repoRoot, '.data'))) return inRepo;
  const hash = createHash('sha1').update(repoRoot).digest('hex').slice(0, 12);
  const outside = `/var/tmp/pollenpact-pg-${hash}`;
  log(`the postgres user cannot reach ${repoRoot}; keeping the database cluster in ${outside}`);
  return outside;
}

export function clusterUrl(database) {
  return `postgres://${appRole}@127.0.0.1:${clusterPort}/${database}`;
}

export function superuserUrl(database = 'postgres') {
  return `postgres://postgres@127.0.0.1:${clusterPort}/${database}`;
}

function initCluster(bin, dir) {
  log(`creating a private PostgreSQL cluster in ${dir}`);
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot()) {
    const { uid, gid } = postgresUid();
    chownSync(dir, uid, gid);
  }
  asClusterOwner(bin, ['initdb', '-D', dir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
}

export function isClusterRunning(bin, dir) {
  try {
    asClusterOwner(bin, ['pg_ctl', '-D', dir, 'status']);
    return true;
  } catch {
    return false;
  }
}

/** Starts the cluster if needed. Returns { bin, dir, startedHere }. Harmless to call twice. */
export function startCluster() {
  const bin = ensurePostgresInstalled();
  const dir = clusterDir();
  if (!existsSync(resolve(dir, 'PG_VERSION'))) initCluster(bin, dir);
  if (isClusterRunning(bin, dir)) return { bin, dir, startedHere: false };
  log(`starting PostgreSQL on 127.0.0.1:${clusterPort}`);
  asClusterOwner(bin, [
    'pg_ctl', '-D', dir, '-l', resolve(dir, 'server.log'), '-w', '-t', '60',
    // shared_buffers holds a valley's season (the benchmarks' 2,000,000 placement rows) in memory.
    '-o', `-p ${clusterPort} -k /tmp -c listen_addresses=127.0.0.1 -c max_connections=1000 -c shared_buffers=1GB`,
    'start',
  ]);
  return { bin, dir, startedHere: true };
}

export function stopCluster({ bin, dir }) {
  if (!isClusterRunning(bin, dir)) return;
  log('stopping PostgreSQL');
  asClusterOwner(bin, ['pg_ctl', '-D', dir, '-m', 'fast', '-w', 'stop']);
}

export function clusterExists() {
  try {
    return statSync(resolve(clusterDir(), 'PG_VERSION')).isFile();
  } catch {
    return false;
  }
}

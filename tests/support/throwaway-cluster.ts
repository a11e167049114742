// A second, short-lived PostgreSQL cluster for tests that must really stop the database
// (the shared test cluster serves other files at the same time).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, chownSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { freePort } from './server-process.js';
import pg from 'pg';

const isRoot = process.getuid?.() === 0;

function asOwner(bin: string, args: string[]) {
  const command = `${bin}/${args[0]}`;
  const opts = { cwd: '/tmp', stdio: 'pipe' as const };
  return isRoot ? execFileSync('runuser', ['-u', 'postgres', '--', command, ...args.slice(1)], opts) : execFileSync(command, args.slice(1), opts);
}

export async function startThrowawayCluster() {
  const bin = process.env.PG_BIN_DIR;
  if (!bin) throw new Error('PG_BIN_DIR is not set: run the tests with `npm test`.');
  const parent = mkdtempSync(join(tmpdir(), 'pollenpact-pg-'));
  const dir = join(parent, 'data');
  execFileSync('mkdir', ['-m', '700', dir]);
  if (isRoot) {
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
    chownSync(parent, uid, gid);
    chownSync(dir, uid, gid);
  }
  asOwner(bin, ['initdb', '-D', dir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  const port = await freePort();
  const start = () => asOwner(bin, ['pg_ctl', '-D', dir, '-l', join(dir, 'server.log'), '-w', '-o', `-p ${port} -k /tmp -c listen_addresses=127.0.0.1`, 'start']);
  const stop = () => asOwner(bin, ['pg_ctl', '-D', dir, '-m', 'immediate', '-w', 'stop']);
  start();
  const url = `postgres://postgres@127.0.0.1:${port}/postgres`;
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  await client.query('CREATE EXTENSION IF NOT EXISTS postgis; CREATE EXTENSION IF NOT EXISTS btree_gist;');
  await client.end();
  return {
    url,
    start,
    stop,
    destroy() {
      try { stop(); } catch { /* already stopped */ }
      rmSync(parent, { recursive: true, force: true });
    },
  };
}

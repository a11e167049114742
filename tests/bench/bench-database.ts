// A throwaway database for a benchmark in the private cluster: created with the PostGIS and
// btree_gist extensions (as the superuser), migrated with the app's migrator, dropped after.
import pg from 'pg';
import { randomBytes } from 'node:crypto';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { createMigrator } from '../../server/src/db/migrator.js';

const port = Number(process.env.POLLENPACT_PG_PORT ?? 54329);
const superuserUrl = (db: string) => `postgres://postgres@127.0.0.1:${port}/${db}`;
const appUrl = (db: string) => `postgres://pollenpact@127.0.0.1:${port}/${db}`;

async function asSuperuser(db: string, sql: string) {
  const client = new pg.Client({ connectionString: superuserUrl(db) });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

export async function createBenchDatabase(prefix: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `pollenpact_bench_${prefix}_${randomBytes(4).toString('hex')}`;
  await asSuperuser('postgres', `CREATE DATABASE ${name} OWNER pollenpact`);
  await asSuperuser(name, 'CREATE EXTENSION IF NOT EXISTS postgis; CREATE EXTENSION IF NOT EXISTS btree_gist');
  const sequelize = createSequelize(appUrl(name));
  try {
    await createMigrator(sequelize).up();
  } finally {
    await sequelize.close();
  }
  return { url: appUrl(name), drop: () => asSuperuser('postgres', `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`) };
}

export function percentile(sortedMs: number[], p: number): number {
  if (!sortedMs.length) return Number.NaN;
  const index = Math.min(sortedMs.length - 1, Math.ceil((p / 100) * sortedMs.length) - 1);
  return sortedMs[Math.max(0, index)];
}

export const fmt = (ms: number) => `${ms.toFixed(2)} ms`;

// Creates the app role, the app database and the test template database in the private
// cluster, with the PostGIS and btree_gist extensions (created as the superuser).
import { log } from './log.mjs';
import { appRole, superuserUrl } from './postgres-cluster.mjs';

async function withClient(url, work) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export async function ensureAppRole() {
  await withClient(superuserUrl(), async (client) => {
    const { rowCount } = await client.query('SELECT 1 FROM pg_roles WHERE rolname = $1', [appRole]);
    if (!rowCount) await client.query(`CREATE ROLE ${appRole} LOGIN CREATEDB`);
  });
}

async function addExtensions(database) {
  await withClient(superuserUrl(database), async (client) => {
    await client.query('CREATE EXTENSION IF NOT EXISTS postgis');
    await client.query('CREATE EXTENSION IF NOT EXISTS btree_gist');
  });
}

/** Creates the database when missing. Returns true when it was created now. */
export async function ensureDatabase(database) {
  const created = await withClient(superuserUrl(), async (client) => {
    const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [database]);
    if (rowCount) return false;
    log(`creating database ${database}`);
    await client.query(`CREATE DATABASE ${database} OWNER ${appRole}`);
    return true;
  });
  await addExtensions(database);
  return created;
}

/** Drops and recreates a database (used for the test template, migrated afresh each run). */
export async function recreateDatabase(database) {
  await withClient(superuserUrl(), async (client) => {
    await client.query(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`);
    const { rows } = await client.query(
      "SELECT datname FROM pg_database WHERE datname LIKE $1", [`${database}_f%`]);
    for (const row of rows) await client.query(`DROP DATABASE IF EXISTS "${row.datname}" WITH (FORCE)`);
  });
  return ensureDatabase(database);
}

// A fresh database per test file, copied from the migrated template that npm test
// prepares (CREATE DATABASE ... TEMPLATE takes a fraction of a second).
import pg from 'pg';
import { randomBytes } from 'node:crypto';

function templateUrl(): URL {
  const url = process.env.TEST_TEMPLATE_DATABASE_URL;
  if (!url) throw new Error('TEST_TEMPLATE_DATABASE_URL is not set: run the tests with `npm test`.');
  return new URL(url);
}

async function onMaintenanceDb<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const url = templateUrl();
  url.pathname = '/postgres';
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const template = templateUrl();
  const templateName = template.pathname.slice(1);
  const name = `${templateName}_f${randomBytes(5).toString('hex')}`;
  // Two files may copy the template at the same moment; PostgreSQL refuses a template in use, so retry.
  for (let attempt = 0; ; attempt++) {
    try {
      await onMaintenanceDb((c) => c.query(`CREATE DATABASE ${name} TEMPLATE ${templateName}`));
      break;
    } catch (err) {
      if (attempt > 40 || !/being accessed by other users/.test(String(err))) throw err;
      await new Promise((r) => setTimeout(r, 100 + Math.random() * 200));
    }
  }
  const url = new URL(template);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => dropDatabase(name),
  };
}

// WITH (FORCE) refuses when an autovacuum worker happens to be in the database (its process
// belongs to no role the app role may signal); a plain DROP stops autovacuum workers itself,
// so fall back to it and retry while the worker winds down.
async function dropDatabase(name: string): Promise<void> {
  for (let attempt = 0; ; attempt++) {
    try {
      await onMaintenanceDb((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
      return;
    } catch (err) {
      if (!/pg_signal_backend|being accessed by other users/.test(String(err))) throw err;
      try {
        await onMaintenanceDb((c) => c.query(`DROP DATABASE IF EXISTS ${name}`));
        return;
      } catch (plainErr) {
        if (attempt > 20 || !/being accessed by other users/.test(String(plainErr))) throw plainErr;
        await new Promise((r) => setTimeout(r, 250));
      }
    }
  }
}

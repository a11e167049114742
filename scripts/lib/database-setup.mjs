// Brings the database up for the app: the private cluster (unless DATABASE_URL is set),
// the app database, migrations. Shared by start, dev, seed and test.
import { log } from './log.mjs';
import { startCluster, stopCluster, clusterUrl, appDatabase } from './postgres-cluster.mjs';
import { ensureAppRole, ensureDatabase } from './databases.mjs';
import { runTs } from './run-node.mjs';

/** Returns { databaseUrl, stop } where stop() stops the cluster only if this call started it. */
export async function setUpAppDatabase() {
  if (process.env.DATABASE_URL) {
    log('using the database server from DATABASE_URL');
    await runTs('server/src/db/migrate.ts', [], { DATABASE_URL: process.env.DATABASE_URL });
    return { databaseUrl: process.env.DATABASE_URL, cluster: null, stop: () => {} };
  }
  const cluster = startCluster();
  await ensureAppRole();
  await ensureDatabase(appDatabase);
  const databaseUrl = clusterUrl(appDatabase);
  await runTs('server/src/db/migrate.ts', [], { DATABASE_URL: databaseUrl });
  return {
    databaseUrl,
    cluster,
    stop: () => { if (cluster.startedHere) stopCluster(cluster); },
  };
}

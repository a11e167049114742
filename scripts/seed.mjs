// `npm run seed`: reloads the demo scenario into the app database (erasing what is there).
import { ensureDependencies } from './lib/dependencies.mjs';
ensureDependencies();
const { setUpAppDatabase } = await import('./lib/database-setup.mjs');
const { runTs } = await import('./lib/run-node.mjs');
const database = await setUpAppDatabase();
try {
  await runTs('seed/run.ts', ['--reset'], { DATABASE_URL: database.databaseUrl });
} finally {
  database.stop();
}

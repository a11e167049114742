// `npm run db:up`: starts the private database and migrates it, then leaves it running.
import { ensureDependencies } from './lib/dependencies.mjs';
ensureDependencies();
const { setUpAppDatabase } = await import('./lib/database-setup.mjs');
const { log } = await import('./lib/log.mjs');
const { databaseUrl } = await setUpAppDatabase();
log(`database ready at ${databaseUrl}`);

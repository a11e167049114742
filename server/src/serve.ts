// One server process: builds the app from its configuration, listens, and closes cleanly
// on SIGINT / SIGTERM. index.ts runs it directly or in each cluster worker.
import type { Config } from './config/env.js';
import { createApp } from './app.js';
import { isDatabaseUnavailable } from './errors/database-unavailable.js';

export async function serve(config: Config): Promise<void> {
  const created = await createApp(config);
  const port = await created.listen();
  created.context.logger.info({ pid: process.pid }, `Pollenpact is serving at http://${config.host}:${port}`);
  let closing = false;
  const shutdown = async () => {
    if (closing) return;
    closing = true;
    await created.close();
    process.exit(0);
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
  // pg-boss 10 marks a finished job done without waiting for the answer (`this.complete(...)`
  // in its manager.js), so a database connection lost at that moment is a rejection nobody
  // handles, and Node would end the process. The job then expires and runs again (jobs are
  // delivered at least once), so a lost connection is logged and the process goes on; any
  // other unhandled rejection still ends it, as Node does.
  process.on('unhandledRejection', (reason) => {
    if (isDatabaseUnavailable(reason)) {
      created.context.logger.warn({ err: reason }, 'database connection lost outside a request');
      return;
    }
    created.context.logger.fatal({ err: reason }, 'unhandled rejection');
    process.exit(1);
  });
}

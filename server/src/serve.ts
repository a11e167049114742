// One server process: builds the app from its configuration, listens, and closes cleanly
// on SIGINT / SIGTERM. index.ts runs it directly or in each cluster worker.
import type { Config } from './config/env.js';
import { createApp } from './app.js';

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
}

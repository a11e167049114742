// Starts the server: builds the app from the environment and listens. Signals close it.
import { loadConfig } from './config/env.js';
import { createApp } from './app.js';

const config = loadConfig();
const created = await createApp(config);
const port = await created.listen();
created.context.logger.info(`Pollenpact is serving at http://${config.host}:${port}`);
process.stdout.write(`\n  Pollenpact is ready: http://${config.host}:${port}\n\n`);

const shutdown = async () => {
  await created.close();
  process.exit(0);
};
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);

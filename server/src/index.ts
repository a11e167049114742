// Starts the server: one process, or WEB_CONCURRENCY processes behind Node's cluster module
// sharing one port. Sessions, jobs and socket rooms live in PostgreSQL, so any process can
// answer any request, and an alert raised in one reaches sockets held by another (the
// socket.io Postgres adapter). The primary only forks, restarts a worker that dies, and
// passes signals on.
import cluster from 'node:cluster';
import { loadConfig } from './config/env.js';
import { serve } from './serve.js';

const config = loadConfig();

function ready(processes: number) {
  process.stdout.write(`\n  Pollenpact is ready: http://${config.host}:${config.port}${processes > 1 ? ` (${processes} processes)` : ''}\n\n`);
}

if (config.webConcurrency > 1 && cluster.isPrimary) {
  let stopping = false;
  let listening = 0;
  const fork = () => cluster.fork();
  for (let i = 0; i < config.webConcurrency; i += 1) fork();
  cluster.on('listening', () => {
    listening += 1;
    if (listening === config.webConcurrency) ready(listening);
  });
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    process.stderr.write(`[pollenpact] server process ${worker.process.pid} ended (${signal ?? code}); starting another\n`);
    fork();
  });
  const stop = () => {
    if (stopping) return;
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.kill('SIGTERM');
    setTimeout(() => process.exit(0), 10_000).unref();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
} else {
  await serve(config);
  if (cluster.isPrimary) ready(1);
}

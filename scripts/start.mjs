// `npm start`: installs what is missing, starts the private database, migrates, seeds the
// demo when the database is empty, builds the client and compiles the server when their
// sources changed, starts the local stand-ins for the hosted services and serves the app
// with plain node (WEB_CONCURRENCY processes; 1 by default).
import { ensureDependencies } from './lib/dependencies.mjs';
ensureDependencies();

const { log } = await import('./lib/log.mjs');
const { setUpAppDatabase } = await import('./lib/database-setup.mjs');
const { runTs, spawnNode } = await import('./lib/run-node.mjs');
const { ensureClientBuilt } = await import('./lib/client-build.mjs');
const { ensureServerBuilt, serverEntry, fakesEntry } = await import('./lib/server-build.mjs');

const database = await setUpAppDatabase();
await runTs('seed/run.ts', ['--if-empty'], { DATABASE_URL: database.databaseUrl });
ensureClientBuilt();
ensureServerBuilt();

const env = { DATABASE_URL: database.databaseUrl, NODE_ENV: 'production' };
const fakes = spawnNode(fakesEntry, env);
const server = spawnNode(serverEntry, env);

const demoSignIns = [
  ['grower@orchard.test', 'farm owner'],
  ['applicator@orchard.test', 'same farm, applicator'],
  ['grower2@ridge.test', 'owner of a second farm'],
  ['keeper@apiary.test', 'apiary owner'],
  ['crew@apiary.test', 'same apiary, field crew'],
  ['keeper2@hives.test', 'owner of a second apiary'],
  ['admin@pollenpact.test', 'platform admin'],
];
setTimeout(() => {
  if (server.exitCode !== null) return;
  log('demo sign-ins (password for all: pollen-demo-2026):');
  for (const [email, who] of demoSignIns) log(`  ${email.padEnd(26)} ${who}`);
}, 3_000).unref();

let stopping = false;
function stopAll(code) {
  if (stopping) return;
  stopping = true;
  log('shutting down');
  for (const child of [server, fakes]) if (child.exitCode === null) child.kill('SIGTERM');
  const waitFor = (child) => new Promise((r) => (child.exitCode !== null ? r() : child.on('exit', r)));
  Promise.all([waitFor(server), waitFor(fakes)]).then(() => {
    database.stop();
    process.exit(code);
  });
}
process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));
server.on('exit', (code) => stopAll(code ?? 1));
fakes.on('exit', (code) => { if (!stopping) { log(`local stand-ins stopped (${code})`); stopAll(1); } });

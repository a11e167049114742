// `npm run dev`: database up, stand-ins, the server restarting on change (tsx watch) and
// the Vite dev server proxying /api and the socket to it.
import { ensureDependencies } from './lib/dependencies.mjs';
ensureDependencies();
const { spawn } = await import('node:child_process');
const { setUpAppDatabase } = await import('./lib/database-setup.mjs');
const { runTs, spawnTs } = await import('./lib/run-node.mjs');
const { repoRoot } = await import('./lib/postgres-cluster.mjs');

const database = await setUpAppDatabase();
await runTs('seed/run.ts', ['--if-empty'], { DATABASE_URL: database.databaseUrl });
const env = { ...process.env, DATABASE_URL: database.databaseUrl };
const children = [
  spawnTs('server/src/fakes/run.ts', env),
  spawn(process.execPath, ['--import', 'tsx', '--watch', 'server/src/index.ts'], { cwd: repoRoot, stdio: 'inherit', env }),
  spawn(process.execPath, ['node_modules/vite/bin/vite.js'], { cwd: repoRoot, stdio: 'inherit', env }),
];
const stop = () => { for (const c of children) c.kill('SIGTERM'); database.stop(); process.exit(0); };
process.on('SIGINT', stop);
process.on('SIGTERM', stop);

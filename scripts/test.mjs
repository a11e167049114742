// `npm test`: the same set-up as start against a fresh, migrated test template database
// (each test file works in its own copy of it), the client built for the browser tests,
// Chromium from Debian, then every suite with vitest.
import { ensureDependencies } from './lib/dependencies.mjs';
ensureDependencies();

const { spawnSync } = await import('node:child_process');
const { log } = await import('./lib/log.mjs');
const { startCluster, stopCluster, clusterUrl, superuserUrl, testTemplateDatabase, repoRoot } = await import('./lib/postgres-cluster.mjs');
const { ensureAppRole, recreateDatabase } = await import('./lib/databases.mjs');
const { ensureChromiumInstalled } = await import('./lib/system-packages.mjs');
const { ensureClientBuilt } = await import('./lib/client-build.mjs');
const { runTs } = await import('./lib/run-node.mjs');

const started = Date.now();
const cluster = startCluster();
let code = 1;
try {
  await ensureAppRole();
  await recreateDatabase(testTemplateDatabase);
  const templateUrl = clusterUrl(testTemplateDatabase);
  await runTs('server/src/db/migrate.ts', [], { DATABASE_URL: templateUrl });
  const chromium = ensureChromiumInstalled();
  const clientDist = process.env.POLLENPACT_CLIENT_DIST ?? 'dist/client';
  if (process.env.POLLENPACT_SKIP_BUILD !== '1') ensureClientBuilt({ force: true, outDir: clientDist });
  log(`set-up took ${((Date.now() - started) / 1000).toFixed(1)} s; running the suites`);
  const env = {
    ...process.env,
    TEST_TEMPLATE_DATABASE_URL: templateUrl,
    TEST_ADMIN_DATABASE_URL: superuserUrl(),
    CHROMIUM_PATH: chromium,
    PG_BIN_DIR: cluster.bin,
    CLIENT_DIST: clientDist,
  };
  // Two passes: domain and API files many at a time, then the browser files with the
  // machine to themselves (Chromium is the heaviest part on two cores).
  const vitest = (args) =>
    spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--passWithNoTests', ...args, ...process.argv.slice(2)], {
      cwd: repoRoot, stdio: 'inherit', env,
    }).status ?? 1;
  const first = vitest(['--project', 'domain', '--project', 'api']);
  // Arguments passed through win: add the browser pass's own worker count only when none was given.
  const workersGiven = process.argv.slice(2).some((a) => a.startsWith('--maxWorkers'));
  const second = vitest(['--project', 'e2e', ...(workersGiven ? [] : ['--maxWorkers', '2'])]);
  code = first || second;
} finally {
  if (cluster.startedHere) stopCluster(cluster);
}
log(`npm test finished in ${((Date.now() - started) / 1000).toFixed(1)} s`);
process.exit(code);

// Benchmark (not a test): the API under load, against the production build (the compiled
// server run with plain node, WEB_CONCURRENCY processes) on loopback, signed in. The demo
// season is loaded into a throwaway database; autocannon (a load generator from npm) sends
// the read routes a season overview calls, one at a time and then as a mix, and one write
// (a commitment offer on a listed request, a different request each time). Every request
// asks for a compressed answer as Chromium does (Accept-Encoding); the server compresses the
// built client's files, not the API's JSON (README, "Running for a whole valley").
// Reports req/s, p50 / p95 / p99 per route and the error count, with the targets.
// Run: npm run bench:api (the private PostgreSQL cluster must be running).
//   BENCH_PROCESSES (default 2), BENCH_SECONDS per read run (default 8), BENCH_CONNECTIONS (default 16).
import autocannon from 'autocannon';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { defineModels } from '../../server/src/db/models/index.js';
import { startSmtpSink } from '../../server/src/fakes/smtp-sink.js';
import { useBuilderDatabase } from '../support/builders/builder-database.js';
import { buildBlock, buildRequest } from '../support/builders/season.js';
import { seedScenario } from '../../seed/scenario.js';
import { createBenchDatabase, percentile } from './bench-database.js';
import { startBenchServer, signIn, type BenchServer } from './bench-server.js';

const PROCESSES = Number(process.env.BENCH_PROCESSES ?? 2);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 16);
const OFFERS = 1_000;
const DAY = 86_400_000;
/** What Chromium sends with every request. */
const acceptEncoding = 'gzip, deflate, br, zstd';
const readRoutes = [
  { name: 'season overview', path: '/api/dashboard/grower' },
  { name: 'blocks', path: '/api/blocks' },
  { name: 'requests', path: '/api/requests' },
  { name: 'alerts', path: '/api/alerts' },
  { name: 'invoices', path: '/api/invoices' },
];

interface RunFigures { requests: number; perSecond: number; p50: number; p95: number; p99: number; errors: number }

/** One autocannon run; latencies are taken per response so p95 can be reported exactly. */
async function load(options: autocannon.Options): Promise<RunFigures> {
  const latencies: number[] = [];
  let badStatus = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ connections: CONNECTIONS, pipelining: 1, ...options }, (err, finished) => (err ? reject(err) : resolve(finished)));
    instance.on('response', (_client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
      latencies.push(responseTime);
      if (statusCode >= 400) badStatus += 1;
    });
  });
  latencies.sort((a, b) => a - b);
  const seconds = result.duration || 1;
  return {
    requests: latencies.length,
    perSecond: latencies.length / seconds,
    p50: percentile(latencies, 50),
    p95: percentile(latencies, 95),
    p99: percentile(latencies, 99),
    errors: badStatus + result.errors + result.timeouts,
  };
}

const row = (name: string, f: RunFigures) =>
  `  ${name.padEnd(22)} ${f.perSecond.toFixed(0).padStart(6)} req/s  p50 ${f.p50.toFixed(1).padStart(6)} ms  p95 ${f.p95.toFixed(1).padStart(6)} ms  p99 ${f.p99.toFixed(1).padStart(6)} ms  errors ${f.errors}  (${f.requests} requests)`;
const verdict = (ok: boolean) => (ok ? 'met' : 'NOT MET');

async function main() {
  const db = await createBenchDatabase('api');
  const sink = await startSmtpSink();
  const sequelize = createSequelize(db.url, 4);
  let server: BenchServer | null = null;
  try {
    useBuilderDatabase({ sequelize, models: defineModels(sequelize) });
    const today = new Date();
    const world = await seedScenario(today);
    // Listed requests on the second farm for the offers (one apiary offers once per request).
    const farm2 = world.organizations.farm2;
    const block = await buildBlock({ farm: farm2, name: 'Offer bench block', lon: -120.3, lat: 46.4 });
    const offerTargets: string[] = [];
    for (let i = 0; i < OFFERS; i += 1) {
      const request = await buildRequest({ farm: farm2, title: `Bench request ${i}`, blocks: [{ block, colonies: 40 }], onSite: { from: new Date(today.getTime() + 20 * DAY), to: new Date(today.getTime() + 40 * DAY) } });
      offerTargets.push(request.id);
    }
    await sequelize.query('ANALYZE');

    server = await startBenchServer({
      DATABASE_URL: db.url, WEB_CONCURRENCY: String(PROCESSES), SMTP_PORT: String(sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${sink.httpPort}`,
    });
    const { baseUrl } = server;
    const grower = await signIn(baseUrl, 'grower@orchard.test');
    const keeper = await signIn(baseUrl, 'keeper@apiary.test');
    console.log(`production build, ${PROCESSES} server process(es), ${CONNECTIONS} connections, ${SECONDS} s per read run; demo season + ${OFFERS} listed requests`);

    // Warm the pools and caches before measuring.
    await load({ url: baseUrl, headers: { cookie: grower.cookie, 'accept-encoding': acceptEncoding }, duration: 2, requests: readRoutes.map((r) => ({ method: 'GET', path: r.path })) });

    // The floor under every read route on this machine: a request with no session, and a
    // signed-in request that only reads its session and user (two queries, no route work).
    console.log('floor (for reference, no target):');
    const floor = {
      health: await load({ url: `${baseUrl}/api/health`, duration: SECONDS }),
      session: await load({ url: `${baseUrl}/api/auth/me`, headers: { cookie: grower.cookie, 'accept-encoding': acceptEncoding }, duration: SECONDS }),
    };
    console.log(row('no session /health', floor.health));
    console.log(row('session only /auth/me', floor.session));

    console.log('read routes, one at a time:');
    const perRoute: Array<[string, RunFigures]> = [];
    for (const route of readRoutes) {
      const figures = await load({ url: `${baseUrl}${route.path}`, headers: { cookie: grower.cookie, 'accept-encoding': acceptEncoding }, duration: SECONDS });
      perRoute.push([route.name, figures]);
      console.log(row(`${route.name} ${route.path.replace('/api', '')}`, figures));
    }
    const mix = await load({ url: baseUrl, headers: { cookie: grower.cookie, 'accept-encoding': acceptEncoding }, duration: SECONDS * 2, requests: readRoutes.map((r) => ({ method: 'GET', path: r.path })) });
    console.log('read mix (the five routes in turn on every connection):');
    console.log(row('read mix', mix));

    let next = 0;
    const offers = await load({
      url: baseUrl,
      amount: OFFERS,
      headers: { cookie: keeper.cookie, 'accept-encoding': acceptEncoding, 'x-csrf-token': keeper.csrfToken, 'content-type': 'application/json' },
      requests: [{
        method: 'POST',
        setupRequest: (req: autocannon.Request) => ({ ...req, path: `/api/requests/${offerTargets[next++ % offerTargets.length]}/commitments`, body: JSON.stringify({ colonies: 10 }) }),
      }],
    });
    console.log('write:');
    console.log(row('commitment offer', offers));

    const totalErrors = perRoute.reduce((n, [, f]) => n + f.errors, 0) + mix.errors + offers.errors + floor.health.errors + floor.session.errors;
    console.log('targets:');
    console.log(`  read mix >= 1,000 req/s: ${mix.perSecond.toFixed(0)} req/s, ${verdict(mix.perSecond >= 1_000)}`);
    console.log(`  read mix p95 <= 25 ms: ${mix.p95.toFixed(1)} ms, ${verdict(mix.p95 <= 25)}`);
    console.log(`  errors = 0: ${totalErrors}, ${verdict(totalErrors === 0)}`);
  } finally {
    await server?.stop();
    await sequelize.close();
    await sink.stop();
    await db.drop();
  }
}

await main();

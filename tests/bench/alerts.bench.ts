// Benchmark (not a test): alert fan-out. 1,000 socket clients signed in over 200
// organizations (100 farms and 100 apiary businesses, 5 members each) to the compiled
// production server (WEB_CONCURRENCY processes); three rounds of 200 sprays, each next to one
// apiary's placed colonies. For every spray: the time from the request being sent to the
// alert arriving at each affected client (the farm's 5 and the apiary's 5 members), and to
// the last of them; and how many alerts reached clients that were not affected (must be 0).
// Run: npm run bench:alerts (the private PostgreSQL cluster must be running).
//   BENCH_PROCESSES (default 2).
import { io as connect, type Socket } from 'socket.io-client';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { defineModels } from '../../server/src/db/models/index.js';
import { startSmtpSink } from '../../server/src/fakes/smtp-sink.js';
import { useBuilderDatabase } from '../support/builders/builder-database.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildSignedSeason } from '../support/builders/season.js';
import { sprayInput } from '../support/builders/sprays.js';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/events.js';
import { createBenchDatabase, percentile, fmt } from './bench-database.js';
import { startBenchServer, signIn, type BenchServer, type BenchSession } from './bench-server.js';

const PAIRS = 100;
const MEMBERS = 5;
const SPRAYS = 200;
const PROCESSES = Number(process.env.BENCH_PROCESSES ?? 2);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const DAY = 86_400_000;

type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
interface Member { email: string; pair: number }

async function main() {
  const db = await createBenchDatabase('alerts');
  const sink = await startSmtpSink();
  const sequelize = createSequelize(db.url, 4);
  let server: BenchServer | null = null;
  const sockets: AppSocket[] = [];
  try {
    useBuilderDatabase({ sequelize, models: defineModels(sequelize) });
    const now = new Date();
    const pairs: Array<{ blockId: string; owner: string }> = [];
    const members: Member[] = [];
    for (let i = 0; i < PAIRS; i += 1) {
      const farm = await buildOrganization({ kind: 'farm', name: `Bench farm ${i}` });
      const apiary = await buildOrganization({ kind: 'apiary', name: `Bench apiary ${i}` });
      for (let m = 0; m < MEMBERS; m += 1) {
        members.push({ email: (await buildUser({ organization: farm, role: m === 0 ? 'owner' : 'manager', email: `farm${i}-m${m}@bench.test` })).email, pair: i });
        members.push({ email: (await buildUser({ organization: apiary, role: m === 0 ? 'owner' : 'crew', email: `apiary${i}-m${m}@bench.test` })).email, pair: i });
      }
      // Pairs sit 0.1° of longitude apart in ten rows, far outside one another's buffer.
      const season = await buildSignedSeason({ farm, apiary, lon: -121 + (i % 10) * 0.1, lat: 45 + Math.floor(i / 10) * 0.1, onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 30 * DAY) } });
      pairs.push({ blockId: season.block.id, owner: `farm${i}-m0@bench.test` });
    }
    await sequelize.query('ANALYZE');
    server = await startBenchServer({
      DATABASE_URL: db.url, WEB_CONCURRENCY: String(PROCESSES), SMTP_PORT: String(sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${sink.httpPort}`,
    });
    const { baseUrl } = server;

    // sprayId -> arrival times at affected clients; alerts at clients of another pair are counted apart.
    const sprayPair = new Map<string, number>();
    const arrivals = new Map<string, number[]>();
    const early = new Map<string, Array<{ pair: number; at: number }>>();
    let misdelivered = 0;
    const sessions = new Map<string, BenchSession>();
    const started = Date.now();
    for (let i = 0; i < members.length; i += 20) {
      await Promise.all(members.slice(i, i + 20).map(async (member) => {
        const session = await signIn(baseUrl, member.email);
        sessions.set(member.email, session);
        const socket: AppSocket = connect(baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: session.cookie }, reconnection: false, forceNew: true });
        await new Promise<void>((resolve, reject) => { socket.once('session:ready', () => resolve()); socket.once('connect_error', reject); });
        socket.on('alert:raised', (alert) => {
          const at = performance.now();
          const pair = sprayPair.get(alert.spray.id);
          if (pair === undefined) {
            const list = early.get(alert.spray.id) ?? [];
            list.push({ pair: member.pair, at });
            early.set(alert.spray.id, list);
          } else if (pair !== member.pair) misdelivered += 1;
          else arrivals.get(alert.spray.id)!.push(at);
        });
        sockets.push(socket);
      }));
    }
    console.log(`${sockets.length} sockets connected over ${PAIRS * 2} organizations (${PROCESSES} server processes) in ${((Date.now() - started) / 1000).toFixed(1)} s`);

    const nightStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + 5, 8));
    /** One round: SPRAYS sprays, two per pair on nights of their own; arrival times per delivery and per spray. */
    const round = async (r: number) => {
      const perDelivery: number[] = [];
      const perSpray: number[] = [];
      const perAnswer: number[] = [];
      for (let k = 0; k < SPRAYS; k += 1) {
        const pairIndex = k % PAIRS;
        const owner = sessions.get(pairs[pairIndex].owner)!;
        const startsAt = new Date(nightStart.getTime() + (r * Math.ceil(SPRAYS / PAIRS) + Math.floor(k / PAIRS)) * DAY);
        const sent = performance.now();
        const res = await fetch(`${baseUrl}/api/sprays`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-csrf-token': owner.csrfToken, cookie: owner.cookie },
          body: JSON.stringify(sprayInput({ blockIds: [pairs[pairIndex].blockId], startsAt })),
        });
        const body = (await res.json()) as { spray?: { id: string } };
        perAnswer.push(performance.now() - sent);
        if (res.status !== 201 || !body.spray) throw new Error(`planning failed: ${res.status} ${JSON.stringify(body)}`);
        const sprayId = body.spray.id;
        const list: number[] = [];
        for (const e of early.get(sprayId) ?? []) (e.pair === pairIndex ? list.push(e.at) : (misdelivered += 1));
        arrivals.set(sprayId, list);
        sprayPair.set(sprayId, pairIndex);
        const deadline = Date.now() + 5_000;
        while (list.length < MEMBERS * 2 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 1));
        if (list.length < MEMBERS * 2) throw new Error(`spray ${k}: ${list.length} of ${MEMBERS * 2} affected clients got the alert`);
        for (const at of list) perDelivery.push(at - sent);
        perSpray.push(Math.max(...list) - sent);
      }
      perDelivery.sort((a, b) => a - b);
      perSpray.sort((a, b) => a - b);
      perAnswer.sort((a, b) => a - b);
      return { perDelivery, perSpray, perAnswer };
    };
    const affected = MEMBERS * 2;
    const p95s: number[] = [];
    let deliveries = 0;
    for (let r = 0; r < ROUNDS; r += 1) {
      const { perDelivery, perSpray, perAnswer } = await round(r);
      deliveries += perDelivery.length;
      p95s.push(percentile(perSpray, 95));
      console.log(`  round ${r + 1}: request sent -> alert at each affected client p50 ${fmt(percentile(perDelivery, 50))}, p95 ${fmt(percentile(perDelivery, 95))}; at every affected client p50 ${fmt(percentile(perSpray, 50))}, p95 ${fmt(percentile(perSpray, 95))}, p99 ${fmt(percentile(perSpray, 99))}; the save's own answer p50 ${fmt(percentile(perAnswer, 50))}, p95 ${fmt(percentile(perAnswer, 95))}`);
    }
    // Late strays for the last sprays have a moment to show up before counting.
    await new Promise((r) => setTimeout(r, 500));
    p95s.sort((a, b) => a - b);
    const p95 = p95s[Math.floor(p95s.length / 2)];
    console.log(`${ROUNDS * SPRAYS} sprays planned: ${deliveries} alert deliveries to affected clients (${affected} each); ${sockets.length - affected} unaffected clients per spray`);
    console.log(`  alerts received by unaffected clients: ${misdelivered}`);
    console.log('targets:');
    console.log(`  p95 request -> every affected client <= 50 ms: ${fmt(p95)} (median round; ${fmt(p95s[0])} to ${fmt(p95s[p95s.length - 1])} over ${ROUNDS} rounds), ${p95 <= 50 ? 'met' : 'NOT MET'}`);
    console.log(`  unaffected clients receive nothing: ${misdelivered}, ${misdelivered === 0 ? 'met' : 'NOT MET'}`);
  } finally {
    for (const s of sockets) s.disconnect();
    await server?.stop();
    await sequelize.close();
    await sink.stop();
    await db.drop();
  }
}

await main();

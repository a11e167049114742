// Benchmark (not a test): 500 socket clients signed in over 100 organizations (50 farms,
// 50 apiary businesses, 5 members each); 200 sprays planned, each next to one apiary's
// placed colonies. Reports p50/p95 from the API answer to the alert's arrival at each
// affected client (10 per spray), and from the request being sent.
// Run: npm run bench:alerts (the private PostgreSQL cluster must be running).
import request from 'supertest';
import { io as connect, type Socket } from 'socket.io-client';
import { loadConfig } from '../../server/src/config/env.js';
import { createApp } from '../../server/src/app.js';
import { startSmtpSink } from '../../server/src/fakes/smtp-sink.js';
import { buildOrganization, buildUser, defaultTestPassword } from '../support/builders/accounts.js';
import { buildSignedSeason } from '../support/builders/season.js';
import { sprayInput } from '../support/builders/sprays.js';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/events.js';
import { createBenchDatabase, percentile, fmt } from './bench-database.js';

const PAIRS = 50;
const MEMBERS = 5;
const SPRAYS = 200;
const DAY = 86_400_000;

type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

async function main() {
  const db = await createBenchDatabase('alerts');
  const sink = await startSmtpSink();
  const config = loadConfig({
    NODE_ENV: 'test', DATABASE_URL: db.url, LOG_LEVEL: 'silent', SMTP_PORT: String(sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${sink.httpPort}`,
    LOGIN_RATE_LIMIT_PER_ACCOUNT: '100000', LOGIN_RATE_LIMIT_PER_ADDRESS: '100000', DATABASE_POOL_MAX: '20',
  });
  const app = await createApp(config);
  const port = await app.listen(0, '127.0.0.1');
  const baseUrl = `http://127.0.0.1:${port}`;
  const sockets: AppSocket[] = [];
  try {
    const now = new Date();
    const farms: Array<{ blockId: string; owner: string; members: string[] }> = [];
    const apiaryMembers: string[][] = [];
    for (let i = 0; i < PAIRS; i++) {
      const farm = await buildOrganization({ kind: 'farm', name: `Bench farm ${i}` });
      const apiary = await buildOrganization({ kind: 'apiary', name: `Bench apiary ${i}` });
      const farmEmails = [];
      const apiaryEmails = [];
      for (let m = 0; m < MEMBERS; m++) {
        farmEmails.push((await buildUser({ organization: farm, role: m === 0 ? 'owner' : 'manager', email: `farm${i}-m${m}@bench.test` })).email);
        apiaryEmails.push((await buildUser({ organization: apiary, role: m === 0 ? 'owner' : 'crew', email: `apiary${i}-m${m}@bench.test` })).email);
      }
      // Each pair 0.2° of longitude apart, far outside one another's buffer.
      const season = await buildSignedSeason({ farm, apiary, lon: -121 + i * 0.2, lat: 45, onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 30 * DAY) } });
      farms.push({ blockId: season.block.id, owner: farmEmails[0], members: farmEmails });
      apiaryMembers.push(apiaryEmails);
    }

    const signIn = async (email: string) => {
      const agent = request.agent(baseUrl);
      const csrf = (await agent.get('/api/auth/csrf')).body.csrfToken;
      const res = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email, password: defaultTestPassword });
      if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status}`);
      return { agent, csrf: res.body.csrfToken as string, cookie: ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ') };
    };

    // sprayId -> arrival times at clients
    const arrivals = new Map<string, number[]>();
    const early: Array<{ sprayId: string; at: number }> = [];
    const signedUp = Date.now();
    const sessions = new Map<string, Awaited<ReturnType<typeof signIn>>>();
    const allEmails = [...farms.flatMap((f) => f.members), ...apiaryMembers.flat()];
    for (let i = 0; i < allEmails.length; i += 10) {
      await Promise.all(allEmails.slice(i, i + 10).map(async (email) => {
        const session = await signIn(email);
        sessions.set(email, session);
        const socket: AppSocket = connect(baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: session.cookie }, reconnection: false, forceNew: true });
        await new Promise<void>((resolve, reject) => { socket.once('session:ready', () => resolve()); socket.once('connect_error', reject); });
        socket.on('alert:raised', (alert) => {
          const at = performance.now();
          const list = arrivals.get(alert.spray.id);
          if (list) list.push(at);
          else early.push({ sprayId: alert.spray.id, at });
        });
        sockets.push(socket);
      }));
    }
    console.log(`${sockets.length} sockets connected over ${PAIRS * 2} organizations in ${((Date.now() - signedUp) / 1000).toFixed(1)} s`);

    const sinceAnswer: number[] = [];
    const sinceRequest: number[] = [];
    const nightStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + 5, 8));
    for (let k = 0; k < SPRAYS; k++) {
      const farm = farms[k % PAIRS];
      const owner = sessions.get(farm.owner)!;
      const startsAt = new Date(nightStart.getTime() + Math.floor(k / PAIRS) * DAY);
      const sent = performance.now();
      const res = await owner.agent.post('/api/sprays').set('X-CSRF-Token', owner.csrf).send(sprayInput({ blockIds: [farm.blockId], startsAt }));
      const answered = performance.now();
      if (res.status !== 201) throw new Error(`planning failed: ${res.status} ${JSON.stringify(res.body)}`);
      const sprayId = res.body.spray.id as string;
      const list: number[] = early.filter((e) => e.sprayId === sprayId).map((e) => e.at);
      arrivals.set(sprayId, list);
      const deadline = Date.now() + 5_000;
      while (list.length < MEMBERS * 2 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 1));
      if (list.length < MEMBERS * 2) throw new Error(`spray ${k}: ${list.length} of ${MEMBERS * 2} clients got the alert`);
      for (const at of list) {
        sinceAnswer.push(at - answered);
        sinceRequest.push(at - sent);
      }
    }
    sinceAnswer.sort((a, b) => a - b);
    sinceRequest.sort((a, b) => a - b);
    console.log(`${SPRAYS} sprays planned, ${sinceAnswer.length} alert deliveries (${MEMBERS * 2} affected clients each, none elsewhere counted)`);
    console.log(`  API answer -> alert at client: p50 ${fmt(sinceAnswer[Math.floor(sinceAnswer.length / 2)])}, p95 ${fmt(percentile(sinceAnswer, 95))} (negative: the alert arrived before the answer)`);
    console.log(`  request sent -> alert at client: p50 ${fmt(percentile(sinceRequest, 50))}, p95 ${fmt(percentile(sinceRequest, 95))}`);
    console.log('target: p95 under 100 ms on this 2-core machine');
  } finally {
    for (const s of sockets) s.disconnect();
    await app.close();
    await sink.stop();
    await db.drop();
  }
}

await main();

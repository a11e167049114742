// Benchmark (not a test): the spray conflict check for one new spray in a synthetic valley
// of 20,000 blocks with 100,000 placements in the current season plus nine earlier seasons
// at the same drop sites (1,000,000 placement rows); then at ten times the current-season
// density (ten placements at every drop site this season). Reports p50/p95/p99, the growth
// ratio, the targets, and EXPLAIN (ANALYZE, BUFFERS) of the slowest spray's search.
// Run: npm run bench:conflicts (the private PostgreSQL cluster must be running).
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { runConflictCheck } from '../../server/src/modules/conflicts/conflict-check.js';
import { createBenchDatabase, percentile, fmt } from './bench-database.js';

const BLOCKS = 20_000;
const SITES_PER_BLOCK = 5; // one placement per drop site and season: 100,000 placements a season
const RUNS = 300;
/** Rounds of RUNS sprays on the same valley, for the run-to-run spread. */
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const WARMUP = 30;
const SEASON_START = '2027-04-01T15:00:00Z';

async function buildValley(seq: Sequelize) {
  await seq.query(`
    INSERT INTO organizations (kind, name) SELECT 'farm', 'Bench farm ' || g FROM generate_series(1, 400) g;
    INSERT INTO organizations (kind, name) SELECT 'apiary', 'Bench apiary ' || g FROM generate_series(1, 200) g;
    -- 20,000 blocks of about 20 acres scattered over a valley of about 100 x 110 km (a fifth of it orchard).
    WITH farms AS (SELECT id, row_number() OVER (ORDER BY id) AS rn FROM organizations WHERE kind = 'farm'),
         spots AS (SELECT g, -120.6 + random() * 1.27 AS x, 44.5 + random() * 1.0 AS y FROM generate_series(1, ${BLOCKS}) g)
    INSERT INTO blocks (farm_id, name, crop, outline, location, area_m2, colonies_per_acre)
    SELECT farms.id, 'Block ' || g, 'apple', ST_MakeEnvelope(x - 0.0018, y - 0.0013, x + 0.0018, y + 0.0013, 4326),
      ST_SetSRID(ST_MakePoint(x, y), 4326), 80000, 2
    FROM spots JOIN farms ON farms.rn = (spots.g % 400) + 1;
    INSERT INTO bloom_windows (block_id, season, bloom_start, petal_fall) SELECT id, 2027, DATE '2027-04-05' + (random() * 6)::int, DATE '2027-04-22' + (random() * 6)::int FROM blocks;
    INSERT INTO hive_requests (farm_id, title, state, colonies_requested, min_frames_of_bees, arrive_rule, depart_rule, expected_on_site, price_per_colony_cents)
    SELECT farm_id, id::text, 'filled', 40, 6, 'date', 'date', tstzrange('${SEASON_START}', '2027-05-01T15:00:00Z'), 6500 FROM blocks;
    INSERT INTO drop_sites (request_id, block_id, name, location, colonies_planned)
    SELECT r.id, b.id, 'Site ' || k, ST_SetSRID(ST_MakePoint(ST_X(b.location) + (random() - 0.5) * 0.004, ST_Y(b.location) + (random() - 0.5) * 0.003), 4326), 8
    FROM hive_requests r JOIN blocks b ON b.id::text = r.title, generate_series(1, ${SITES_PER_BLOCK}) k;
    WITH apiaries AS (SELECT array_agg(id) AS ids FROM organizations WHERE kind = 'apiary')
    INSERT INTO commitments (request_id, apiary_id, colonies, state)
    SELECT r.id, apiaries.ids[1 + floor(random() * 200)::int], 40, 'accepted' FROM hive_requests r, apiaries;
    INSERT INTO agreements (commitment_id, request_id, farm_id, apiary_id, state, colonies, price_per_colony_cents, currency, min_frames_of_bees,
      expected_on_site, notice_hours, deposit_share_bp, balance_due_days, late_interest_bp_per_month, below_minimum_rate_bp, extra_move_fee_cents)
    SELECT c.id, r.id, r.farm_id, c.apiary_id, 'in-force', 40, 6500, 'USD', 6, r.expected_on_site, 48, 5000, 30, 100, 0, 0
    FROM commitments c JOIN hive_requests r ON r.id = c.request_id;
  `);
  await addSeasons(seq, 0, 0);
}

/** `copies` placements at every drop site for each season `from`..`to` years before the current one. */
async function addSeasons(seq: Sequelize, from: number, to: number, copies = 1) {
  await seq.query(`
    INSERT INTO placements (agreement_id, drop_site_id, state, colonies_planned, on_site, colonies_delivered, delivered_at, colonies_picked_up, picked_up_at)
    SELECT a.id, d.id, CASE WHEN s = 0 THEN 'delivered' ELSE 'picked-up' END, 8,
      tstzrange(x.t0, CASE WHEN s = 0 THEN NULL ELSE x.t0 + interval '25 days' END, '[)'), 8, x.t0,
      CASE WHEN s = 0 THEN NULL ELSE 8 END, CASE WHEN s = 0 THEN NULL ELSE x.t0 + interval '25 days' END
    FROM drop_sites d JOIN agreements a ON a.request_id = d.request_id, generate_series(${from}, ${to}) s, generate_series(1, ${copies}) c,
      LATERAL (SELECT TIMESTAMPTZ '${SEASON_START}' - make_interval(years => s) + random() * interval '10 days' + (d.colonies_planned + c) * interval '0 s' AS t0) x;
    ANALYZE;
  `);
}

interface Spray { farmId: string; blockId: string; from: Date; ms: number }

/** The plan of the conflict search for one spray, as PostgreSQL ran it. */
async function explain(seq: Sequelize, spray: Spray) {
  const { conflictSearchSqlForExplain, searchBind } = await import('../../server/src/modules/conflicts/conflicts.queries.js');
  const bind = searchBind({ farmId: spray.farmId, blockIds: [spray.blockId], from: spray.from, to: new Date(spray.from.getTime() + 3 * 3_600_000), exposureTo: new Date(spray.from.getTime() + 27 * 3_600_000), bufferM: 1609.344 });
  const plan = await seq.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS) ${conflictSearchSqlForExplain}`, { bind, type: QueryTypes.SELECT });
  return plan.map((r) => `    ${r['QUERY PLAN']}`).join('\n');
}

async function measure(seq: Sequelize): Promise<{ p50: number; p95: number; p99: number; found: number; slowest: Spray }> {
  const blocks = await seq.query<{ id: string; farm_id: string }>(`SELECT id, farm_id FROM blocks ORDER BY random() LIMIT ${RUNS + WARMUP}`, { type: QueryTypes.SELECT });
  const times: number[] = [];
  let found = 0;
  let slowest: Spray = { farmId: blocks[0].farm_id, blockId: blocks[0].id, from: new Date('2027-04-08T06:00:00Z'), ms: -1 };
  for (const [i, block] of blocks.entries()) {
    const from = new Date(Date.parse('2027-04-08T06:00:00Z') + (i % 14) * 86_400_000);
    const started = performance.now();
    const check = await runConflictCheck(seq, {
      farmId: block.farm_id, blockIds: [block.id], from, to: new Date(from.getTime() + 3 * 3_600_000), ld50UgPerBee: null, rt25Hours: null,
      bufferM: 1609.344, noticedAt: new Date('2027-04-01T00:00:00Z'),
    });
    const elapsed = performance.now() - started;
    if (i >= WARMUP) {
      times.push(elapsed);
      found += check.conflicts.reduce((n, c) => n + (c.colonies?.dropSites.length ?? 0), 0);
      if (elapsed > slowest.ms) slowest = { farmId: block.farm_id, blockId: block.id, from, ms: elapsed };
    }
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), p99: percentile(times, 99), found: found / RUNS, slowest };
}

type Figures = Awaited<ReturnType<typeof measure>>;

/** ROUNDS measurements; gives the round with the median p95 and the spread of p95 over the rounds. */
async function measureRounds(seq: Sequelize): Promise<Figures & { spread: string }> {
  const rounds: Figures[] = [];
  for (let r = 0; r < ROUNDS; r += 1) {
    const figures = await measure(seq);
    console.log(`    round ${r + 1}: p50 ${fmt(figures.p50)}, p95 ${fmt(figures.p95)}, p99 ${fmt(figures.p99)}`);
    rounds.push(figures);
  }
  const byP95 = [...rounds].sort((a, b) => a.p95 - b.p95);
  const slowest = rounds.reduce((a, b) => (b.slowest.ms > a.slowest.ms ? b : a)).slowest;
  return { ...byP95[Math.floor(byP95.length / 2)], slowest, spread: `p95 ${fmt(byP95[0].p95)} to ${fmt(byP95[byP95.length - 1].p95)} over ${ROUNDS} rounds` };
}

async function main() {
  const startedAt = Date.now();
  const db = await createBenchDatabase('conflicts');
  const seq = createSequelize(db.url, 4);
  try {
    await buildValley(seq);
    await addSeasons(seq, 1, 9);
    const count = async () => Number((await seq.query<{ n: string }>('SELECT count(*) AS n FROM placements', { type: QueryTypes.SELECT }))[0].n);
    if (process.env.BENCH_KEEP) { console.log(`kept ${db.url}`); await seq.close(); process.exit(0); }
    console.log('at this season\'s density:');
    const base = await measureRounds(seq);
    const baseCount = await count();
    console.log(`valley: ${BLOCKS} blocks, ${BLOCKS * SITES_PER_BLOCK} placements this season, ${baseCount} placement rows with nine earlier seasons (built in ${((Date.now() - startedAt) / 1000).toFixed(1)} s)`);
    console.log(`  conflict check, one new spray: p50 ${fmt(base.p50)}, p95 ${fmt(base.p95)}, p99 ${fmt(base.p99)} (median round of ${RUNS} sprays; ${base.spread}; ${base.found.toFixed(1)} drop sites found per spray)`);
    const basePlan = await explain(seq, base.slowest);
    await addSeasons(seq, 0, 0, 9);
    console.log('at ten times this season\'s density:');
    const dense = await measureRounds(seq);
    const denseCount = await count();
    console.log(`valley at 10x this season's density: ten placements at every drop site this season, ${denseCount} placement rows`);
    console.log(`  conflict check, one new spray: p50 ${fmt(dense.p50)}, p95 ${fmt(dense.p95)}, p99 ${fmt(dense.p99)} (median round; ${dense.spread}; ${dense.found.toFixed(1)} drop sites found per spray)`);
    const ratio = dense.p95 / base.p95;
    console.log(`ratio at 10x density: p50 x${(dense.p50 / base.p50).toFixed(2)}, p95 x${ratio.toFixed(2)}`);
    console.log('targets:');
    console.log(`  p95 <= 10 ms at 100,000 placements this season (1,000,000 rows): ${fmt(base.p95)}, ${base.p95 <= 10 ? 'met' : 'NOT MET'}`);
    console.log(`  p95 at 10x density <= 1.5x p95 at 1x: x${ratio.toFixed(2)}, ${ratio <= 1.5 ? 'met' : 'NOT MET'}`);
    const slowest = dense.slowest.ms > base.slowest.ms ? dense.slowest : base.slowest;
    console.log(`plan of the conflict search for the slowest spray at 1x (${fmt(base.slowest.ms)}):`);
    console.log(basePlan);
    console.log(`plan of the conflict search for the slowest spray overall (${fmt(slowest.ms)}):`);
    console.log(await explain(seq, slowest));
  } finally {
    await seq.close();
    await db.drop();
  }
}

await main();

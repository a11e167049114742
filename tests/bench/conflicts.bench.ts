// Benchmark (not a test): the spray conflict check for one new spray in a synthetic valley
// of 10,000 blocks and 50,000 placements, then with ten times the placements (nine earlier
// seasons of history at the same drop sites). Reports p50/p95 and the growth ratio.
// Run: npm run bench:conflicts (the private PostgreSQL cluster must be running).
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { runConflictCheck } from '../../server/src/modules/conflicts/conflict-check.js';
import { createBenchDatabase, percentile, fmt } from './bench-database.js';

const BLOCKS = 10_000;
const SITES_PER_BLOCK = 5; // one placement per drop site and season: 50,000 placements a season
const RUNS = 300;
const WARMUP = 30;
const SEASON_START = '2027-04-01T15:00:00Z';

async function buildValley(seq: Sequelize) {
  await seq.query(`
    INSERT INTO organizations (kind, name) SELECT 'farm', 'Bench farm ' || g FROM generate_series(1, 200) g;
    INSERT INTO organizations (kind, name) SELECT 'apiary', 'Bench apiary ' || g FROM generate_series(1, 100) g;
    -- 10,000 blocks of about 20 acres scattered over a valley of about 70 x 80 km (a quarter of it orchard).
    WITH farms AS (SELECT id, row_number() OVER (ORDER BY id) AS rn FROM organizations WHERE kind = 'farm'),
         spots AS (SELECT g, -120.45 + random() * 0.9 AS x, 44.64 + random() * 0.72 AS y FROM generate_series(1, ${BLOCKS}) g)
    INSERT INTO blocks (farm_id, name, crop, outline, location, area_m2, colonies_per_acre)
    SELECT farms.id, 'Block ' || g, 'apple', ST_MakeEnvelope(x - 0.0018, y - 0.0013, x + 0.0018, y + 0.0013, 4326),
      ST_SetSRID(ST_MakePoint(x, y), 4326), 80000, 2
    FROM spots JOIN farms ON farms.rn = (spots.g % 200) + 1;
    INSERT INTO bloom_windows (block_id, season, bloom_start, petal_fall) SELECT id, 2027, DATE '2027-04-05' + (random() * 6)::int, DATE '2027-04-22' + (random() * 6)::int FROM blocks;
    INSERT INTO hive_requests (farm_id, title, state, colonies_requested, min_frames_of_bees, arrive_rule, depart_rule, expected_on_site, price_per_colony_cents)
    SELECT farm_id, id::text, 'filled', 40, 6, 'date', 'date', tstzrange('${SEASON_START}', '2027-05-01T15:00:00Z'), 6500 FROM blocks;
    INSERT INTO drop_sites (request_id, block_id, name, location, colonies_planned)
    SELECT r.id, b.id, 'Site ' || k, ST_SetSRID(ST_MakePoint(ST_X(b.location) + (random() - 0.5) * 0.004, ST_Y(b.location) + (random() - 0.5) * 0.003), 4326), 8
    FROM hive_requests r JOIN blocks b ON b.id::text = r.title, generate_series(1, ${SITES_PER_BLOCK}) k;
    WITH apiaries AS (SELECT array_agg(id) AS ids FROM organizations WHERE kind = 'apiary')
    INSERT INTO commitments (request_id, apiary_id, colonies, state)
    SELECT r.id, apiaries.ids[1 + floor(random() * 100)::int], 40, 'accepted' FROM hive_requests r, apiaries;
    INSERT INTO agreements (commitment_id, request_id, farm_id, apiary_id, state, colonies, price_per_colony_cents, currency, min_frames_of_bees,
      expected_on_site, notice_hours, deposit_share_bp, balance_due_days, late_interest_bp_per_month, below_minimum_rate_bp, extra_move_fee_cents)
    SELECT c.id, r.id, r.farm_id, c.apiary_id, 'in-force', 40, 6500, 'USD', 6, r.expected_on_site, 48, 5000, 30, 100, 0, 0
    FROM commitments c JOIN hive_requests r ON r.id = c.request_id;
  `);
  await addSeasons(seq, 0, 0);
}

/** Placements at every drop site for the seasons `from`..`to` years before the current one. */
async function addSeasons(seq: Sequelize, from: number, to: number) {
  await seq.query(`
    INSERT INTO placements (agreement_id, drop_site_id, state, colonies_planned, on_site, colonies_delivered, delivered_at, colonies_picked_up, picked_up_at)
    SELECT a.id, d.id, CASE WHEN s = 0 THEN 'delivered' ELSE 'picked-up' END, 8,
      tstzrange(x.t0, CASE WHEN s = 0 THEN NULL ELSE x.t0 + interval '25 days' END, '[)'), 8, x.t0,
      CASE WHEN s = 0 THEN NULL ELSE 8 END, CASE WHEN s = 0 THEN NULL ELSE x.t0 + interval '25 days' END
    FROM drop_sites d JOIN agreements a ON a.request_id = d.request_id, generate_series(${from}, ${to}) s,
      LATERAL (SELECT TIMESTAMPTZ '${SEASON_START}' - make_interval(years => s) + random() * interval '10 days' + d.colonies_planned * interval '0 s' AS t0) x;
    ANALYZE;
  `);
}

/** With BENCH_EXPLAIN=1, prints the plan of the exposure search for one spray. */
async function explain(seq: Sequelize) {
  if (!process.env.BENCH_EXPLAIN) return;
  const { exposureSqlForExplain } = await import('../../server/src/modules/conflicts/conflict-search.js');
  const [block] = await seq.query<{ id: string; farm_id: string }>('SELECT id, farm_id FROM blocks LIMIT 1', { type: QueryTypes.SELECT });
  const plan = await seq.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS) ${exposureSqlForExplain}`, {
    replacements: { farmId: block.farm_id, blockIds: `{${block.id}}`, from: '2027-04-08T06:00:00Z', to: '2027-04-08T09:00:00Z', exposureTo: '2027-04-09T09:00:00Z', bufferM: 1609.344 },
    type: QueryTypes.SELECT,
  });
  console.log(plan.map((r) => r['QUERY PLAN']).join('\n'));
}

async function measure(seq: Sequelize): Promise<{ p50: number; p95: number; found: number }> {
  const blocks = await seq.query<{ id: string; farm_id: string }>(`SELECT id, farm_id FROM blocks ORDER BY random() LIMIT ${RUNS + WARMUP}`, { type: QueryTypes.SELECT });
  const times: number[] = [];
  let found = 0;
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
    }
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), found: found / RUNS };
}

async function main() {
  const startedAt = Date.now();
  const db = await createBenchDatabase('conflicts');
  const seq = createSequelize(db.url, 4);
  try {
    await buildValley(seq);
    const count = async () => Number((await seq.query<{ n: string }>('SELECT count(*) AS n FROM placements', { type: QueryTypes.SELECT }))[0].n);
    await explain(seq);
    if (process.env.BENCH_KEEP) { console.log(`kept ${db.url}`); await seq.close(); process.exit(0); }
    const base = await measure(seq);
    const baseCount = await count();
    console.log(`valley: ${BLOCKS} blocks, ${baseCount} placements (built in ${((Date.now() - startedAt) / 1000).toFixed(1)} s)`);
    console.log(`  conflict check, one new spray: p50 ${fmt(base.p50)}, p95 ${fmt(base.p95)} (${RUNS} sprays; ${base.found.toFixed(1)} drop sites found per spray)`);
    await addSeasons(seq, 1, 9);
    const big = await measure(seq);
    const bigCount = await count();
    console.log(`valley: ${BLOCKS} blocks, ${bigCount} placements (x${(bigCount / baseCount).toFixed(0)}: nine earlier seasons at the same drop sites)`);
    console.log(`  conflict check, one new spray: p50 ${fmt(big.p50)}, p95 ${fmt(big.p95)} (${big.found.toFixed(1)} drop sites found per spray)`);
    console.log(`ratio at 10x placements: p50 x${(big.p50 / base.p50).toFixed(2)}, p95 x${(big.p95 / base.p95).toFixed(2)}`);
    console.log('targets: p95 under 20 ms at 50,000 placements; under 2x growth at 10x');
  } finally {
    await seq.close();
    await db.drop();
  }
}

await main();

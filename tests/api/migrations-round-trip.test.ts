// The latest migrations on a database that already holds a season: undone and done again on
// a copy of the migrated schema (as an upgrade from the release before them runs them), the
// published reference rows come back exactly as a fresh install has them, a farm's own stage
// thresholds and edited critical temperatures are kept, and the payment columns come back.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { createMigrator } from '../../server/src/db/migrator.js';
import { createTestDatabase } from '../support/test-database.js';

/** Undone back to (and with) this one: the frost stage paths and the overpayment columns, and any later. */
const undoneBackTo = '0011-frost-stage-paths';

describe('the latest migrations, undone and done again on a database with data', () => {
  let database: { url: string; drop: () => Promise<void> };
  let sequelize: Sequelize;

  beforeAll(async () => {
    database = await createTestDatabase();
    sequelize = createSequelize(database.url, 2);
  });
  afterAll(async () => {
    await sequelize?.close();
    await database?.drop();
  });

  const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const publishedStages = () => rows('SELECT crop, stage, label, sort_order, base_f, dd_low_f, dd_high_f, source FROM crop_stage_thresholds WHERE farm_id IS NULL ORDER BY crop, sort_order, stage');
  const frostTable = () => rows('SELECT crop, stage_label, stage, sort_order, kill10_f, kill90_f, source FROM frost_critical_temperatures ORDER BY crop, sort_order');
  const columnsOf = async (table: string) => (await rows<{ column_name: string }>('SELECT column_name FROM information_schema.columns WHERE table_name = :table', { table })).map((c) => c.column_name);

  it('restores the published reference and the payment columns, and keeps a farm\'s own rows and edits', async () => {
    const freshStages = await publishedStages();
    const freshFrost = await frostTable();
    expect(freshStages.length).toBeGreaterThan(0);

    const migrator = createMigrator(sequelize);
    await migrator.down({ to: undoneBackTo });
    const undone = (await migrator.pending()).map((m) => m.name);
    expect(undone.slice(0, 2)).toEqual(['0011-frost-stage-paths', '0012-overpayments-one-checkout']);
    expect(await columnsOf('payments')).not.toContain('overpaid_cents');
    // Before 0011 apple had no tight-cluster stage and pear no stage path.
    expect((await publishedStages()).filter((s) => (s as { crop: string }).crop === 'pear')).toEqual([]);

    // Kept on the release before: a farm's own threshold and an edited critical temperature.
    const [{ id: farmId }] = await rows<{ id: string }>("INSERT INTO organizations (kind, name) VALUES ('farm', 'Upgrade Test Orchard') RETURNING id");
    await sequelize.query(
      `INSERT INTO crop_stage_thresholds (farm_id, crop, stage, label, sort_order, base_f, dd_low_f, dd_high_f, source)
       VALUES (:farmId, 'apple', 'tight-cluster', 'Tight cluster (our orchard)', 3, 43, 150, 190, 'Our own records')`, { replacements: { farmId } });
    await sequelize.query("UPDATE frost_critical_temperatures SET kill10_f = 27.5 WHERE crop = 'apple' AND stage_label = 'Full pink to full bloom'");
    const edited = await rows<{ kill10_f: number }>("SELECT kill10_f FROM frost_critical_temperatures WHERE crop = 'apple' AND stage_label = 'Full pink to full bloom'");
    expect(edited).toEqual([{ kill10_f: 27.5 }]);

    await migrator.up();
    expect(await migrator.pending()).toEqual([]);
    expect(await columnsOf('payments')).toContain('overpaid_cents');
    expect(await columnsOf('invoices')).toContain('open_checkout_session_id');
    expect(await publishedStages()).toEqual(freshStages);
    const frost = await frostTable();
    // Every row as a fresh install has it, but the farm's edit of the bloom row, which is kept.
    expect(frost).toEqual(freshFrost.map((r) => ((r as { crop: string; stage_label: string }).crop === 'apple' && (r as { stage_label: string }).stage_label === 'Full pink to full bloom' ? { ...r, kill10_f: 27.5 } : r)));
    expect(await rows("SELECT label, source FROM crop_stage_thresholds WHERE farm_id = :farmId", { farmId })).toEqual([{ label: 'Tight cluster (our orchard)', source: 'Our own records' }]);
  });
});

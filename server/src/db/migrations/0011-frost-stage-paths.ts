// A degree-day stage for every published critical-temperature row: apple gains silver tip,
// half-inch green and tight cluster; pear and sweet cherry gain a stage path of their own,
// so frost warnings reach every row of their tables. Published rows only; a farm's own
// thresholds and edited temperatures are left as they are.
import type { MigrationContext } from '../migrator.js';
import { frostRows, insertPublishedReference, stageRows } from '../../modules/bloom/published-reference.js';

export async function up({ sequelize }: MigrationContext) {
  await insertPublishedReference(sequelize);
  for (const [crop, stage, , sortOrder] of stageRows) {
    await sequelize.query(
      'UPDATE crop_stage_thresholds SET sort_order = :sortOrder WHERE farm_id IS NULL AND variety IS NULL AND crop = :crop AND stage = :stage',
      { replacements: { crop, stage, sortOrder } },
    );
  }
  for (const [crop, label, stage] of frostRows) {
    await sequelize.query('UPDATE frost_critical_temperatures SET stage = :stage WHERE crop = :crop AND stage_label = :label', { replacements: { crop, label, stage } });
  }
}

/** Back to the stage keys and apple stages of 0004. */
export async function down({ sequelize }: MigrationContext) {
  const before: Record<string, string> = { 'green-tip': 'green-tip', pink: 'pink', bloom: 'bloom', 'petal-fall': 'petal-fall' };
  for (const [crop, label, stage] of frostRows) {
    const kept = crop === 'pear' && label === 'Full white' ? 'pink' : crop === 'sweet-cherry' && label === 'First white' ? 'pink' : before[stage] ?? null;
    await sequelize.query('UPDATE frost_critical_temperatures SET stage = :kept WHERE crop = :crop AND stage_label = :label', { replacements: { crop, label, kept } });
  }
  await sequelize.query(`
    DELETE FROM crop_stage_thresholds WHERE farm_id IS NULL AND variety IS NULL
      AND (crop IN ('pear', 'sweet-cherry') OR (crop = 'apple' AND stage IN ('silver-tip', 'half-inch-green', 'tight-cluster')))`);
  for (const [stage, sortOrder] of [['green-tip', 1], ['pink', 2], ['bloom', 3], ['petal-fall', 4]] as const) {
    await sequelize.query("UPDATE crop_stage_thresholds SET sort_order = :sortOrder WHERE farm_id IS NULL AND variety IS NULL AND crop = 'apple' AND stage = :stage", { replacements: { stage, sortOrder } });
  }
}

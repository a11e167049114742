// Empties every application table (not the migrations record, PostGIS's own table, the job
// queue's schema, or reference data a migration inserted and nothing of a user's points to).
import type { Sequelize } from 'sequelize';

export async function eraseAllData(sequelize: Sequelize) {
  const tables = (await sequelize.query(
    `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename NOT IN ('schema_migrations', 'spatial_ref_sys', 'pest_models')`,
    { type: 'SELECT' },
  )) as Array<{ tablename: string }>;
  if (!tables.length) return;
  await sequelize.query(`TRUNCATE ${tables.map((t) => `"${t.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`);
}

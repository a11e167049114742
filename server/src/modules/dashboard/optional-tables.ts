// Spray, alert and invoice tables come with their own features; the overview reads them
// only when they exist on this database, so it works on every installation.
import { QueryTypes, type Sequelize } from 'sequelize';

export async function existingTables(sequelize: Sequelize, names: string[]): Promise<Set<string>> {
  const rows = await sequelize.query<{ name: string }>(
    `SELECT n AS name FROM unnest(ARRAY[:names]::text[]) AS n WHERE to_regclass('public.' || n) IS NOT NULL`,
    { replacements: { names }, type: QueryTypes.SELECT },
  );
  return new Set(rows.map((r) => r.name));
}

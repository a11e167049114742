// CLI: applies pending migrations to DATABASE_URL.
import { loadConfig } from '../config/env.js';
import { createSequelize } from './sequelize.js';
import { createMigrator } from './migrator.js';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl, 2);
try {
  const applied = await createMigrator(sequelize).up();
  if (applied.length) process.stderr.write(`[pollenpact] applied ${applied.length} migration(s)\n`);
} finally {
  await sequelize.close();
}

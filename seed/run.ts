// CLI: loads the demo scenario into DATABASE_URL.
//   --if-empty  only when there are no organizations yet (npm start)
//   --reset     erase every table first (npm run seed)
import { loadConfig } from '../server/src/config/env.js';
import { createSequelize } from '../server/src/db/sequelize.js';
import { defineModels } from '../server/src/db/models/index.js';
import { useBuilderDatabase } from '../tests/support/builders/builder-database.js';
import { seedScenario } from './scenario.js';
import { eraseAllData } from './erase.js';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl, 4);
useBuilderDatabase({ sequelize, models: defineModels(sequelize) });
try {
  const [{ count }] = (await sequelize.query('SELECT count(*)::int AS count FROM organizations', { type: 'SELECT' })) as Array<{ count: number }>;
  if (process.argv.includes('--if-empty') && count > 0) {
    process.stderr.write('[pollenpact] demo data already loaded\n');
  } else {
    if (count > 0) await eraseAllData(sequelize);
    await seedScenario(new Date());
    process.stderr.write('[pollenpact] demo scenario loaded\n');
  }
} finally {
  await sequelize.close();
}

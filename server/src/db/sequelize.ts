// The Sequelize instance for one database URL. defineModels() binds the models to it;
// each createApp() gets its own instance so tests can run side by side.
import { Sequelize } from 'sequelize';

export function createSequelize(databaseUrl: string, poolMax = 10): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: poolMax, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true, timestamps: true },
  });
}

// The database the builders write to: set by startTestApp() and by the demo seed, so
// builders use that app's own models (two apps in one process each keep their own).
import type { Sequelize } from 'sequelize';
import type { Models } from '../../../server/src/db/models/index.js';

export interface BuilderDatabase { sequelize: Sequelize; models: Models }

let current: BuilderDatabase | null = null;

export function useBuilderDatabase(database: BuilderDatabase): void {
  current = database;
}

export function builderDatabase(): BuilderDatabase {
  if (!current) throw new Error('no database for the builders: start the test app (or the seed) first');
  return current;
}

/** This database's Sequelize instance, for builders that write core rows in SQL. */
export const builderSequelize = (): Sequelize => builderDatabase().sequelize;
/** This database's models. */
export const builderModels = (): Models => builderDatabase().models;

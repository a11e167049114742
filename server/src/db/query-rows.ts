// The one way to run hand-written SQL (PostGIS predicates, range searches, aggregates,
// counters): only from a feature's `<feature>.queries.ts`, always with bind parameters
// ($1 / $name) or named replacements (:name), never with values written into the text.
// Inside a transaction pass it, so the query runs on that transaction's connection.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export interface QueryOptions {
  /** Named replacements (`:name`), escaped by Sequelize. */
  replacements?: Record<string, unknown>;
  /** Bind parameters (`$1` or `$name`), sent to PostgreSQL apart from the text. */
  bind?: Record<string, unknown> | unknown[];
  transaction?: Transaction | null;
}

/** Runs a SELECT (or a statement with RETURNING) and gives its rows. */
export function queryRows<T extends object>(sequelize: Sequelize, sql: string, options: QueryOptions = {}): Promise<T[]> {
  return sequelize.query(sql, { ...options, type: QueryTypes.SELECT }) as Promise<T[]>;
}

/** The first row of queryRows, or undefined. */
export async function queryOne<T extends object>(sequelize: Sequelize, sql: string, options: QueryOptions = {}): Promise<T | undefined> {
  return (await queryRows<T>(sequelize, sql, options))[0];
}

/** Runs a statement for its effect; gives the number of rows it touched. */
export async function execute(sequelize: Sequelize, sql: string, options: QueryOptions = {}): Promise<number> {
  const [, meta] = (await sequelize.query(sql, { ...options, type: QueryTypes.RAW })) as [unknown, { rowCount?: number } | undefined];
  return meta?.rowCount ?? 0;
}

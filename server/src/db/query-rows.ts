// The one way to run hand-written SQL (PostGIS predicates, range searches, aggregates,
// counters): only from a feature's `<feature>.queries.ts`, always with bind parameters
// ($1 / $name) or named replacements (:name), never with values written into the text.
// Inside a transaction pass it, so the query runs on that transaction's connection.
// A hot statement may be prepared once per connection (queryPrepared; for a library's own
// statements, preparingPgPool).
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { ClientBase, Pool } from 'pg';
import { createHash } from 'node:crypto';

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

/** A hot SELECT with named bind parameters, turned once into the positional form PostgreSQL prepares. */
export interface PreparedStatement {
  name: string;
  text: string;
  params: string[];
}

/** `$name` parameters become `$1`, `$2`… in the order first met; `params` keeps that order. */
export function prepareStatement(name: string, sql: string): PreparedStatement {
  const params: string[] = [];
  const text = sql.replace(/\$([a-zA-Z]\w*)/g, (_, param: string) => {
    if (!params.includes(param)) params.push(param);
    return `$${params.indexOf(param) + 1}`;
  });
  return { name, text, params };
}

const statementsByText = new Map<string, PreparedStatement>();

/**
 * The prepared statement for a text a query builds from its filters: one per distinct text
 * (so one per combination of filters), named after the query and a hash of the text.
 */
export function statementFor(name: string, sql: string): PreparedStatement {
  let statement = statementsByText.get(sql);
  if (!statement) {
    statement = prepareStatement(`${name}-${createHash('sha1').update(sql).digest('hex').slice(0, 10)}`, sql);
    statementsByText.set(sql, statement);
  }
  return statement;
}

/**
 * Runs a prepared statement by name on the transaction's connection, or on one from the
 * pool: PostgreSQL parses it once per connection and, once its generic plan costs no more
 * than a fresh one, stops planning it each time. Only for a statement written so its plan
 * does not depend on the values (lookups fenced with OFFSET 0, by key); the values go as
 * bind parameters, as with queryRows.
 */
export async function queryPrepared<T extends object>(sequelize: Sequelize, statement: PreparedStatement, bind: Record<string, unknown>, transaction?: Transaction | null): Promise<T[]> {
  const values = statement.params.map((param) => {
    if (!(param in bind)) throw new Error(`${statement.name}: no value for $${param}`);
    return bind[param];
  });
  const manager = sequelize.connectionManager;
  const connection = (transaction ? (transaction as unknown as { connection: PgConnection }).connection : await manager.getConnection({ type: 'read' })) as PgConnection;
  // Logged as Sequelize logs its own queries, naming the transaction's connection.
  const log = (sequelize as unknown as { options: { logging?: unknown } }).options.logging;
  if (typeof log === 'function') log(`Executing (${(connection as { uuid?: string }).uuid ?? 'default'}): ${statement.text}`);
  try {
    return (await connection.query<T>({ name: statement.name, text: statement.text, values })).rows;
  } finally {
    if (!transaction) manager.releaseConnection(connection);
  }
}

type PgConnection = Pick<ClientBase, 'query'>;

/**
 * A pg pool for a library that sends its own few statements as text (the session store):
 * each distinct text is sent as a named statement, so it is prepared once per connection
 * rather than planned on every call. Only `query(text, values)` is offered.
 */
export function preparingPgPool(pool: Pool): Pool {
  const names = new Map<string, string>();
  const nameOf = (text: string) => {
    let name = names.get(text);
    if (!name) names.set(text, (name = `lib-${createHash('sha1').update(text).digest('hex').slice(0, 16)}`));
    return name;
  };
  return { query: (text: string, values?: unknown[]) => pool.query({ name: nameOf(text), text, values }) } as unknown as Pool;
}

// Small helpers for the raw SQL these modules run (PostGIS and tstzrange need it).
import { QueryTypes, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';

export function selectRows<T>(ctx: AppContext, sql: string, replacements: Record<string, unknown> = {}, transaction?: Transaction): Promise<T[]> {
  return ctx.sequelize.query(sql, { replacements, type: QueryTypes.SELECT, transaction }) as Promise<T[]>;
}

export async function selectOne<T>(ctx: AppContext, sql: string, replacements: Record<string, unknown> = {}, transaction?: Transaction): Promise<T | undefined> {
  return (await selectRows<T>(ctx, sql, replacements, transaction))[0];
}

export async function execute(ctx: AppContext, sql: string, replacements: Record<string, unknown> = {}, transaction?: Transaction): Promise<void> {
  await ctx.sequelize.query(sql, { replacements, transaction });
}

export const iso = (value: Date | string | null | undefined): string | null => (value == null ? null : new Date(value).toISOString());

/** Parses a tstzrange as PostgreSQL prints it, e.g. ["2027-04-10 00:00:00+00","2027-05-01 00:00:00+00"). */
export function parseRange(value: string | null): { from: string | null; to: string | null } | null {
  if (!value || value === 'empty') return null;
  const match = /^[[(]("?)([^",]*)\1,("?)([^",]*)\3[\])]$/.exec(value);
  if (!match) return null;
  return { from: match[2] ? new Date(match[2]).toISOString() : null, to: match[4] ? new Date(match[4]).toISOString() : null };
}

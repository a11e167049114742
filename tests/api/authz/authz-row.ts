// The row format of the table-driven authorization test (tests/api/authorization.test.ts).
// Each feature adds a file tests/api/authz/<feature>.rows.ts exporting `rows` (and, when it
// needs its own fixtures, `setup`). A row is one route and the status every caller gets.
import type { RoleKey } from '../../../shared/roles.js';
import { allRoleKeys } from '../../../shared/roles.js';
import type { User } from '../../../server/src/db/models/user.model.js';
import type { buildRoleCast } from '../../support/builders/accounts.js';
import type { PolicyTableName } from '../../../server/src/modules/policies.js';

/**
 * Who calls: a member of the cast's own farm or apiary by role, the admin, the owner of
 * another farm or apiary business ('other-farm', 'other-apiary'), or nobody signed in.
 */
export type Caller = RoleKey | 'other-farm' | 'other-apiary' | 'signed-out';
export const callers: readonly Caller[] = [...allRoleKeys, 'other-farm', 'other-apiary', 'signed-out'];

export type RoleCast = Awaited<ReturnType<typeof buildRoleCast>>;

/** Built once per run: one cast of every role (own) and a second farm and apiary (other). */
export interface AuthzWorld {
  own: RoleCast;
  other: RoleCast;
  /** The user behind a caller (null when signed out). */
  userOf(caller: Caller): User | null;
}

export interface RowContext<F> {
  world: AuthzWorld;
  /** What the row file's setup() returned. */
  fixtures: F;
  caller: Caller;
  /** What the row's fresh() made for this caller's request. */
  fresh: Record<string, string>;
}

export interface AuthzRow<F = undefined> {
  /** What the request does, in words (shown when the row fails). */
  title: string;
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string | ((ctx: RowContext<F>) => string);
  body?: object | ((ctx: RowContext<F>) => object);
  /** The policy action guarding the route; the test checks rows and tables agree. Public routes leave it out. */
  policy?: { table: PolicyTableName; action: string };
  /**
   * Makes new fixtures for routes that use up what they act on (remove a member, accept an
   * invitation): one set for each caller the row expects to succeed, one set shared by the
   * callers it expects to be refused. The ids or tokens reach path and body as ctx.fresh.
   */
  fresh?: (ctx: Omit<RowContext<F>, 'fresh'>) => Promise<Record<string, string>>;
  /** Send with a newly signed-in client, for requests that change the caller's session (sign-in, sign-out, sign-up). */
  ownClient?: boolean;
  /** The status each caller must get. Build it with statuses(). */
  expect: Record<Caller, number>;
}

/** A row file: its rows and, optionally, fixtures of its own built once per run. */
export interface AuthzRowFile<F = unknown> {
  setup?: (world: AuthzWorld) => Promise<F>;
  rows: AuthzRow<F>[];
}

/** Every caller gets `base` except the signed-out caller (401) and the overrides. */
export function statuses(base: number, overrides: Partial<Record<Caller, number>> = {}): Record<Caller, number> {
  const all = Object.fromEntries(callers.map((c) => [c, c === 'signed-out' ? 401 : base])) as Record<Caller, number>;
  return { ...all, ...overrides };
}

/** The same status for several callers, to spread into statuses() overrides. */
export function each(which: readonly Caller[], status: number): Partial<Record<Caller, number>> {
  return Object.fromEntries(which.map((c) => [c, status]));
}

export const farmMembers = ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'] as const satisfies readonly Caller[];
export const apiaryMembers = ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'] as const satisfies readonly Caller[];
export const otherOrganizations = ['other-farm', 'other-apiary'] as const satisfies readonly Caller[];

// Guards: signed in, and allowed by a feature's policy table. Organization scoping
// (404 for another organization's data) is done by each service's queries.
import type { Request, RequestHandler } from 'express';
import { unauthenticated, forbidden } from '../errors/http-errors.js';
import type { AuthUser } from '../modules/auth/auth-user.js';

import { isAllowed, type PolicyTable } from '../../../shared/policies/policy-table.js';

/** A feature's permissions (shared/policies): each action lists the roles that may do it. */
export { isAllowed, type PolicyTable };

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthenticated());
  next();
};

/** 401 when signed out, 403 when the role may not do the action. */
export function allow<Action extends string>(table: PolicyTable<Action>, action: Action): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthenticated());
    if (!isAllowed(table, action, req.user.roleKey)) return next(forbidden());
    next();
  };
}

/** The signed-in user of a request that passed requireUser or allow(). */
export function currentUser(req: Request): AuthUser {
  if (!req.user) throw unauthenticated();
  return req.user;
}

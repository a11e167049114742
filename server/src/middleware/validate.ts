// Parses req.body, req.query and req.params with the shared zod schemas and writes the
// parsed values back; a failure is a 400 naming every bad field by its label.
import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';
import { z } from 'zod';
import { createError } from '../errors/create-error.js';
import type { FieldErrors } from '../../../shared/errors.js';
import { nulMessage, nulPaths } from '../../../shared/schemas/common.js';
import { pleaseCheck } from '../../../shared/labels/fields.js';

type Schemas = { body?: ZodType; query?: ZodType; params?: ZodType };

export function fieldErrorsOf(error: z.ZodError, prefix?: string): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const path = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || prefix || 'body';
    fields[path] ??= issue.message;
  }
  return fields;
}

export function parseOrThrow<T>(schema: ZodType<T>, value: unknown, prefix?: string): T {
  // PostgreSQL text cannot hold a NUL character; refuse it in any field before it reaches a query.
  const withNul = nulPaths(value).map((path) => [prefix, path === 'body' ? '' : path].filter(Boolean).join('.') || prefix || 'body');
  if (withNul.length) throw createError('validation_failed', pleaseCheck(withNul), 400, Object.fromEntries(withNul.map((path) => [path, nulMessage])));
  const result = schema.safeParse(value);
  if (!result.success) {
    const fields = fieldErrorsOf(result.error, prefix);
    // The message names fields by their labels; `fields` keeps the schema keys for the form to place each message.
    throw createError('validation_failed', pleaseCheck(Object.keys(fields)), 400, fields);
  }
  return result.data;
}

export function validate(schemas: Schemas): RequestHandler {
  // The schemas stay on the middleware so the route inventory of the tests can read them.
  return Object.assign(validateWith(schemas), { schemas });
}

function validateWith(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) req.params = parseOrThrow(schemas.params, req.params) as typeof req.params;
    if (schemas.query) {
      const query = parseOrThrow(schemas.query, req.query);
      Object.defineProperty(req, 'query', { value: query, writable: true, configurable: true });
    }
    if (schemas.body) req.body = parseOrThrow(schemas.body, req.body ?? {});
    next();
  };
}

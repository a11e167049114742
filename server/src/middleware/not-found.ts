// Unknown /api routes answer 404 in the error shape.
import type { RequestHandler } from 'express';
import { createError } from '../errors/create-error.js';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(createError('not_found', `No such API route: ${req.method} ${req.path}`, 404));
};

// One file per multipart upload, read into memory. Whatever keeps the upload from being
// read (no boundary, a body cut short, a file too large, a second file, a file under
// another name) answers 400 or 413 naming the file field, never a server error.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError, createError } from '../errors/create-error.js';

type FileFilter = NonNullable<multer.Options['fileFilter']>;

function uploadError(err: unknown, field: string): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return createError('payload_too_large', `The file is too large: ${err.message}.`, 413, { [field]: 'is too large' });
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return createError('validation_failed', `Send one file, as "${field}".`, 400, { [field]: `send one file, as "${field}"` });
    }
    return createError('validation_failed', `The upload could not be read: ${err.message}.`, 400, { [err.field ?? field]: err.message });
  }
  return createError('validation_failed', 'The upload could not be read as a multipart form; send it again.', 400, { [field]: 'could not be read from the upload' });
}

/** Reads one file sent as `field` (at most maxBytes) and the form's text fields into req.body. */
export function singleFileUpload(field: string, options: { maxBytes: number; fileFilter?: FileFilter }): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: options.maxBytes, files: 1, fields: 20, fieldSize: 64 * 1024 },
    fileFilter: options.fileFilter,
  }).single(field);
  const uploadMiddleware: RequestHandler = (req, res, next) => parse(req, res, (err?: unknown) => next(err ? uploadError(err, field) : undefined));
  return Object.assign(uploadMiddleware, { uploadField: field });
}

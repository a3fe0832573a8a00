import { MAX_LOT_BYTES } from '@sigmatail/engine';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../http/httpError.js';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_LOT_BYTES, files: 1, fields: 20, fieldSize: 10_000 },
}).single('file');

/**
 * Reads a multipart form with one CSV in field `file` into req.file (memory, at most
 * MAX_LOT_BYTES). Every refusal is a 4xx naming the field: not multipart → 415, too large →
 * 413, a file under another name → 400, no file → 400.
 */
export const lotUpload: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    return next(
      new HttpError(415, 'file: send the lot as multipart/form-data with a CSV in field "file"', 'file'),
    );
  }
  upload(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(new HttpError(413, `file: larger than ${MAX_LOT_BYTES / 1024 / 1024} MiB`, 'file'));
      }
      const field = err.code === 'LIMIT_UNEXPECTED_FILE' ? 'file' : (err.field ?? 'file');
      return next(new HttpError(400, `${field}: ${err.message}`, field));
    }
    if (err) return next(new HttpError(400, 'file: the upload could not be read', 'file'));
    if (!req.file) return next(new HttpError(400, 'file: choose a CSV file to upload', 'file'));
    next();
  });
};

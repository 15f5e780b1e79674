// Multipart uploads (RFC 7578 multipart/form-data) through multer. multer reports its own limits
// as MulterError (LIMIT_FILE_SIZE → 413, other LIMIT_* → 400, see errors.ts); a body that is not
// well-formed multipart (no boundary, a part cut off, a damaged part header) reaches us as a plain
// busboy Error without a code, which would otherwise leave as a 500. This turns those into a 400.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './errors';

export function readMultipart(middleware: RequestHandler): RequestHandler {
  return function readMultipartBody(req, res, next) {
    middleware(req, res, (err?: unknown) => {
      if (!err || err instanceof multer.MulterError || err instanceof HttpError) return next(err);
      const e = err as { code?: unknown; message?: unknown };
      // Errors with a system code (ENOSPC from a disk store…) are ours, not the sender's.
      if (typeof e.code === 'string') return next(err);
      const why = String(e.message ?? 'malformed body').slice(0, 120);
      next(new HttpError(400, 'bad_upload', `The upload could not be read as multipart/form-data (${why}). Send the file again.`));
    });
  };
}

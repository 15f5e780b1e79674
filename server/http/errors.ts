import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';

/** An error with an HTTP status and a stable code; its message is safe to show to the user. */
export class HttpError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public details?: unknown,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: unknown) => new HttpError(400, 'bad_request', message, details);
export const notFound = (what = 'Not found') => new HttpError(404, 'not_found', what);
export const forbidden = (message = 'You do not have access to this') => new HttpError(403, 'forbidden', message);
export const unauthorized = (message = 'Sign in first') => new HttpError(401, 'unauthorized', message);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);

/** Field-level messages from a zod error: { "device.width": "Must be at least 10" }. */
export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.join('.') || '_';
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route for ${req.method} ${req.path}`));
};

/** Every error leaves as JSON { error: { code, message, fields? } }; never a stack trace. */
export function errorHandler(log: { error: (o: object, m: string) => void }): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let status = 500;
    let body: { code: string; message: string; fields?: Record<string, string>; details?: unknown };
    if (err instanceof HttpError) {
      status = err.status;
      body = { code: err.code, message: err.message };
      if (err.details && typeof err.details === 'object' && 'fields' in (err.details as object)) {
        body.fields = (err.details as { fields: Record<string, string> }).fields;
      } else if (err.details !== undefined) body.details = err.details;
    } else if (err instanceof ZodError) {
      status = 400;
      const fields = zodFields(err);
      body = { code: 'invalid_input', message: summarizeFields(fields), fields };
    } else if (err?.type === 'entity.parse.failed') {
      status = 400;
      body = { code: 'invalid_json', message: 'The request body is not valid JSON' };
    } else if (err?.type === 'entity.too.large') {
      status = 413;
      body = { code: 'too_large', message: 'The request body is too large' };
    } else if (err?.code === 'LIMIT_FILE_SIZE') {
      status = 413;
      body = { code: 'file_too_large', message: 'The file is larger than the upload limit' };
    } else if (typeof err?.code === 'string' && err.code.startsWith('LIMIT_')) {
      status = 400;
      body = { code: 'bad_upload', message: `Upload refused: ${err.message}` };
    } else if (isClientHttpError(err)) {
      // body-parser and the router report unreadable requests (bad %-escapes in the path, an
      // unknown Content-Encoding or charset, a broken gzip body) as http-errors with a 4xx status.
      status = Number(err.status ?? err.statusCode);
      body = clientHttpErrorBody(err, status);
    } else if (err?.code === '22021' || err?.code === '22P05') {
      // PostgreSQL text cannot hold U+0000 (character_not_in_repertoire / untranslatable_character):
      // a NUL inside any text field reaches us here, after validation, and nothing was written.
      status = 400;
      body = { code: 'invalid_text', message: 'A text field contains a NUL character (\\u0000) or another character that cannot be stored; remove it and try again' };
    } else if (err?.name === 'StorageUnavailable') {
      status = 503;
      body = { code: 'storage_unavailable', message: 'The file store is not answering; try again in a moment' };
    } else if (isDatabaseDown(err)) {
      status = 503;
      body = { code: 'unavailable', message: 'The database is unavailable; try again in a moment' };
    } else {
      body = { code: 'internal', message: 'Something went wrong on our side' };
    }
    if (status >= 500) log.error({ err, url: req.originalUrl }, 'request failed');
    if (!res.headersSent) {
      // A route may have set a file's headers before it failed: the error is JSON, and never cached.
      for (const h of ['Content-Type', 'Content-Disposition', 'Content-Length', 'Cache-Control', 'ETag', 'Last-Modified']) res.removeHeader(h);
      res.setHeader('Cache-Control', 'no-store');
      res.status(status).json({ error: body });
    }
    else res.end();
  };
}

function summarizeFields(fields: Record<string, string>): string {
  const entries = Object.entries(fields);
  if (entries.length === 0) return 'Invalid input';
  const [k, v] = entries[0];
  const first = k === '_' ? v : `${k}: ${v}`;
  return entries.length === 1 ? first : `${first} (and ${entries.length - 1} more)`;
}

function isClientHttpError(err: any): boolean {
  const s = Number(err?.status ?? err?.statusCode);
  return Number.isInteger(s) && s >= 400 && s < 500 && err?.expose !== false;
}

function clientHttpErrorBody(err: any, status: number): { code: string; message: string } {
  const type = String(err?.type ?? '');
  if (type === 'encoding.unsupported') {
    return { code: 'unsupported_encoding', message: 'The request body is compressed in a way the API does not read; send it uncompressed, or with gzip or deflate' };
  }
  if (type === 'charset.unsupported') return { code: 'unsupported_charset', message: 'The request body is in a character set the API does not read; send it as UTF-8' };
  if (type === 'request.aborted') return { code: 'aborted', message: 'The request ended before its body was complete; send it again' };
  if (/^Failed to decode param/.test(String(err?.message))) {
    return { code: 'bad_path', message: 'The address has a broken %-escape; check the link and try again' };
  }
  if (status === 400) return { code: 'unreadable_body', message: 'The request body could not be read (it may be damaged or wrongly compressed); send it again' };
  return { code: 'bad_request', message: 'The request could not be handled as sent' };
}

function isDatabaseDown(err: any): boolean {
  const code = err?.code;
  return (
    code === 'ECONNREFUSED' ||
    code === 'ECONNRESET' ||
    code === '57P01' || // admin_shutdown
    code === '57P02' ||
    code === '57P03' || // cannot_connect_now
    // "…is not queryable": a later statement (a transaction's ROLLBACK) on a client that lost its server.
    /Connection terminated|timeout exceeded when trying to connect|connection error and is not queryable/i.test(String(err?.message ?? ''))
  );
}

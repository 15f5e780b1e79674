import type { Request } from 'express';
import { CSRF_HEADER } from '../../shared/schemas/auth';
import type { Config } from '../config';
import { HttpError } from '../http/errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
export const isUnsafeMethod = (req: Request) => !SAFE_METHODS.has(req.method);

/**
 * A browser names the page that sent a request in Origin; one from another site is refused
 * (OWASP Cheat Sheet: CSRF, "Verifying Origin with standard headers").
 */
export function refuseOtherOrigins(req: Request, config: Config): void {
  const origin = req.get('origin');
  if (origin !== undefined && origin !== new URL(config.publicUrl).origin) {
    throw new HttpError(403, 'cross_site', 'This request came from another site and was refused');
  }
}

/**
 * Cookie sessions must also send the custom header: a cross-site form cannot set one, and a
 * cross-site script cannot without a CORS preflight we never grant (OWASP Cheat Sheet: CSRF,
 * "Employing custom request headers for AJAX/API").
 */
export function requireCsrfHeader(req: Request): void {
  if (req.get(CSRF_HEADER) !== '1') {
    throw new HttpError(403, 'csrf_header_missing', `Requests signed in by cookie must send the ${CSRF_HEADER}: 1 header`);
  }
}

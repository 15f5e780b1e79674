import type { Request, RequestHandler } from 'express';
import type { Role } from '../../db/schema';
import type { Deps } from '../deps';

/**
 * Who may call a route — declared once per route in ApiRouter.route().
 * - public: anyone.
 * - signed-in: any valid session (cookie or Bearer token).
 * - shop: a member of the shop that owns the resource, with at least `role`
 *   (viewer < editor < owner). `shop` finds that shop from the request; it returns null when
 *   the resource does not exist. Non-members get 404 (existence is not revealed), members
 *   with too small a role get 403.
 */
export type Policy =
  | { kind: 'public' }
  | { kind: 'signed-in' }
  | { kind: 'shop'; role: Role; shop: ShopLocator };

export type ShopLocator = (req: Request, deps: Deps) => Promise<string | null>;

export interface AuthInfo {
  user: { id: string; email: string; name: string };
  sessionId: string;
  /** Set for shop policies: the resource's shop and the caller's role there. */
  shopId?: string;
  role?: Role;
}

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthInfo;
  }
}

/** The signed-in caller; only call behind a signed-in or shop policy. */
export function authOf(req: Request): AuthInfo {
  if (!req.auth) throw new Error('authOf() called on a route without a signed-in policy');
  return req.auth;
}

export const ROLE_RANK: Record<Role, number> = { viewer: 1, editor: 2, owner: 3 };

export function enforce(_deps: Deps, policy: Policy): RequestHandler {
  return (_req, _res, next) => {
    if (policy.kind === 'public') return next();
    // Accounts (server/auth) implement session and role checks here.
    next(new Error(`policy ${policy.kind} is not implemented yet`));
  };
}

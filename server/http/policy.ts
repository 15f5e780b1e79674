import type { Request, RequestHandler } from 'express';
import type { Role } from '../../db/schema';
import { isUnsafeMethod, refuseOtherOrigins, requireCsrfHeader } from '../auth/csrf';
import { presentedToken, readSessionToken, sessionUser } from '../auth/sessions';
import type { Deps } from '../deps';
import { ROLE_WITH_ARTICLE } from '../../shared/schemas/auth';
import { roleIn } from '../shops/repository';
import { forbidden, notFound, unauthorized } from './errors';

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

/** The guard that runs before every route's handlers: who is calling, and may they. */
export function enforce(deps: Deps, policy: Policy): RequestHandler {
  const { db, config } = deps;
  // Named so the route-coverage test can see that this guard runs first on every route.
  return async function enforcePolicy(req, _res, next) {
    if (policy.kind === 'public') {
      if (isUnsafeMethod(req)) refuseOtherOrigins(req, config);
      return next();
    }
    const presented = presentedToken(req);
    if (!presented) throw unauthorized('Sign in first');
    // Bearer tokens are never sent by a browser on its own, so only cookie requests need the checks.
    if (presented.via === 'cookie' && isUnsafeMethod(req)) {
      refuseOtherOrigins(req, config);
      requireCsrfHeader(req);
    }
    const claims = await readSessionToken(config, presented.token);
    if (!claims) throw unauthorized('Your sign-in is not valid; sign in again');
    // The session check and the shop lookup go to the database side by side: the token's user id
    // is already verified (signed), and nothing found for the shop is used before the session
    // itself has been confirmed live below.
    const shopLookup: Promise<{ shopId: string | null; role: Role | null }> | null =
      policy.kind === 'shop'
        ? policy.shop(req, deps).then(async (shopId) => ({ shopId, role: shopId ? await roleIn(db, shopId, claims.userId) : null }))
        : null;
    shopLookup?.catch(() => undefined); // answered below, after the session check
    const user = await sessionUser(db, claims.sessionId, claims.userId).catch(async (e) => {
      await shopLookup?.catch(() => undefined);
      throw e;
    });
    if (!user) {
      await shopLookup?.catch(() => undefined);
      throw unauthorized('Your session has ended; sign in again');
    }
    const auth: AuthInfo = { user: { id: user.id, email: user.email, name: user.name }, sessionId: claims.sessionId };

    if (shopLookup && policy.kind === 'shop') {
      const { shopId, role } = await shopLookup;
      // Outsiders learn nothing: a shop they are not in looks the same as one that does not exist.
      if (!shopId || !role) throw notFound('Not found, or not shared with you');
      if (ROLE_RANK[role] < ROLE_RANK[policy.role]) throw forbidden(needsRoleMessage(policy.role, role));
      auth.shopId = shopId;
      auth.role = role;
    }
    req.auth = auth;
    next();
  };
}

function needsRoleMessage(needed: Role, actual: Role): string {
  const who = needed === 'owner' ? "Only the shop's owners can do this" : 'This needs an editor or owner';
  return `${who}; you are ${ROLE_WITH_ARTICLE[actual]} in this shop`;
}

import type { CookieOptions, Request, Response } from 'express';
import { jwtVerify, SignJWT } from 'jose';
import type { DB } from '../../db/connect';
import type { Config } from '../config';
import { unauthorized } from '../http/errors';

export const SESSION_COOKIE = 'jw_session';
export const SESSION_DAYS = 30;
const ISSUER = 'jigwright';
const AUDIENCE = 'jigwright-api';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  units: 'mm' | 'in';
}

/** A new session row and its signed token (the token carries the session id as `sid`). */
export async function startSession(db: DB, config: Config, userId: string): Promise<{ token: string; sessionId: string; expiresAt: Date }> {
  const expiresAt = new Date(Date.now() + SESSION_DAYS * 24 * 3600 * 1000);
  const row = await db.insertInto('sessions').values({ user_id: userId, expires_at: expiresAt }).returning('id').executeTakeFirstOrThrow();
  const token = await new SignJWT({ sid: row.id })
    .setProtectedHeader({ alg: 'HS256', typ: 'JWT' })
    .setSubject(userId)
    .setIssuer(ISSUER)
    .setAudience(AUDIENCE)
    .setIssuedAt()
    .setExpirationTime(expiresAt)
    .sign(config.sessionSecret);
  return { token, sessionId: row.id, expiresAt };
}

/** The session a token names, or null when the signature, claims or expiry are wrong. */
export async function readSessionToken(config: Config, token: string): Promise<{ sessionId: string; userId: string } | null> {
  try {
    // Only HS256 is accepted: a token cannot pick its own algorithm ("none", RS256…) (RFC 8725 §3.1).
    const { payload } = await jwtVerify(token, config.sessionSecret, { algorithms: ['HS256'], issuer: ISSUER, audience: AUDIENCE });
    if (typeof payload.sid !== 'string' || typeof payload.sub !== 'string') return null;
    return { sessionId: payload.sid, userId: payload.sub };
  } catch {
    return null;
  }
}

/** The user behind a live session: not revoked, not expired, and the token's user. */
export async function sessionUser(db: DB, sessionId: string, userId: string): Promise<SessionUser | null> {
  const row = await db
    .selectFrom('sessions')
    .innerJoin('users', 'users.id', 'sessions.user_id')
    .select(['users.id', 'users.email', 'users.name', 'users.units'])
    .where('sessions.id', '=', sessionId)
    .where('sessions.user_id', '=', userId)
    .where('sessions.revoked_at', 'is', null)
    .where('sessions.expires_at', '>', new Date())
    .executeTakeFirst();
  return row ?? null;
}

export async function revokeSession(db: DB, sessionId: string): Promise<void> {
  await db.updateTable('sessions').set({ revoked_at: new Date() }).where('id', '=', sessionId).where('revoked_at', 'is', null).execute();
}

/** Ends every live session of a user, except `keep` when given; answers how many it ended. */
export async function revokeSessionsOf(db: DB, userId: string, keep?: string): Promise<number> {
  let q = db.updateTable('sessions').set({ revoked_at: new Date() }).where('user_id', '=', userId).where('revoked_at', 'is', null).where('expires_at', '>', new Date());
  if (keep) q = q.where('id', '!=', keep);
  const r = await q.executeTakeFirst();
  return Number(r.numUpdatedRows);
}

/** Where the request's token came from: Bearer header (scripts) or the session cookie (web app). */
export function presentedToken(req: Request): { token: string; via: 'bearer' | 'cookie' } | null {
  const header = req.get('authorization');
  if (header !== undefined) {
    const m = /^Bearer ([A-Za-z0-9._~+/-]+=*)$/.exec(header.trim());
    if (!m) throw unauthorized('The Authorization header must read "Bearer <token>"');
    return { token: m[1], via: 'bearer' };
  }
  const cookie = (req.cookies as Record<string, unknown> | undefined)?.[SESSION_COOKIE];
  return typeof cookie === 'string' && cookie ? { token: cookie, via: 'cookie' } : null;
}

function cookieOptions(config: Config): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure: config.publicUrl.startsWith('https:'), path: '/' };
}

export function setSessionCookie(res: Response, config: Config, token: string, expiresAt: Date): void {
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(config), expires: expiresAt });
}

export function clearSessionCookie(res: Response, config: Config): void {
  res.clearCookie(SESSION_COOKIE, cookieOptions(config));
}

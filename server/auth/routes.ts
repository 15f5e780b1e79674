import type { Response } from 'express';
import { ChangePassword, RequestReset, ResetPassword, SignIn, SignUp } from '../../shared/schemas/auth';
import type { Deps } from '../deps';
import { HttpError } from '../http/errors';
import { authOf } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { shopsOf } from '../shops/repository';
import { authLimiters } from './limits';
import { linkTo, sendOrRefuse } from './links';
import { resetMail } from './mail';
import { hashPassword, passwordMatches, standInHash } from './passwords';
import {
  closeOpenResets,
  insertPasswordReset,
  insertUser,
  passwordResetByHash,
  publicUser,
  setPasswordHash,
  userByEmail,
  userById,
  useResetOnce,
} from './repository';
import { hashLinkToken, newLinkToken } from './secrets';
import { clearSessionCookie, revokeSession, revokeSessionsOf, setSessionCookie, startSession } from './sessions';

export const RESET_MINUTES = 60;

const isUniqueViolation = (e: unknown) => (e as { code?: string })?.code === '23505';

/** Same wording for an unknown address and a wrong password: the answer does not say which. */
const WRONG_CREDENTIALS = 'That e-mail and password do not match an account';

async function signedIn(deps: Deps, res: Response, user: { id: string; email: string; name: string; units: 'mm' | 'in' }, status: number) {
  const session = await startSession(deps.db, deps.config, user.id);
  setSessionCookie(res, deps.config, session.token, session.expiresAt);
  res.status(status).json({ token: session.token, user: publicUser(user) });
}

export function authRoutes(api: ApiRouter): void {
  const deps = api.deps;
  const { db, config, mailer, log } = deps;
  const limits = authLimiters(config, api.deps.db);

  api.route('post', '/auth/sign-up', { kind: 'public' }, limits.signUp, async (req, res) => {
    const body = SignUp.parse(req.body);
    if (await userByEmail(db, body.email)) throw emailTaken();
    const passwordHash = await hashPassword(body.password, config.bcryptCost);
    let user;
    try {
      user = await insertUser(db, { email: body.email, name: body.name, passwordHash });
    } catch (e) {
      if (isUniqueViolation(e)) throw emailTaken(); // the same address signed up a moment ago
      throw e;
    }
    await signedIn(deps, res, user, 201);
  });

  api.route('post', '/auth/sign-in', { kind: 'public' }, limits.signInPerIp, limits.signInPerAccount, async (req, res) => {
    const body = SignIn.parse(req.body);
    const user = await userByEmail(db, body.email);
    const ok = await passwordMatches(body.password, user?.password_hash ?? (await standInHash(config.bcryptCost)));
    if (!user || !ok) throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
    await signedIn(deps, res, user, 200);
  });

  api.route('post', '/auth/sign-out', { kind: 'signed-in' }, async (req, res) => {
    await revokeSession(db, authOf(req).sessionId);
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  // A phone left at the bench, a shared shop PC: end every other session, keep this one.
  api.route('post', '/auth/sign-out-others', { kind: 'signed-in' }, async (req, res) => {
    const { user, sessionId } = authOf(req);
    res.json({ ended: await revokeSessionsOf(db, user.id, sessionId) });
  });

  api.route('get', '/me', { kind: 'signed-in' }, async (req, res) => {
    const { user } = authOf(req);
    const row = await userById(db, user.id);
    if (!row) throw new HttpError(401, 'unauthorized', 'Your account no longer exists');
    res.json({ user: publicUser(row), shops: await shopsOf(db, user.id) });
  });

  // Changing the password keeps this session and ends every other one (a lost laptop, a shared bench PC).
  api.route('post', '/auth/password', { kind: 'signed-in' }, limits.changePassword, async (req, res) => {
    const body = ChangePassword.parse(req.body);
    const { user, sessionId } = authOf(req);
    const row = await userById(db, user.id);
    if (!row || !(await passwordMatches(body.currentPassword, row.password_hash))) {
      throw new HttpError(400, 'wrong_password', 'That is not your current password', { fields: { currentPassword: 'That is not your current password' } });
    }
    const passwordHash = await hashPassword(body.newPassword, config.bcryptCost);
    await db.transaction().execute(async (tx) => {
      await setPasswordHash(tx, user.id, passwordHash);
      await revokeSessionsOf(tx, user.id, sessionId);
    });
    res.status(204).end();
  });

  // The answer is the same whether or not an account has the address (OWASP Forgot Password
  // Cheat Sheet: "return a consistent message for both existent and non-existent accounts").
  api.route('post', '/auth/reset-request', { kind: 'public' }, limits.resetRequest, async (req, res) => {
    const body = RequestReset.parse(req.body);
    res.status(202).json({ message: 'If an account uses that address, a link to choose a new password is on its way. It works for one hour.' });
    // After answering, so the time taken does not tell whether a mail was sent.
    void sendReset(body.email).catch((err) => log.error({ err }, 'password reset mail failed'));
  });

  async function sendReset(email: string) {
    const user = await userByEmail(db, email);
    if (!user) return;
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + RESET_MINUTES * 60 * 1000);
    // Only a reset whose mail went out is kept.
    await db.transaction().execute(async (tx) => {
      await insertPasswordReset(tx, { userId: user.id, tokenHash: hashLinkToken(token), expiresAt });
      await sendOrRefuse(mailer, resetMail({ to: user.email, name: user.name, link: linkTo(config, `/reset/${token}`), minutes: RESET_MINUTES }), 'password reset');
    });
  }

  api.route('post', '/auth/reset', { kind: 'public' }, limits.resetPassword, async (req, res) => {
    const body = ResetPassword.parse(req.body);
    const reset = await passwordResetByHash(db, hashLinkToken(body.token));
    if (!reset) throw badResetLink('reset_not_found', 'This reset link is not valid; ask for a new one');
    if (reset.used_at) throw badResetLink('reset_used', 'This reset link has already been used; ask for a new one');
    if (reset.expires_at.getTime() <= Date.now()) throw badResetLink('reset_expired', 'This reset link has expired; ask for a new one');
    const passwordHash = await hashPassword(body.password, config.bcryptCost);
    await db.transaction().execute(async (tx) => {
      if (!(await useResetOnce(tx, reset.id))) throw badResetLink('reset_used', 'This reset link has already been used; ask for a new one');
      await setPasswordHash(tx, reset.user_id, passwordHash);
      await closeOpenResets(tx, reset.user_id);
      await revokeSessionsOf(tx, reset.user_id);
    });
    clearSessionCookie(res, config);
    res.status(200).json({ message: 'Your password is changed. Sign in with the new one.' });
  });
}

function emailTaken() {
  return new HttpError(409, 'email_taken', 'An account with this e-mail already exists; sign in, or reset its password', {
    fields: { email: 'An account with this e-mail already exists' },
  });
}

function badResetLink(code: string, message: string) {
  return new HttpError(400, code, message, { fields: { token: message } });
}

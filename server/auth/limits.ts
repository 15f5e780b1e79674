import type { Request } from 'express';
import { rateLimit, type Options } from 'express-rate-limit';
import type { DB } from '../../db/connect';
import type { Config } from '../config';
import { HttpError } from '../http/errors';
import { PostgresRateStore } from './rateStore';

function limiter(config: Config, db: DB, name: string, opts: Partial<Options> & { windowMs: number; limit: number; message: string }) {
  const { message, ...rest } = opts;
  return rateLimit({
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresRateStore(db, name),
    skip: () => config.rateLimitDisabled,
    handler: (_req, _res, next) => next(new HttpError(429, 'rate_limited', message)),
    ...rest,
  });
}

const emailOf = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase();

/** Per-route limiters; their counters live in PostgreSQL, shared by every API process (server/auth/rateStore.ts). */
export function authLimiters(config: Config, db: DB) {
  const fifteenMinutes = 15 * 60 * 1000;
  return {
    // Failed sign-ins per address (from one IP or many) and per IP (over many addresses).
    signInPerIp: limiter(config, db, 'sign-in-per-ip', {
      windowMs: fifteenMinutes,
      limit: 20,
      skipSuccessfulRequests: true,
      message: 'Too many failed sign-ins from this network; wait 15 minutes and try again',
    }),
    signInPerAccount: limiter(config, db, 'sign-in-per-account', {
      windowMs: fifteenMinutes,
      limit: 10,
      skipSuccessfulRequests: true,
      keyGenerator: (req) => `account:${emailOf(req)}`,
      message: 'Too many failed sign-ins for this address; wait 15 minutes or reset the password',
    }),
    signUp: limiter(config, db, 'sign-up', {
      windowMs: 60 * 60 * 1000,
      limit: 10,
      message: 'Too many new accounts from this network; wait an hour and try again',
    }),
    resetRequest: limiter(config, db, 'reset-request', {
      windowMs: fifteenMinutes,
      limit: 5,
      message: 'Too many reset requests; wait 15 minutes and try again',
    }),
    resetPassword: limiter(config, db, 'reset-password', {
      windowMs: fifteenMinutes,
      limit: 10,
      message: 'Too many attempts with reset links; wait 15 minutes and try again',
    }),
    // A session in the wrong hands should not be able to guess the current password at speed.
    changePassword: limiter(config, db, 'change-password', {
      windowMs: fifteenMinutes,
      limit: 10,
      skipSuccessfulRequests: true,
      message: 'Too many wrong current passwords; wait 15 minutes and try again',
    }),
  };
}

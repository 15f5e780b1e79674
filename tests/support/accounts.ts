// Helpers for tests that need people, shops and sessions. All names and addresses are invented.
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { DB } from '../../db/connect';
import type { Role } from '../../db/schema';
import type { TestContext } from './context';

/** A fresh invented address on a reserved .example domain (RFC 2606). */
export function uniqueEmail(label = 'person', domain = 'birchfold.example'): string {
  return `${label}-${randomBytes(4).toString('hex')}@${domain}`;
}

export interface SignedUp {
  id: string;
  email: string;
  password: string;
  name: string;
  token: string;
  /** The Set-Cookie value, ready for a `Cookie` header. */
  cookie: string;
}

/** Signs up through the API, as a person would. */
export async function signUpVia(ctx: TestContext, over: Partial<{ email: string; password: string; name: string }> = {}): Promise<SignedUp> {
  const body = { email: over.email ?? uniqueEmail(), password: over.password ?? 'plane-iron-sharp-42', name: over.name ?? 'Wren Alder' };
  const res = await ctx.http.post('/api/auth/sign-up').send(body);
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { id: res.body.user.id, email: body.email, password: body.password, name: body.name, token: res.body.token, cookie: sessionCookieOf(res.headers['set-cookie']) };
}

export async function signInVia(ctx: TestContext, email: string, password: string): Promise<{ token: string; cookie: string }> {
  const res = await ctx.http.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { token: res.body.token, cookie: sessionCookieOf(res.headers['set-cookie']) };
}

/** "jw_session=…" from a response's Set-Cookie header. */
export function sessionCookieOf(setCookie: string | string[] | undefined): string {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const found = list.find((c) => c.startsWith('jw_session='));
  if (!found) throw new Error('no jw_session cookie was set');
  return found.split(';')[0];
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** A user straight in the database (cost-4 hash): quicker than the API when many are needed. */
export async function insertPerson(db: DB, v: { email?: string; name?: string; password?: string } = {}) {
  const email = v.email ?? uniqueEmail();
  const password = v.password ?? 'marking-gauge-77';
  const row = await db
    .insertInto('users')
    .values({ email, name: v.name ?? 'Juniper Kell', password_hash: await bcrypt.hash(password, 4) })
    .returning('id')
    .executeTakeFirstOrThrow();
  return { id: row.id, email, password };
}

export async function insertShop(db: DB, name = 'Hollowmere Joinery'): Promise<string> {
  const row = await db
    .insertInto('shops')
    .values({ name, slug: `shop-${randomBytes(5).toString('hex')}` })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function addMembership(db: DB, shopId: string, userId: string, role: Role): Promise<void> {
  await db.insertInto('memberships').values({ shop_id: shopId, user_id: userId, role }).execute();
}

const COUNTED = ['users', 'sessions', 'shops', 'memberships', 'invites', 'password_resets'] as const;

/** Row counts of the account tables, to show a refused request changed nothing. */
export async function accountCounts(db: DB): Promise<Record<(typeof COUNTED)[number], number>> {
  const out = {} as Record<(typeof COUNTED)[number], number>;
  for (const t of COUNTED) {
    const r = await db.selectFrom(t).select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    out[t] = Number(r.n);
  }
  return out;
}

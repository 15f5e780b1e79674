import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../../db/schema';
import type { PublicUser } from '../../shared/schemas/auth';

type Q = Kysely<Database> | Transaction<Database>;

export const publicUser = (u: { id: string; email: string; name: string; units: 'mm' | 'in' }): PublicUser => ({
  id: u.id,
  email: u.email,
  name: u.name,
  units: u.units,
});

export async function userByEmail(db: Q, email: string) {
  return db.selectFrom('users').select(['id', 'email', 'name', 'units', 'password_hash']).where('email', '=', email).executeTakeFirst();
}

export async function userById(db: Q, id: string) {
  return db.selectFrom('users').select(['id', 'email', 'name', 'units', 'password_hash']).where('id', '=', id).executeTakeFirst();
}

export async function insertUser(db: Q, v: { email: string; name: string; passwordHash: string }) {
  return db
    .insertInto('users')
    .values({ email: v.email, name: v.name, password_hash: v.passwordHash })
    .returning(['id', 'email', 'name', 'units'])
    .executeTakeFirstOrThrow();
}

export async function setPasswordHash(db: Q, userId: string, passwordHash: string): Promise<void> {
  await db.updateTable('users').set({ password_hash: passwordHash }).where('id', '=', userId).execute();
}

export async function insertPasswordReset(db: Q, v: { userId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insertInto('password_resets').values({ user_id: v.userId, token_hash: v.tokenHash, expires_at: v.expiresAt }).execute();
}

export async function passwordResetByHash(db: Q, tokenHash: string) {
  return db.selectFrom('password_resets').select(['id', 'user_id', 'expires_at', 'used_at']).where('token_hash', '=', tokenHash).executeTakeFirst();
}

/** Marks the reset used, only if it still was not: false when another request got there first. */
export async function useResetOnce(db: Q, resetId: string): Promise<boolean> {
  const row = await db
    .updateTable('password_resets')
    .set({ used_at: new Date() })
    .where('id', '=', resetId)
    .where('used_at', 'is', null)
    .returning('id')
    .executeTakeFirst();
  return !!row;
}

/** After a reset, the other links sent to the same person stop working too. */
export async function closeOpenResets(db: Q, userId: string): Promise<void> {
  await db.updateTable('password_resets').set({ used_at: new Date() }).where('user_id', '=', userId).where('used_at', 'is', null).execute();
}

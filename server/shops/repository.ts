import { randomBytes } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Database, Role } from '../../db/schema';
import type { Member, PendingInvite, ShopSummary } from '../../shared/schemas/auth';
import { conflict, HttpError, notFound } from '../http/errors';

type Q = Kysely<Database> | Transaction<Database>;

const isUniqueViolation = (e: unknown) => (e as { code?: string })?.code === '23505';

export async function roleIn(db: Q, shopId: string, userId: string): Promise<Role | null> {
  const row = await db.selectFrom('memberships').select('role').where('shop_id', '=', shopId).where('user_id', '=', userId).executeTakeFirst();
  return row?.role ?? null;
}

export async function shopsOf(db: Q, userId: string): Promise<ShopSummary[]> {
  return db
    .selectFrom('memberships')
    .innerJoin('shops', 'shops.id', 'memberships.shop_id')
    .select(['shops.id', 'shops.name', 'shops.slug', 'memberships.role'])
    .where('memberships.user_id', '=', userId)
    .orderBy('shops.name')
    .orderBy('shops.id')
    .execute();
}

export async function shopFor(db: Q, shopId: string, userId: string): Promise<ShopSummary | null> {
  const row = await db
    .selectFrom('memberships')
    .innerJoin('shops', 'shops.id', 'memberships.shop_id')
    .select(['shops.id', 'shops.name', 'shops.slug', 'memberships.role'])
    .where('memberships.shop_id', '=', shopId)
    .where('memberships.user_id', '=', userId)
    .executeTakeFirst();
  return row ?? null;
}

/** "Birch & Bench Co." → "birch-bench-co"; only used for readable URLs, never as an identity. */
export function slugFor(name: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/g, '');
  return slug || 'shop';
}

/** A new shop with its creator as the first owner. */
export async function createShop(db: Kysely<Database>, name: string, ownerId: string): Promise<ShopSummary> {
  const base = slugFor(name);
  for (let attempt = 0; attempt < 6; attempt++) {
    const slug = attempt === 0 ? base : `${base}-${randomBytes(3).toString('hex')}`;
    try {
      return await db.transaction().execute(async (tx) => {
        const shop = await tx.insertInto('shops').values({ name, slug }).returning(['id', 'name', 'slug']).executeTakeFirstOrThrow();
        await tx.insertInto('memberships').values({ shop_id: shop.id, user_id: ownerId, role: 'owner' }).execute();
        return { ...shop, role: 'owner' as const };
      });
    } catch (e) {
      if (!isUniqueViolation(e)) throw e; // a taken slug: try again with a suffix
    }
  }
  throw conflict('Could not find a free web address for that shop name; try a different name');
}

export async function renameShop(db: Q, shopId: string, name: string): Promise<void> {
  await db.updateTable('shops').set({ name }).where('id', '=', shopId).execute();
}

export async function membersOf(db: Q, shopId: string): Promise<Member[]> {
  const rows = await db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select(['users.id as userId', 'users.name', 'users.email', 'memberships.role', 'memberships.created_at'])
    .where('memberships.shop_id', '=', shopId)
    .orderBy('users.name')
    .orderBy('users.id')
    .execute();
  return rows.map((r) => ({ userId: r.userId, name: r.name, email: r.email, role: r.role, joinedAt: r.created_at.toISOString() }));
}

const LAST_OWNER = 'A shop needs at least one owner: make someone else an owner first';

/**
 * Runs `change` on one membership while the shop's owner rows are locked, so two owners demoting
 * each other at the same moment cannot leave the shop without one.
 */
async function withOwnersLocked(db: Kysely<Database>, shopId: string, userId: string, change: (tx: Transaction<Database>, current: Role, owners: number) => Promise<void>) {
  await db.transaction().execute(async (tx) => {
    const owners = await tx.selectFrom('memberships').select('user_id').where('shop_id', '=', shopId).where('role', '=', 'owner').forUpdate().execute();
    const current = await roleIn(tx, shopId, userId);
    if (!current) throw notFound('That person is not a member of this shop');
    await change(tx, current, owners.length);
  });
}

export async function changeRole(db: Kysely<Database>, shopId: string, userId: string, role: Role): Promise<void> {
  await withOwnersLocked(db, shopId, userId, async (tx, current, owners) => {
    if (current === role) return;
    if (current === 'owner' && owners <= 1) throw conflict(LAST_OWNER);
    await tx.updateTable('memberships').set({ role }).where('shop_id', '=', shopId).where('user_id', '=', userId).execute();
  });
}

export async function removeMember(db: Kysely<Database>, shopId: string, userId: string): Promise<void> {
  await withOwnersLocked(db, shopId, userId, async (tx, current, owners) => {
    if (current === 'owner' && owners <= 1) throw conflict(LAST_OWNER);
    await tx.deleteFrom('memberships').where('shop_id', '=', shopId).where('user_id', '=', userId).execute();
  });
}

// Invites

export const INVITE_DAYS = 7;

export async function pendingInvites(db: Q, shopId: string): Promise<PendingInvite[]> {
  const rows = await db
    .selectFrom('invites')
    .leftJoin('users', 'users.id', 'invites.invited_by')
    .select(['invites.id', 'invites.email', 'invites.role', 'invites.expires_at', 'users.name as invitedBy'])
    .where('invites.shop_id', '=', shopId)
    .where('invites.accepted_at', 'is', null)
    .where('invites.expires_at', '>', new Date())
    .orderBy('invites.created_at', 'desc')
    .execute();
  return rows.map((r) => ({ id: r.id, email: r.email, role: r.role, expiresAt: r.expires_at.toISOString(), invitedBy: r.invitedBy }));
}

export async function isMemberByEmail(db: Q, shopId: string, email: string): Promise<boolean> {
  const row = await db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select('users.id')
    .where('memberships.shop_id', '=', shopId)
    .where('users.email', '=', email)
    .executeTakeFirst();
  return !!row;
}

/** Replaces any open invite for the same address, so only the newest link works. */
export async function insertInvite(
  tx: Transaction<Database>,
  v: { shopId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<PendingInvite> {
  await tx.deleteFrom('invites').where('shop_id', '=', v.shopId).where('email', '=', v.email).where('accepted_at', 'is', null).execute();
  const row = await tx
    .insertInto('invites')
    .values({ shop_id: v.shopId, email: v.email, role: v.role, token_hash: v.tokenHash, invited_by: v.invitedBy, expires_at: v.expiresAt })
    .returning(['id', 'email', 'role', 'expires_at'])
    .executeTakeFirstOrThrow();
  return { id: row.id, email: row.email, role: row.role, expiresAt: row.expires_at.toISOString(), invitedBy: null };
}

export async function deletePendingInvite(db: Q, shopId: string, inviteId: string): Promise<boolean> {
  const res = await db.deleteFrom('invites').where('id', '=', inviteId).where('shop_id', '=', shopId).where('accepted_at', 'is', null).executeTakeFirst();
  return res.numDeletedRows > 0n;
}

export interface OpenInvite {
  id: string;
  shopId: string;
  shopName: string;
  email: string;
  role: Role;
  expiresAt: Date;
}

/** The invite a link names, if it can still be used; otherwise a clear reason why not. */
export async function usableInvite(db: Q, tokenHash: string): Promise<OpenInvite> {
  const row = await db
    .selectFrom('invites')
    .innerJoin('shops', 'shops.id', 'invites.shop_id')
    .select(['invites.id', 'invites.shop_id', 'shops.name', 'invites.email', 'invites.role', 'invites.expires_at', 'invites.accepted_at'])
    .where('invites.token_hash', '=', tokenHash)
    .executeTakeFirst();
  if (!row) throw new HttpError(404, 'invite_not_found', 'This invite link is not valid; check that the whole link was copied from the e-mail');
  if (row.accepted_at) throw new HttpError(410, 'invite_used', 'This invite has already been used; ask the shop owner for a new one if you still need to join');
  if (row.expires_at.getTime() <= Date.now()) throw new HttpError(410, 'invite_expired', 'This invite has expired; ask the shop owner to send a new one');
  return { id: row.id, shopId: row.shop_id, shopName: row.name, email: row.email, role: row.role, expiresAt: row.expires_at };
}

/** Uses the invite once and adds the membership, both or neither. */
export async function acceptInvite(db: Kysely<Database>, invite: OpenInvite, userId: string): Promise<void> {
  await db.transaction().execute(async (tx) => {
    const used = await tx
      .updateTable('invites')
      .set({ accepted_at: new Date(), accepted_by: userId })
      .where('id', '=', invite.id)
      .where('accepted_at', 'is', null)
      .where('expires_at', '>', new Date())
      .returning('id')
      .executeTakeFirst();
    // Someone else used the same link between the check and now.
    if (!used) throw new HttpError(410, 'invite_used', 'This invite has already been used; ask the shop owner for a new one if you still need to join');
    const joined = await tx
      .insertInto('memberships')
      .values({ shop_id: invite.shopId, user_id: userId, role: invite.role })
      .onConflict((oc) => oc.doNothing())
      .returning('user_id')
      .executeTakeFirst();
    if (!joined) throw conflict(`You are already a member of ${invite.shopName}`);
  });
}

// The world each matrix row runs in: a shop with a viewer, an editor and an owner, and a second
// shop whose owner is the "outsider". Every row gets a fresh one, so a row that removes a member
// or changes a password cannot disturb the next row.
import type { Test } from 'supertest';
import type { Role } from '../../db/schema';
import { startSession } from '../../server/auth/sessions';
import { hashLinkToken, newLinkToken } from '../../server/auth/secrets';
import { addMembership, insertPerson, insertShop, uniqueEmail } from '../support/accounts';
import type { TestContext } from '../support/context';

export const PRINCIPALS = ['anonymous', 'outsider', 'viewer', 'editor', 'owner'] as const;
export type Principal = (typeof PRINCIPALS)[number];
export type Person = { id: string; email: string; password: string };

export interface MatrixFixture {
  ctx: TestContext;
  /** The shop every principal but the outsider belongs to. */
  shopId: string;
  /** The outsider's own shop (the outsider is its owner). */
  otherShopId: string;
  people: Record<Exclude<Principal, 'anonymous'>, Person>;
  /** Ids that fixture hooks add (a design, a revision…), e.g. ids.designId. */
  ids: Record<string, string>;
  /** A new member of the fixture shop, e.g. one to remove or to promote. */
  addMember(role: Role): Promise<Person>;
  /** An open invite (token and id); by default to a fresh address for the fixture shop. */
  addInvite(v?: { shopId?: string; email?: string; role?: Role; expiresAt?: Date }): Promise<{ id: string; token: string }>;
  /** A fresh shop with its own owner. */
  addShop(): Promise<string>;
  /** The person behind a principal (anonymous has none: the owner is used for its bodies). */
  personOf(who: Principal): Person;
  /** A new session token for a principal; null for anonymous. */
  tokenFor(who: Principal): Promise<string | null>;
}

export interface MatrixRequest {
  path: string;
  body?: unknown;
  /** For requests that are not JSON (uploads): adjust the supertest request, e.g. `.attach(...)`. */
  prepare?: (req: Test) => Test;
}

export type FixtureHook = (f: MatrixFixture) => Promise<void>;

export async function buildFixture(ctx: TestContext, hooks: FixtureHook[]): Promise<MatrixFixture> {
  const { db, config } = ctx;
  const shopId = await insertShop(db, 'Fernhollow Cabinetry');
  const otherShopId = await insertShop(db, 'Quarry Lane Woodshop');
  const person = (label: string) => insertPerson(db, { email: uniqueEmail(label, 'matrix.example'), password: `${label}-password-123` });
  const people = {
    viewer: await person('viewer'),
    editor: await person('editor'),
    owner: await person('owner'),
    outsider: await person('outsider'),
  };
  await addMembership(db, shopId, people.viewer.id, 'viewer');
  await addMembership(db, shopId, people.editor.id, 'editor');
  await addMembership(db, shopId, people.owner.id, 'owner');
  await addMembership(db, otherShopId, people.outsider.id, 'owner');

  const f: MatrixFixture = {
    ctx,
    shopId,
    otherShopId,
    people,
    ids: {},
    async addMember(role) {
      const p = await person(`member-${role}`);
      await addMembership(db, shopId, p.id, role);
      return p;
    },
    async addInvite(v = {}) {
      const token = newLinkToken();
      const row = await db
        .insertInto('invites')
        .values({
          shop_id: v.shopId ?? shopId,
          email: v.email ?? uniqueEmail('invitee', 'matrix.example'),
          role: v.role ?? 'viewer',
          token_hash: hashLinkToken(token),
          invited_by: people.owner.id,
          expires_at: v.expiresAt ?? new Date(Date.now() + 24 * 3600 * 1000),
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      return { id: row.id, token };
    },
    async addShop() {
      const id = await insertShop(db, 'Sedgewick Turnery');
      const p = await person('shop-owner');
      await addMembership(db, id, p.id, 'owner');
      return id;
    },
    personOf(who) {
      return who === 'anonymous' ? people.owner : people[who];
    },
    async tokenFor(who) {
      if (who === 'anonymous') return null;
      return (await startSession(db, config, people[who].id)).token;
    },
  };
  for (const hook of hooks) await hook(f);
  return f;
}

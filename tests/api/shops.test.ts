// Shops, members and invites, followed through the mail the invitee receives.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { createApp } from '../../server/app';
import { createMailer } from '../../server/mail/mailer';
import { changeRole, removeMember } from '../../server/shops/repository';
import { accountCounts, addMembership, bearer, insertPerson, insertShop, signUpVia, uniqueEmail, type SignedUp } from '../support/accounts';
import { createTestContext, type TestContext } from '../support/context';
import { firstLink } from '../support/mailbox';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

async function newShop(owner: SignedUp, name = 'Kestrel Bench Co.') {
  const r = await ctx.http.post('/api/shops').set(bearer(owner.token)).send({ name });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.shop as { id: string; name: string; slug: string; role: string };
}

/** Invites `email`, reads the mail the fake captured, and returns the token from its link. */
async function inviteAndReadMail(owner: SignedUp, shopId: string, email: string, role = 'viewer') {
  const sent = ctx.mailbox.countFor(email);
  const r = await ctx.http.post(`/api/shops/${shopId}/invites`).set(bearer(owner.token)).send({ email, role });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  const mail = await ctx.mailbox.latestFor(email, { after: sent });
  const link = firstLink(mail);
  const m = new RegExp(`^${ctx.config.publicUrl.replace(/[.]/g, '\\.')}/invite/([A-Za-z0-9_-]{43})$`).exec(link);
  expect(m, link).not.toBeNull();
  return { token: m![1], mail, invite: r.body.invite };
}

describe('shops', () => {
  it('creates a shop with the creator as owner, lists it, and the owner renames it', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner, 'Kestrel Bench Co.');
    expect(shop).toMatchObject({ name: 'Kestrel Bench Co.', slug: 'kestrel-bench-co', role: 'owner' });
    const again = await newShop(owner, 'Kestrel Bench Co.');
    expect(again.slug).toMatch(/^kestrel-bench-co-[0-9a-f]{6}$/); // slugs stay unique
    const list = await ctx.http.get('/api/shops').set(bearer(owner.token));
    expect(list.body.shops.map((s: { id: string }) => s.id).sort()).toEqual([shop.id, again.id].sort());
    const renamed = await ctx.http.patch(`/api/shops/${shop.id}`).set(bearer(owner.token)).send({ name: 'Kestrel Joinery' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.shop.name).toBe('Kestrel Joinery');
    const me = await ctx.http.get('/api/me').set(bearer(owner.token));
    expect(me.body.shops.find((s: { id: string }) => s.id === shop.id)).toMatchObject({ name: 'Kestrel Joinery', role: 'owner' });
  });

  it('refuses bad shop names and unknown fields with clear 400s, changing nothing', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const before = await accountCounts(ctx.db);
    const cases: [string, unknown, RegExp][] = [
      ['post', { name: 'x' }, /at least 2 characters/],
      ['post', { name: 'Two\nLines' }, /line breaks/],
      ['post', { name: 'Fine Name', slug: 'mine' }, /Unknown field: slug/],
      ['patch', { name: '' }, /at least 2 characters/],
    ];
    for (const [method, body, message] of cases) {
      const req = method === 'post' ? ctx.http.post('/api/shops') : ctx.http.patch(`/api/shops/${shop.id}`);
      const r = await req.set(bearer(owner.token)).send(body as object);
      expect(r.status).toBe(400);
      expect(r.body.error.message).toMatch(message);
    }
    expect(await accountCounts(ctx.db)).toEqual(before);
    const still = await ctx.db.selectFrom('shops').select('name').where('id', '=', shop.id).executeTakeFirstOrThrow();
    expect(still.name).toBe('Kestrel Bench Co.');
  });

  it('answers 404 for a shop id that is not a uuid or does not exist', async () => {
    const p = await signUpVia(ctx);
    expect((await ctx.http.get('/api/shops/not-a-uuid').set(bearer(p.token))).status).toBe(404);
    const r = await ctx.http.get('/api/shops/00000000-0000-4000-8000-000000000000/members').set(bearer(p.token));
    expect(r.status).toBe(404);
    expect(r.body.error.message).toBe('Not found, or not shared with you');
  });
});

describe('invites, followed through the mail', () => {
  it('sign up, get invited, follow the link, join with the invited role', async () => {
    const owner = await signUpVia(ctx, { name: 'Maple Orrin' });
    const shop = await newShop(owner, 'Heronsgate Workshop');
    const email = uniqueEmail('joiner');
    const { token, mail, invite } = await inviteAndReadMail(owner, shop.id, email, 'editor');
    expect(invite).toMatchObject({ email, role: 'editor', invitedBy: 'Maple Orrin' });
    expect(mail.subject).toBe('Join Heronsgate Workshop on Jigwright');
    expect(mail.text).toContain('Maple Orrin invited you to Heronsgate Workshop as an editor');
    // Only the hash of the link's token is stored.
    const row = await ctx.db.selectFrom('invites').select(['token_hash', 'accepted_at']).where('id', '=', invite.id).executeTakeFirstOrThrow();
    expect(row.token_hash).not.toContain(token);

    const pending = await ctx.http.get(`/api/shops/${shop.id}/invites`).set(bearer(owner.token));
    expect(pending.body.invites.map((i: { email: string }) => i.email)).toEqual([email]);

    const preview = await ctx.http.get(`/api/invites/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body.invite).toMatchObject({ shopName: 'Heronsgate Workshop', role: 'editor', email });

    const joiner = await signUpVia(ctx, { email });
    const accepted = await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(joiner.token));
    expect(accepted.status).toBe(200);
    expect(accepted.body.shop).toMatchObject({ id: shop.id, name: 'Heronsgate Workshop', role: 'editor' });
    const me = await ctx.http.get('/api/me').set(bearer(joiner.token));
    expect(me.body.shops).toEqual([{ id: shop.id, name: 'Heronsgate Workshop', slug: shop.slug, role: 'editor' }]);
    const members = await ctx.http.get(`/api/shops/${shop.id}/members`).set(bearer(joiner.token));
    expect(members.body.members.map((m: { email: string; role: string }) => [m.email, m.role]).sort()).toEqual(
      [[owner.email, 'owner'], [email, 'editor']].sort(),
    );
    expect((await ctx.http.get(`/api/shops/${shop.id}/invites`).set(bearer(owner.token))).body.invites).toEqual([]);

    // Single use: the same link again is refused and changes nothing.
    const before = await accountCounts(ctx.db);
    const reuse = await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(joiner.token));
    expect(reuse.status).toBe(410);
    expect(reuse.body.error.code).toBe('invite_used');
    expect((await ctx.http.get(`/api/invites/${token}`)).status).toBe(410);
    expect(await accountCounts(ctx.db)).toEqual(before);
  });

  it('only the invited address can accept; another account is told which address to use', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const email = uniqueEmail('intended');
    const { token } = await inviteAndReadMail(owner, shop.id, email);
    const someoneElse = await signUpVia(ctx);
    const before = await accountCounts(ctx.db);
    const r = await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(someoneElse.token));
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('wrong_account');
    expect(r.body.error.message).toContain(email);
    expect(await accountCounts(ctx.db)).toEqual(before);
    // The right person can still use it afterwards.
    const intended = await signUpVia(ctx, { email });
    expect((await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(intended.token))).status).toBe(200);
  });

  it('refuses an expired invite (expiry set in the past) and an unknown or cut-off link', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const email = uniqueEmail('late');
    const { token, invite } = await inviteAndReadMail(owner, shop.id, email);
    await ctx.db.updateTable('invites').set({ expires_at: new Date(Date.now() - 60_000) }).where('id', '=', invite.id).execute();
    const late = await signUpVia(ctx, { email });
    const before = await accountCounts(ctx.db);
    const r = await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(late.token));
    expect(r.status).toBe(410);
    expect(r.body.error).toMatchObject({ code: 'invite_expired', message: 'This invite has expired; ask the shop owner to send a new one' });
    const unknown = await ctx.http.get(`/api/invites/${'B'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toMatch(/not valid/);
    expect((await ctx.http.post(`/api/invites/${token.slice(0, 20)}/accept`).set(bearer(late.token))).status).toBe(404);
    expect(await accountCounts(ctx.db)).toEqual(before);
    expect((await ctx.http.get('/api/me').set(bearer(late.token))).body.shops).toEqual([]);
  });

  it('a new invite to the same address replaces the open one: the old link stops working', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const email = uniqueEmail('twice');
    const first = await inviteAndReadMail(owner, shop.id, email, 'viewer');
    const second = await inviteAndReadMail(owner, shop.id, email, 'editor');
    expect((await ctx.http.get(`/api/invites/${first.token}`)).status).toBe(404);
    expect((await ctx.http.get(`/api/invites/${second.token}`)).body.invite.role).toBe('editor');
    expect((await ctx.http.get(`/api/shops/${shop.id}/invites`).set(bearer(owner.token))).body.invites).toHaveLength(1);
  });

  it('refuses to invite a member, a malformed address or an unknown role, and sends nothing', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const before = await accountCounts(ctx.db);
    const mailsBefore = ctx.mailbox.countFor(owner.email);
    const member = await ctx.http.post(`/api/shops/${shop.id}/invites`).set(bearer(owner.token)).send({ email: owner.email, role: 'viewer' });
    expect(member.status).toBe(409);
    expect(member.body.error.message).toBe(`${owner.email} is already a member of this shop`);
    const badEmail = await ctx.http.post(`/api/shops/${shop.id}/invites`).set(bearer(owner.token)).send({ email: 'someone at shop', role: 'viewer' });
    expect(badEmail.status).toBe(400);
    expect(badEmail.body.error.fields.email).toMatch(/full e-mail address/);
    const badRole = await ctx.http.post(`/api/shops/${shop.id}/invites`).set(bearer(owner.token)).send({ email: uniqueEmail(), role: 'foreman' });
    expect(badRole.body.error.fields.role).toBe('Choose a role: owner, editor or viewer');
    const extra = await ctx.http.post(`/api/shops/${shop.id}/invites`).set(bearer(owner.token)).send({ email: uniqueEmail(), role: 'viewer', note: 'hi' });
    expect(extra.body.error.message).toMatch(/Unknown field: note/);
    expect(await accountCounts(ctx.db)).toEqual(before);
    expect(ctx.mailbox.countFor(owner.email)).toBe(mailsBefore);
  });

  it('keeps no invite when its mail cannot be sent, and says so', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const broken = createApp({ ...ctx.deps, mailer: createMailer('smtp://127.0.0.1:1', 'x@jigwright.invalid') }).app;
    const before = await accountCounts(ctx.db);
    const r = await supertest(broken).post(`/api/shops/${shop.id}/invites`).set(bearer(owner.token)).send({ email: uniqueEmail(), role: 'viewer' });
    expect(r.status).toBe(503);
    expect(r.body.error.message).toMatch(/could not be sent, so nothing was saved/);
    expect(await accountCounts(ctx.db)).toEqual(before);
  });

  it('the owner withdraws an open invite and its link stops working', async () => {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const { token, invite } = await inviteAndReadMail(owner, shop.id, uniqueEmail('withdrawn'));
    const del = await ctx.http.delete(`/api/shops/${shop.id}/invites/${invite.id}`).set(bearer(owner.token));
    expect(del.status).toBe(200);
    expect(del.body.invites).toEqual([]);
    expect((await ctx.http.get(`/api/invites/${token}`)).status).toBe(404);
    const again = await ctx.http.delete(`/api/shops/${shop.id}/invites/${invite.id}`).set(bearer(owner.token));
    expect(again.status).toBe(404);
  });
});

describe('roles and members', () => {
  async function shopWithMember(role: 'viewer' | 'editor' | 'owner') {
    const owner = await signUpVia(ctx);
    const shop = await newShop(owner);
    const email = uniqueEmail('member');
    const { token } = await inviteAndReadMail(owner, shop.id, email, role);
    const member = await signUpVia(ctx, { email });
    expect((await ctx.http.post(`/api/invites/${token}/accept`).set(bearer(member.token))).status).toBe(200);
    return { owner, shop, member };
  }
  const roleOf = async (shopId: string, userId: string) =>
    (await ctx.db.selectFrom('memberships').select('role').where('shop_id', '=', shopId).where('user_id', '=', userId).executeTakeFirst())?.role;

  it('the owner changes a role; the member then has that role', async () => {
    const { owner, shop, member } = await shopWithMember('viewer');
    const r = await ctx.http.patch(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token)).send({ role: 'editor' });
    expect(r.status).toBe(200);
    expect(r.body.members.find((m: { userId: string }) => m.userId === member.id).role).toBe('editor');
    expect(await roleOf(shop.id, member.id)).toBe('editor');
    // An editor still cannot manage members.
    const denied = await ctx.http.patch(`/api/shops/${shop.id}/members/${owner.id}`).set(bearer(member.token)).send({ role: 'viewer' });
    expect(denied.status).toBe(403);
    expect(denied.body.error.message).toBe("Only the shop's owners can do this; you are an editor in this shop");
    expect(await roleOf(shop.id, owner.id)).toBe('owner');
  });

  it('refuses to demote or remove the last owner with 409, and changes nothing', async () => {
    const { owner, shop } = await shopWithMember('editor');
    const before = await accountCounts(ctx.db);
    const demote = await ctx.http.patch(`/api/shops/${shop.id}/members/${owner.id}`).set(bearer(owner.token)).send({ role: 'editor' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toBe('A shop needs at least one owner: make someone else an owner first');
    const remove = await ctx.http.delete(`/api/shops/${shop.id}/members/${owner.id}`).set(bearer(owner.token));
    expect(remove.status).toBe(409);
    expect(await roleOf(shop.id, owner.id)).toBe('owner');
    expect(await accountCounts(ctx.db)).toEqual(before);
  });

  it('with a second owner, two owners demoting each other at once leave exactly one owner', async () => {
    const { owner, shop, member } = await shopWithMember('owner');
    const [a, b] = await Promise.all([
      ctx.http.patch(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token)).send({ role: 'viewer' }),
      ctx.http.patch(`/api/shops/${shop.id}/members/${owner.id}`).set(bearer(member.token)).send({ role: 'viewer' }),
    ]);
    // The later one is refused: by the policy (403, no longer an owner) or by the last-owner rule (409).
    const statuses = [a.status, b.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const owners = await ctx.db.selectFrom('memberships').select('user_id').where('shop_id', '=', shop.id).where('role', '=', 'owner').execute();
    expect(owners).toHaveLength(1);
  });

  it('the last-owner rule holds when two changes race past the role check together (row locks)', async () => {
    for (let round = 0; round < 8; round++) {
      const shopId = await insertShop(ctx.db, 'Racing Lathe Co-op');
      const a = await insertPerson(ctx.db);
      const b = await insertPerson(ctx.db);
      await addMembership(ctx.db, shopId, a.id, 'owner');
      await addMembership(ctx.db, shopId, b.id, 'owner');
      // Straight to the repository, as two requests would after both passed their policy check.
      const results = await Promise.allSettled([changeRole(ctx.db, shopId, a.id, 'editor'), removeMember(ctx.db, shopId, b.id)]);
      expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
      const refused = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
      expect(refused.reason.status).toBe(409);
      const owners = await ctx.db.selectFrom('memberships').select('user_id').where('shop_id', '=', shopId).where('role', '=', 'owner').execute();
      expect(owners).toHaveLength(1);
    }
  });

  it('the owner removes a member, who then cannot see the shop (404)', async () => {
    const { owner, shop, member } = await shopWithMember('viewer');
    const r = await ctx.http.delete(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token));
    expect(r.status).toBe(200);
    expect(r.body.members.map((m: { userId: string }) => m.userId)).toEqual([owner.id]);
    expect((await ctx.http.get(`/api/shops/${shop.id}`).set(bearer(member.token))).status).toBe(404);
    const gone = await ctx.http.delete(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token));
    expect(gone.status).toBe(404);
    expect(gone.body.error.message).toBe('That person is not a member of this shop');
  });

  it('refuses an unknown role or extra fields in a role change', async () => {
    const { owner, shop, member } = await shopWithMember('viewer');
    const bad = await ctx.http.patch(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token)).send({ role: 'admin' });
    expect(bad.status).toBe(400);
    const extra = await ctx.http.patch(`/api/shops/${shop.id}/members/${member.id}`).set(bearer(owner.token)).send({ role: 'editor', shopId: shop.id });
    expect(extra.status).toBe(400);
    expect(await roleOf(shop.id, member.id)).toBe('viewer');
  });
});

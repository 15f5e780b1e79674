import type { Request } from 'express';
import { ChangeRole, CreateInvite, CreateShop, LinkToken, RenameShop } from '../../shared/schemas/auth';
import { hashLinkToken, newLinkToken } from '../auth/secrets';
import { HttpError, notFound } from '../http/errors';
import { authOf, type Policy } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { isUuid, shopFromParam } from '../library/locators';
import { linkTo, sendOrRefuse } from '../auth/links';
import { inviteMail } from './mail';
import {
  acceptInvite,
  changeRole,
  createShop,
  deletePendingInvite,
  INVITE_DAYS,
  insertInvite,
  isMemberByEmail,
  membersOf,
  pendingInvites,
  removeMember,
  renameShop,
  roleIn,
  shopFor,
  shopsOf,
  usableInvite,
} from './repository';

const member: Policy = { kind: 'shop', role: 'viewer', shop: shopFromParam };
const owner: Policy = { kind: 'shop', role: 'owner', shop: shopFromParam };

/** The member a path names; anything that is not an id of one is simply not found. */
function memberParam(req: Request): string {
  const id = req.params.userId;
  if (!isUuid(id)) throw notFound('That person is not a member of this shop');
  return id;
}

/** An invite token from the path, checked for shape before it is hashed and looked up. */
function inviteTokenParam(req: Request): string {
  const parsed = LinkToken.safeParse(req.params.token);
  if (!parsed.success) throw new HttpError(404, 'invite_not_found', 'This invite link is not valid; check that the whole link was copied from the e-mail');
  return parsed.data;
}

export function shopRoutes(api: ApiRouter): void {
  const { db, config, mailer } = api.deps;

  api.route('get', '/shops', { kind: 'signed-in' }, async (req, res) => {
    res.json({ shops: await shopsOf(db, authOf(req).user.id) });
  });

  api.route('post', '/shops', { kind: 'signed-in' }, async (req, res) => {
    const body = CreateShop.parse(req.body);
    res.status(201).json({ shop: await createShop(db, body.name, authOf(req).user.id) });
  });

  api.route('get', '/shops/:shopId', member, async (req, res) => {
    const { shopId, user } = authOf(req);
    res.json({ shop: await shopFor(db, shopId!, user.id) });
  });

  api.route('patch', '/shops/:shopId', owner, async (req, res) => {
    const body = RenameShop.parse(req.body);
    const { shopId, user } = authOf(req);
    await renameShop(db, shopId!, body.name);
    res.json({ shop: await shopFor(db, shopId!, user.id) });
  });

  api.route('get', '/shops/:shopId/members', member, async (req, res) => {
    res.json({ members: await membersOf(db, authOf(req).shopId!) });
  });

  api.route('patch', '/shops/:shopId/members/:userId', owner, async (req, res) => {
    const body = ChangeRole.parse(req.body);
    const shopId = authOf(req).shopId!;
    await changeRole(db, shopId, memberParam(req), body.role);
    res.json({ members: await membersOf(db, shopId) });
  });

  api.route('delete', '/shops/:shopId/members/:userId', owner, async (req, res) => {
    const shopId = authOf(req).shopId!;
    await removeMember(db, shopId, memberParam(req));
    res.json({ members: await membersOf(db, shopId) });
  });

  api.route('get', '/shops/:shopId/invites', owner, async (req, res) => {
    res.json({ invites: await pendingInvites(db, authOf(req).shopId!) });
  });

  api.route('post', '/shops/:shopId/invites', owner, async (req, res) => {
    const body = CreateInvite.parse(req.body);
    const { shopId, user } = authOf(req);
    if (await isMemberByEmail(db, shopId!, body.email)) {
      throw new HttpError(409, 'already_member', `${body.email} is already a member of this shop`, { fields: { email: 'Already a member of this shop' } });
    }
    const shop = await db.selectFrom('shops').select('name').where('id', '=', shopId!).executeTakeFirstOrThrow();
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + INVITE_DAYS * 24 * 3600 * 1000);
    // The invite is kept only if its mail went out: no invite that nobody was told about.
    const invite = await db.transaction().execute(async (tx) => {
      const created = await insertInvite(tx, { shopId: shopId!, email: body.email, role: body.role, tokenHash: hashLinkToken(token), invitedBy: user.id, expiresAt });
      await sendOrRefuse(mailer, inviteMail({ to: body.email, shopName: shop.name, role: body.role, inviterName: user.name, link: linkTo(config, `/invite/${token}`), expiresAt }), 'invite');
      return { ...created, invitedBy: user.name };
    });
    res.status(201).json({ invite });
  });

  api.route('delete', '/shops/:shopId/invites/:inviteId', owner, async (req, res) => {
    const shopId = authOf(req).shopId!;
    const inviteId = req.params.inviteId;
    if (!isUuid(inviteId) || !(await deletePendingInvite(db, shopId, inviteId))) {
      throw notFound('That invite is not open in this shop (it may have been used already)');
    }
    res.json({ invites: await pendingInvites(db, shopId) });
  });

  // Public so the invite screen can say which shop and address it is for before anyone signs in;
  // the 256-bit token in the link is what grants a look.
  api.route('get', '/invites/:token', { kind: 'public' }, async (req, res) => {
    const invite = await usableInvite(db, hashLinkToken(inviteTokenParam(req)));
    res.json({ invite: { shopName: invite.shopName, role: invite.role, email: invite.email, expiresAt: invite.expiresAt.toISOString() } });
  });

  api.route('post', '/invites/:token/accept', { kind: 'signed-in' }, async (req, res) => {
    const { user } = authOf(req);
    const invite = await usableInvite(db, hashLinkToken(inviteTokenParam(req)));
    if (invite.email !== user.email.toLowerCase()) {
      throw new HttpError(403, 'wrong_account', `This invite was sent to ${invite.email}, but you are signed in as ${user.email}. Sign in with the invited address to join.`);
    }
    if (await roleIn(db, invite.shopId, user.id)) throw new HttpError(409, 'already_member', `You are already a member of ${invite.shopName}`);
    await acceptInvite(db, invite, user.id);
    res.json({ shop: await shopFor(db, invite.shopId, user.id) });
  });
}

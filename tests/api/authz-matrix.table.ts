// Who may call what: one row per "METHOD /api/path" in api.defs, with the request to send and the
// status each principal must get. tests/api/authz-matrix.test.ts calls every row as every
// principal and fails when a route has no row here.
//
// To add a route: add a row keyed exactly as the route is declared (method in capitals, the
// path with its :params, prefixed by /api). `request` builds the call from the fixture (ids such as
// f.shopId, or f.ids.designId filled by a hook below) and may create what the call uses up (a
// member to remove, an invite to accept). Write the expected statuses out; the helpers only
// spell common patterns. If your rows need data, push a hook onto FIXTURE_HOOKS that creates it
// in f.shopId and stores its id in f.ids.
import type { Role } from '../../db/schema';
import { hashLinkToken, newLinkToken } from '../../server/auth/secrets';
import { uniqueEmail } from '../support/accounts';
import type { FixtureHook, MatrixFixture, MatrixRequest, Principal } from './authz-matrix.fixture';
import { LIBRARY_ROWS, libraryFixture } from './authz-matrix.library';
import { ARCHIVE_ROWS } from './authz-matrix.archive';

export interface MatrixRow {
  request: (f: MatrixFixture, who: Principal) => MatrixRequest | Promise<MatrixRequest>;
  expect: Record<Principal, number>;
}

/** Runs once per row, after the shop and its people exist: add designs, revisions… here. */
export const FIXTURE_HOOKS: FixtureHook[] = [libraryFixture];

/** The same answer for everyone, signed in or not. */
const anyone = (ok: number): Record<Principal, number> => ({ anonymous: ok, outsider: ok, viewer: ok, editor: ok, owner: ok });
/** Any signed-in person gets `ok`; nobody signed in gets 401. */
const signedIn = (ok: number): Record<Principal, number> => ({ anonymous: 401, outsider: ok, viewer: ok, editor: ok, owner: ok });
/** Members with at least `min` get `ok`, smaller roles 403, the outsider 404, anonymous 401. */
function members(min: Role, ok: number): Record<Principal, number> {
  const rank = { viewer: 1, editor: 2, owner: 3 };
  const at = (r: Role) => (rank[r] >= rank[min] ? ok : 403);
  return { anonymous: 401, outsider: 404, viewer: at('viewer'), editor: at('editor'), owner: at('owner') };
}

export const MATRIX: Record<string, MatrixRow> = {
  ...LIBRARY_ROWS,
  ...ARCHIVE_ROWS,
  'GET /api/health': { request: () => ({ path: '/api/health' }), expect: anyone(200) },

  // Generators and calculators: pure computation on the request's parameters, open to anyone.
  'GET /api/generators': { request: () => ({ path: '/api/generators' }), expect: anyone(200) },
  'POST /api/generators/:id/preview': { request: () => ({ path: '/api/generators/charger-insert/preview', body: { params: {} } }), expect: anyone(200) },
  'GET /api/calculators': { request: () => ({ path: '/api/calculators' }), expect: anyone(200) },
  'POST /api/calculators/:name': { request: () => ({ path: '/api/calculators/taper', body: { params: {} } }), expect: anyone(200) },

  // Accounts
  'POST /api/auth/sign-up': {
    request: () => ({ path: '/api/auth/sign-up', body: { email: uniqueEmail('newcomer', 'matrix.example'), password: 'spokeshave-curl-9', name: 'Rowan Tamsin' } }),
    expect: anyone(201),
  },
  'POST /api/auth/sign-in': {
    request: (f, who) => ({ path: '/api/auth/sign-in', body: { email: f.personOf(who).email, password: f.personOf(who).password } }),
    expect: anyone(200),
  },
  'POST /api/auth/sign-out': { request: () => ({ path: '/api/auth/sign-out' }), expect: signedIn(204) },
  'GET /api/me': { request: () => ({ path: '/api/me' }), expect: signedIn(200) },
  'POST /api/auth/sign-out-others': { request: () => ({ path: '/api/auth/sign-out-others' }), expect: signedIn(200) },
  'POST /api/auth/password': {
    request: (f, who) => ({ path: '/api/auth/password', body: { currentPassword: f.personOf(who).password, newPassword: 'a-fresh-password-456' } }),
    expect: signedIn(204),
  },
  'POST /api/auth/reset-request': { request: (f, who) => ({ path: '/api/auth/reset-request', body: { email: f.personOf(who).email } }), expect: anyone(202) },
  'POST /api/auth/reset': {
    request: async (f, who) => {
      const token = newLinkToken();
      await f.ctx.db
        .insertInto('password_resets')
        .values({ user_id: f.personOf(who).id, token_hash: hashLinkToken(token), expires_at: new Date(Date.now() + 3600_000) })
        .execute();
      return { path: '/api/auth/reset', body: { token, password: 'reset-password-789' } };
    },
    expect: anyone(200),
  },

  // Shops
  'GET /api/shops': { request: () => ({ path: '/api/shops' }), expect: signedIn(200) },
  'POST /api/shops': { request: () => ({ path: '/api/shops', body: { name: 'Alderbank Guild' } }), expect: signedIn(201) },
  'GET /api/shops/:shopId': { request: (f) => ({ path: `/api/shops/${f.shopId}` }), expect: members('viewer', 200) },
  'PATCH /api/shops/:shopId': { request: (f) => ({ path: `/api/shops/${f.shopId}`, body: { name: 'Fernhollow Cabinet Works' } }), expect: members('owner', 200) },
  'GET /api/shops/:shopId/members': { request: (f) => ({ path: `/api/shops/${f.shopId}/members` }), expect: members('viewer', 200) },
  'PATCH /api/shops/:shopId/members/:userId': {
    request: async (f) => ({ path: `/api/shops/${f.shopId}/members/${(await f.addMember('viewer')).id}`, body: { role: 'editor' } }),
    expect: members('owner', 200),
  },
  'DELETE /api/shops/:shopId/members/:userId': {
    request: async (f) => ({ path: `/api/shops/${f.shopId}/members/${(await f.addMember('viewer')).id}` }),
    expect: members('owner', 200),
  },
  'GET /api/shops/:shopId/invites': { request: (f) => ({ path: `/api/shops/${f.shopId}/invites` }), expect: members('owner', 200) },
  'POST /api/shops/:shopId/invites': {
    request: (f) => ({ path: `/api/shops/${f.shopId}/invites`, body: { email: uniqueEmail('invitee', 'matrix.example'), role: 'viewer' } }),
    expect: members('owner', 201),
  },
  'DELETE /api/shops/:shopId/invites/:inviteId': {
    request: async (f) => ({ path: `/api/shops/${f.shopId}/invites/${(await f.addInvite()).id}` }),
    expect: members('owner', 200),
  },
  'GET /api/invites/:token': { request: async (f) => ({ path: `/api/invites/${(await f.addInvite()).token}` }), expect: anyone(200) },
  // An invite to the caller's own address, in a shop none of them belongs to yet.
  'POST /api/invites/:token/accept': {
    request: async (f, who) => {
      const invite = await f.addInvite({ shopId: await f.addShop(), email: f.personOf(who).email });
      return { path: `/api/invites/${invite.token}/accept` };
    },
    expect: signedIn(200),
  },
};

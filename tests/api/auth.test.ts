// Accounts: sign-up, sign-in, sessions (cookie and Bearer), sign-out, password change, reset by
// mail, CSRF and rate limits. Every refused request is shown to leave the tables unchanged.
import { SignJWT } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstLink } from '../support/mailbox';
import { accountCounts, bearer, insertPerson, signInVia, signUpVia, uniqueEmail } from '../support/accounts';
import { createTestContext, type TestContext } from '../support/context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const CSRF = { 'X-Jigwright-CSRF': '1' };

describe('sign-up', () => {
  it('creates the account, answers { token, user } and sets an httpOnly SameSite=Lax session cookie', async () => {
    const email = uniqueEmail('wren');
    const res = await ctx.http.post('/api/auth/sign-up').send({ email: `  ${email.toUpperCase()} `, password: 'dovetail-saw-1234', name: '  Wren Alder ' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, name: 'Wren Alder', units: 'mm' });
    expect(res.body.user.password_hash).toBeUndefined();
    expect(typeof res.body.token).toBe('string');
    const cookie = [res.headers['set-cookie']].flat().find((c: string) => c.startsWith('jw_session='))!;
    // Cookie attributes per RFC 6265 §5.2 and the SameSite draft (RFC 6265bis); no Secure over http.
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).not.toMatch(/Secure/i);
    const row = await ctx.db.selectFrom('users').select('password_hash').where('email', '=', email).executeTakeFirstOrThrow();
    // bcrypt modular-crypt format "$2b$<cost>$…" (from memory: OpenBSD bcrypt), never the password itself.
    expect(row.password_hash).toMatch(/^\$2[aby]\$04\$/);
    expect(row.password_hash).not.toContain('dovetail');
  });

  it('marks the cookie Secure when PUBLIC_URL is https', async () => {
    const secure = await createTestContext({ PUBLIC_URL: 'https://jigwright.example' });
    try {
      const res = await secure.http.post('/api/auth/sign-up').send({ email: uniqueEmail(), password: 'dovetail-saw-1234', name: 'Sable Finch' });
      expect(res.status).toBe(201);
      expect([res.headers['set-cookie']].flat().join(';')).toMatch(/Secure/i);
    } finally {
      await secure.close();
    }
  });

  const bad: [string, unknown, string, RegExp][] = [
    ['a malformed e-mail', { email: 'not-an-address', password: 'dovetail-saw-1234', name: 'Ann' }, 'email', /full e-mail address/],
    ['a short password', { email: uniqueEmail(), password: 'short', name: 'Ann' }, 'password', /at least 10 characters/],
    ['a password over 72 bytes', { email: uniqueEmail(), password: 'x'.repeat(73), name: 'Ann' }, 'password', /at most 72 bytes/],
    ['no name', { email: uniqueEmail(), password: 'dovetail-saw-1234', name: '   ' }, 'name', /Enter your name/],
    ['an unknown field', { email: uniqueEmail(), password: 'dovetail-saw-1234', name: 'Ann', role: 'owner' }, '_', /Unknown field: role/],
    ['no body', undefined, '_', /JSON object/],
  ];
  for (const [what, body, field, message] of bad) {
    it(`refuses ${what} with a clear 400 and creates nothing`, async () => {
      const before = await accountCounts(ctx.db);
      const res = await ctx.http.post('/api/auth/sign-up').send(body as object);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields[field]).toMatch(message);
      expect(res.headers['set-cookie']).toBeUndefined();
      expect(await accountCounts(ctx.db)).toEqual(before);
    });
  }

  it('refuses an address that already has an account (any letter case) with 409 and creates nothing', async () => {
    const first = await signUpVia(ctx);
    const before = await accountCounts(ctx.db);
    const res = await ctx.http.post('/api/auth/sign-up').send({ email: first.email.toUpperCase(), password: 'another-password-1', name: 'Copy Cat' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toMatch(/already exists/);
    expect(await accountCounts(ctx.db)).toEqual(before);
  });
});

describe('sign-in and sessions', () => {
  it('signs in with the right password; the token works as Bearer and as the cookie', async () => {
    const p = await signUpVia(ctx);
    const { token, cookie } = await signInVia(ctx, p.email, p.password);
    const viaBearer = await ctx.http.get('/api/me').set(bearer(token));
    expect(viaBearer.status).toBe(200);
    expect(viaBearer.body).toEqual({ user: { id: p.id, email: p.email, name: p.name, units: 'mm' }, shops: [] });
    const viaCookie = await ctx.http.get('/api/me').set('Cookie', cookie);
    expect(viaCookie.status).toBe(200);
    expect(viaCookie.body.user.id).toBe(p.id);
  });

  it('answers a wrong password and an unknown address with the same 401 and starts no session', async () => {
    const p = await signUpVia(ctx);
    const before = await accountCounts(ctx.db);
    const wrong = await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: 'not-the-password' });
    const unknown = await ctx.http.post('/api/auth/sign-in').send({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    // OWASP Authentication Cheat Sheet: one generic message, so it does not tell which part was wrong.
    for (const r of [wrong, unknown]) {
      expect(r.status).toBe(401);
      expect(r.body.error).toEqual({ code: 'wrong_credentials', message: 'That e-mail and password do not match an account' });
      expect(r.headers['set-cookie']).toBeUndefined();
    }
    expect(await accountCounts(ctx.db)).toEqual(before);
  });

  it('refuses a sign-in with unknown fields or a malformed address with 400', async () => {
    const extra = await ctx.http.post('/api/auth/sign-in').send({ email: 'a@b.example', password: 'whatever-12', remember: true });
    expect(extra.status).toBe(400);
    expect(extra.body.error.message).toMatch(/Unknown field: remember/);
    const malformed = await ctx.http.post('/api/auth/sign-in').send({ email: 'a@', password: 'whatever-12' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.email).toMatch(/full e-mail address/);
  });

  it('answers 401 with a clear message when there is no token, a bad header or a bad token', async () => {
    const none = await ctx.http.get('/api/me');
    expect(none.status).toBe(401);
    expect(none.body.error.message).toBe('Sign in first');
    const basic = await ctx.http.get('/api/me').set('Authorization', 'Basic dXNlcjpwYXNz');
    expect(basic.status).toBe(401);
    expect(basic.body.error.message).toMatch(/Bearer <token>/);
    const junk = await ctx.http.get('/api/me').set(bearer('not.a.token'));
    expect(junk.status).toBe(401);
    expect(junk.body.error.message).toMatch(/not valid/);
  });

  it('refuses tokens that are altered, unsigned ("alg": "none") or signed with another key (RFC 8725 §2.1, §3.1)', async () => {
    const p = await signUpVia(ctx);
    const [h, payload, sig] = p.token.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString());
    const other = await insertPerson(ctx.db);
    const swapped = Buffer.from(JSON.stringify({ ...claims, sub: other.id })).toString('base64url');
    const noneHeader = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const foreign = await new SignJWT(claims).setProtectedHeader({ alg: 'HS256' }).sign(new TextEncoder().encode('some-other-secret-that-is-32-bytes-long'));
    for (const t of [`${h}.${swapped}.${sig}`, `${noneHeader}.${payload}.`, foreign]) {
      const r = await ctx.http.get('/api/me').set(bearer(t));
      expect(r.status, t).toBe(401);
    }
  });

  it('refuses a session that has expired or was revoked, even with a well-signed token', async () => {
    const p = await signUpVia(ctx);
    const { sid } = JSON.parse(Buffer.from(p.token.split('.')[1], 'base64url').toString());
    await ctx.db.updateTable('sessions').set({ expires_at: new Date(Date.now() - 1000) }).where('id', '=', sid).execute();
    const expired = await ctx.http.get('/api/me').set(bearer(p.token));
    expect(expired.status).toBe(401);
    expect(expired.body.error.message).toMatch(/session has ended/);
    const again = await signInVia(ctx, p.email, p.password);
    const sid2 = JSON.parse(Buffer.from(again.token.split('.')[1], 'base64url').toString()).sid;
    await ctx.db.updateTable('sessions').set({ revoked_at: new Date() }).where('id', '=', sid2).execute();
    expect((await ctx.http.get('/api/me').set(bearer(again.token))).status).toBe(401);
  });

  it('sign-out revokes that session only and clears the cookie', async () => {
    const p = await signUpVia(ctx);
    const second = await signInVia(ctx, p.email, p.password);
    const out = await ctx.http.post('/api/auth/sign-out').set('Cookie', p.cookie).set(CSRF);
    expect(out.status).toBe(204);
    expect([out.headers['set-cookie']].flat().join(';')).toMatch(/jw_session=;.*Expires=Thu, 01 Jan 1970/);
    expect((await ctx.http.get('/api/me').set('Cookie', p.cookie)).status).toBe(401);
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(401);
    expect((await ctx.http.get('/api/me').set(bearer(second.token))).status).toBe(200);
  });
});

describe('CSRF protection for cookie sessions (OWASP Cheat Sheet: CSRF)', () => {
  it('refuses an unsafe cookie request without the custom header, and changes nothing', async () => {
    const p = await signUpVia(ctx);
    const before = await accountCounts(ctx.db);
    const res = await ctx.http.post('/api/shops').set('Cookie', p.cookie).send({ name: 'Forged Shop' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/X-Jigwright-CSRF/);
    expect(await accountCounts(ctx.db)).toEqual(before);
    const ok = await ctx.http.post('/api/shops').set('Cookie', p.cookie).set(CSRF).send({ name: 'Real Shop' });
    expect(ok.status).toBe(201);
  });

  it('refuses an unsafe cookie request whose Origin is another site, even with the header', async () => {
    const p = await signUpVia(ctx);
    const res = await ctx.http.post('/api/auth/sign-out').set('Cookie', p.cookie).set(CSRF).set('Origin', 'https://elsewhere.example');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_site');
    expect((await ctx.http.get('/api/me').set('Cookie', p.cookie)).status).toBe(200); // still signed in
    const same = await ctx.http.post('/api/auth/sign-out').set('Cookie', p.cookie).set(CSRF).set('Origin', ctx.config.publicUrl);
    expect(same.status).toBe(204);
  });

  it('lets safe cookie requests and Bearer requests through without the header', async () => {
    const p = await signUpVia(ctx);
    expect((await ctx.http.get('/api/me').set('Cookie', p.cookie)).status).toBe(200);
    expect((await ctx.http.post('/api/shops').set(bearer(p.token)).send({ name: 'Script Shop' })).status).toBe(201);
  });

  it('refuses a sign-in posted from another site (login CSRF)', async () => {
    const p = await signUpVia(ctx);
    const res = await ctx.http.post('/api/auth/sign-in').set('Origin', 'https://elsewhere.example').send({ email: p.email, password: p.password });
    expect(res.status).toBe(403);
    expect(res.headers['set-cookie']).toBeUndefined();
  });
});

describe('signing out everywhere else', () => {
  it('ends every other session of the account, keeps this one, and leaves other people alone', async () => {
    const p = await signUpVia(ctx);
    const laptop = await signInVia(ctx, p.email, p.password);
    const benchTablet = await signInVia(ctx, p.email, p.password);
    const someoneElse = await signUpVia(ctx);
    const r = await ctx.http.post('/api/auth/sign-out-others').set(bearer(laptop.token));
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ended: 2 }); // the sign-up's session and the tablet's
    expect((await ctx.http.get('/api/me').set(bearer(laptop.token))).status).toBe(200);
    expect((await ctx.http.get('/api/me').set(bearer(benchTablet.token))).status).toBe(401);
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(401);
    expect((await ctx.http.get('/api/me').set(bearer(someoneElse.token))).status).toBe(200);
    // Again: nothing left to end.
    expect((await ctx.http.post('/api/auth/sign-out-others').set(bearer(laptop.token))).body).toEqual({ ended: 0 });
  });

  it('from the web app it needs the CSRF header like every other change', async () => {
    const p = await signUpVia(ctx);
    const refused = await ctx.http.post('/api/auth/sign-out-others').set('Cookie', p.cookie);
    expect(refused.status).toBe(403);
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(200);
    expect((await ctx.http.post('/api/auth/sign-out-others').set('Cookie', p.cookie).set(CSRF)).status).toBe(200);
  });
});

describe('changing the password', () => {
  it('needs the current password, keeps this session and ends all the others', async () => {
    const p = await signUpVia(ctx);
    const other = await signInVia(ctx, p.email, p.password);
    const wrong = await ctx.http.post('/api/auth/password').set(bearer(p.token)).send({ currentPassword: 'not-my-password', newPassword: 'jack-plane-sole-55' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBe('That is not your current password');
    expect((await ctx.http.get('/api/me').set(bearer(other.token))).status).toBe(200); // nothing revoked yet

    const ok = await ctx.http.post('/api/auth/password').set(bearer(p.token)).send({ currentPassword: p.password, newPassword: 'jack-plane-sole-55' });
    expect(ok.status).toBe(204);
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(200);
    expect((await ctx.http.get('/api/me').set(bearer(other.token))).status).toBe(401);
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: p.password })).status).toBe(401);
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: 'jack-plane-sole-55' })).status).toBe(200);
  });

  it('refuses a short new password, the same password and unknown fields, changing nothing', async () => {
    const p = await signUpVia(ctx);
    const hashBefore = (await ctx.db.selectFrom('users').select('password_hash').where('id', '=', p.id).executeTakeFirstOrThrow()).password_hash;
    const cases: [unknown, string, RegExp][] = [
      [{ currentPassword: p.password, newPassword: 'short' }, 'newPassword', /at least 10/],
      [{ currentPassword: p.password, newPassword: p.password }, 'newPassword', /differ/],
      [{ currentPassword: p.password, newPassword: 'jack-plane-sole-55', force: true }, '_', /Unknown field: force/],
    ];
    for (const [body, field, message] of cases) {
      const r = await ctx.http.post('/api/auth/password').set(bearer(p.token)).send(body as object);
      expect(r.status).toBe(400);
      expect(r.body.error.fields[field]).toMatch(message);
    }
    const hashAfter = (await ctx.db.selectFrom('users').select('password_hash').where('id', '=', p.id).executeTakeFirstOrThrow()).password_hash;
    expect(hashAfter).toBe(hashBefore);
  });
});

describe('password reset by e-mail', () => {
  const tokenFromMail = (link: string) => {
    const m = /\/reset\/([A-Za-z0-9_-]{43})$/.exec(link);
    if (!m) throw new Error(`unexpected reset link ${link}`);
    return m[1];
  };

  it('mails a single-use link; the new password works, old sessions end, the link cannot be reused', async () => {
    const p = await signUpVia(ctx);
    const other = await signInVia(ctx, p.email, p.password);
    const sent = ctx.mailbox.countFor(p.email);
    const ask = await ctx.http.post('/api/auth/reset-request').send({ email: p.email.toUpperCase() });
    expect(ask.status).toBe(202);
    const mail = await ctx.mailbox.latestFor(p.email, { after: sent });
    expect(mail.subject).toBe('Choose a new Jigwright password');
    const link = firstLink(mail);
    expect(link.startsWith(`${ctx.config.publicUrl}/reset/`)).toBe(true);
    const token = tokenFromMail(link);
    // Only a hash is stored (OWASP Forgot Password Cheat Sheet: store tokens hashed).
    const stored = await ctx.db.selectFrom('password_resets').select('token_hash').where('user_id', '=', p.id).execute();
    expect(stored).toHaveLength(1);
    expect(stored[0].token_hash).not.toContain(token);

    const reset = await ctx.http.post('/api/auth/reset').send({ token, password: 'new-bench-password-1' });
    expect(reset.status).toBe(200);
    expect(reset.body.message).toMatch(/Sign in with the new one/);
    for (const t of [p.token, other.token]) expect((await ctx.http.get('/api/me').set(bearer(t))).status).toBe(401);
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: p.password })).status).toBe(401);
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: 'new-bench-password-1' })).status).toBe(200);

    const before = await accountCounts(ctx.db);
    const reuse = await ctx.http.post('/api/auth/reset').send({ token, password: 'third-password-999' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error).toMatchObject({ code: 'reset_used', message: 'This reset link has already been used; ask for a new one' });
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: 'new-bench-password-1' })).status).toBe(200);
    const after = await accountCounts(ctx.db);
    expect(after.password_resets).toBe(before.password_resets);
  });

  it('answers an unknown address exactly as a known one, and sends and stores nothing', async () => {
    const nobody = uniqueEmail('nobody');
    const known = await signUpVia(ctx);
    const before = await accountCounts(ctx.db);
    const a = await ctx.http.post('/api/auth/reset-request').send({ email: nobody });
    const b = await ctx.http.post('/api/auth/reset-request').send({ email: known.email });
    expect(a.status).toBe(b.status);
    expect(a.body).toEqual(b.body);
    await ctx.mailbox.latestFor(known.email); // the known one's mail arrives…
    expect(ctx.mailbox.countFor(nobody)).toBe(0); // …and none for the unknown address
    const after = await accountCounts(ctx.db);
    expect(after.password_resets).toBe(before.password_resets + 1);
  });

  it('refuses an expired link and keeps the old password', async () => {
    const p = await signUpVia(ctx);
    const sent = ctx.mailbox.countFor(p.email);
    await ctx.http.post('/api/auth/reset-request').send({ email: p.email });
    const token = tokenFromMail(firstLink(await ctx.mailbox.latestFor(p.email, { after: sent })));
    await ctx.db.updateTable('password_resets').set({ expires_at: new Date(Date.now() - 60_000) }).where('user_id', '=', p.id).execute();
    const r = await ctx.http.post('/api/auth/reset').send({ token, password: 'new-bench-password-1' });
    expect(r.status).toBe(400);
    expect(r.body.error).toMatchObject({ code: 'reset_expired', message: 'This reset link has expired; ask for a new one' });
    expect((await ctx.http.get('/api/me').set(bearer(p.token))).status).toBe(200); // sessions untouched
    expect((await ctx.http.post('/api/auth/sign-in').send({ email: p.email, password: p.password })).status).toBe(200);
    const row = await ctx.db.selectFrom('password_resets').select('used_at').where('user_id', '=', p.id).executeTakeFirstOrThrow();
    expect(row.used_at).toBeNull();
  });

  it('refuses unknown and malformed tokens, short passwords and unknown fields with clear 400s', async () => {
    const before = await accountCounts(ctx.db);
    const unknown = await ctx.http.post('/api/auth/reset').send({ token: 'A'.repeat(43), password: 'new-bench-password-1' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toBe('This reset link is not valid; ask for a new one');
    const cut = await ctx.http.post('/api/auth/reset').send({ token: 'abc', password: 'new-bench-password-1' });
    expect(cut.status).toBe(400);
    expect(cut.body.error.fields.token).toMatch(/not complete/);
    const short = await ctx.http.post('/api/auth/reset').send({ token: 'A'.repeat(43), password: 'short' });
    expect(short.body.error.fields.password).toMatch(/at least 10/);
    const extra = await ctx.http.post('/api/auth/reset-request').send({ email: 'x@y.example', shop: 'z' });
    expect(extra.status).toBe(400);
    expect(extra.body.error.message).toMatch(/Unknown field: shop/);
    const badEmail = await ctx.http.post('/api/auth/reset-request').send({ email: 'nope' });
    expect(badEmail.status).toBe(400);
    expect(await accountCounts(ctx.db)).toEqual(before);
  });
});

describe('rate limits', () => {
  it('answers 429 with a clear message after repeated failed sign-ins for one address', async () => {
    const limited = await createTestContext({ RATE_LIMIT_DISABLED: 'false' });
    try {
      const p = await insertPerson(limited.db);
      const statuses: number[] = [];
      for (let i = 0; i < 11; i++) statuses.push((await limited.http.post('/api/auth/sign-in').send({ email: p.email, password: 'guess-number-' + i })).status);
      expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
      expect(statuses[10]).toBe(429);
      const r = await limited.http.post('/api/auth/sign-in').send({ email: p.email, password: p.password });
      expect(r.status).toBe(429);
      expect(r.body.error.message).toMatch(/Too many failed sign-ins for this address/);
      // A different address from the same place is not locked out by that one.
      const q = await insertPerson(limited.db);
      expect((await limited.http.post('/api/auth/sign-in').send({ email: q.email, password: q.password })).status).toBe(200);
    } finally {
      await limited.close();
    }
  });

  it('counts in the database: a second API process on the same database sees the same count, and a restart keeps it', async () => {
    const limited = await createTestContext({ RATE_LIMIT_DISABLED: 'false' });
    try {
      const { createApp } = await import('../../server/app');
      const supertest = (await import('supertest')).default;
      // Two processes behind one load balancer: two apps, one database.
      const other = supertest(createApp(limited.deps).app);
      const p = await insertPerson(limited.db);
      const statuses: number[] = [];
      for (let i = 0; i < 10; i++) statuses.push((await (i % 2 ? other : limited.http).post('/api/auth/sign-in').send({ email: p.email, password: 'guess-number-' + i })).status);
      expect(statuses.every((s) => s === 401)).toBe(true);
      // The eleventh try goes to a third, freshly started app: still counted.
      const restarted = supertest(createApp(limited.deps).app);
      const r = await restarted.post('/api/auth/sign-in').send({ email: p.email, password: p.password });
      expect(r.status).toBe(429);
      expect(r.headers['ratelimit-policy'] ?? r.headers['ratelimit']).toBeTruthy();
      // The window ends: the count starts again, and a right password signs in.
      await limited.db.updateTable('rate_limits').set({ reset_at: new Date(Date.now() - 1000) }).execute();
      expect((await other.post('/api/auth/sign-in').send({ email: p.email, password: p.password })).status).toBe(200);
      // Successful sign-ins are not counted (skipSuccessfulRequests): the new window's hit is taken back
      // once the answer has gone, so it reaches 0 a moment after.
      const hits = async () => (await limited.db.selectFrom('rate_limits').select('hits').where('key', 'like', 'sign-in-per-account:%').execute()).map((x) => x.hits);
      await expect.poll(hits).toEqual([0]);
    } finally {
      await limited.close();
    }
  });

  it('ten sign-in failures at the same moment are all counted, none lost', async () => {
    const limited = await createTestContext({ RATE_LIMIT_DISABLED: 'false' });
    try {
      const p = await insertPerson(limited.db);
      const statuses = await Promise.all(Array.from({ length: 10 }, (_, i) => limited.http.post('/api/auth/sign-in').send({ email: p.email, password: 'guess-number-' + i }).then((r) => r.status)));
      expect(statuses.every((s) => s === 401)).toBe(true);
      const row = await limited.db.selectFrom('rate_limits').select('hits').where('key', 'like', 'sign-in-per-account:%').executeTakeFirstOrThrow();
      expect(row.hits).toBe(10);
      expect((await limited.http.post('/api/auth/sign-in').send({ email: p.email, password: p.password })).status).toBe(429);
    } finally {
      await limited.close();
    }
  });

  it('limits reset requests and sign-ups per network', async () => {
    const limited = await createTestContext({ RATE_LIMIT_DISABLED: 'false' });
    try {
      const resets: number[] = [];
      for (let i = 0; i < 6; i++) resets.push((await limited.http.post('/api/auth/reset-request').send({ email: uniqueEmail() })).status);
      expect(resets).toEqual([202, 202, 202, 202, 202, 429]);
      const signUps: number[] = [];
      for (let i = 0; i < 11; i++) {
        signUps.push((await limited.http.post('/api/auth/sign-up').send({ email: uniqueEmail(), password: 'dovetail-saw-1234', name: 'Ash Pell' })).status);
      }
      expect(signUps.slice(0, 10).every((s) => s === 201)).toBe(true);
      expect(signUps[10]).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

// Security checks: the Content-Security-Policy and companion headers (W3C Content Security Policy
// Level 3; OWASP Content Security Policy Cheat Sheet and OWASP HTTP Headers Cheat Sheet), session
// tokens refused once signed out, after a password change or reset, or expired (OWASP Session
// Management Cheat Sheet), presigned download links short-lived and refused after expiry (AWS
// Signature Version 4 query authentication: X-Amz-Expires, from memory), per-route body limits
// answered with 413 (RFC 9110 §15.5.14 Content Too Large), and no stack trace in any answer
// (OWASP Error Handling Cheat Sheet).
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { seedDemo } from '../../db/seed';
import { hashLinkToken, newLinkToken } from '../../server/auth/secrets';
import { createTestContext, type TestContext } from '../support/context';
import { dxfFile, rectLines } from '../support/dxf';
import { errorAnswerProblems, STACK_TRACE } from '../support/ledger';

let ctx: TestContext;
let seed: Awaited<ReturnType<typeof seedDemo>>;
let webDist: string;
let revisionId: string;
const tally = { tried: 0, failures: 0 };
const signIn = async (email: string, password: string, c = ctx) => {
  const r = await c.http.post('/api/auth/sign-in').send({ email, password });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body.token as string;
};
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });
const me = (t: string) => ctx.http.get('/api/me').set(bearer(t));

/** Directives of a CSP header value, by name. */
function directives(csp: string): Record<string, string[]> {
  return Object.fromEntries(csp.split(';').map((d) => d.trim().split(/\s+/)).filter((d) => d[0]).map(([name, ...values]) => [name.toLowerCase(), values]));
}

beforeAll(async () => {
  // A stand-in web export, so the static handler and the SPA fallback answer in this suite too.
  webDist = fs.mkdtempSync(path.join(os.tmpdir(), 'jw-dist-'));
  fs.writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><html><head><title>Jigwright</title></head><body><div id="root"></div><script src="/app.js" defer></script></body></html>');
  fs.writeFileSync(path.join(webDist, 'app.js'), 'document.title = "Jigwright";');
  ctx = await createTestContext({ WEB_DIST: webDist });
  seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  const editor = await signIn('editor@larchmere.example', 'larchmere-editor');
  const d = await ctx.http.post(`/api/shops/${seed.shopId}/designs`).set(bearer(editor)).send({ kind: 'template', title: 'Link test' });
  const up = await ctx.http.post(`/api/designs/${d.body.id}/revisions/upload`).set(bearer(editor)).field('message', 'r1').attach('file', Buffer.from(dxfFile(rectLines(50, 40))), 'p.dxf');
  expect(up.status).toBe(201);
  revisionId = up.body.id;
}, 60_000);
beforeEach((t) => {
  tally.tried++;
  t.onTestFailed(() => {
    tally.failures++;
  });
});
afterAll(async () => {
  console.log(`[hostile-security] cases tried: ${tally.tried}, failures: ${tally.failures}, orphans found: n/a (no object is written by these cases)`);
  await ctx?.close();
  fs.rmSync(webDist, { recursive: true, force: true });
});

describe('Content-Security-Policy and companion headers', () => {
  for (const [label, url] of [['the web app', '/'], ['a deep link (SPA fallback)', '/designs/abc'], ['an API answer', '/api/health'], ['an API error', '/api/nothing-here']] as const) {
    it(`${label} carries a strict policy`, async () => {
      const r = await ctx.http.get(url);
      const csp = String(r.headers['content-security-policy'] ?? '');
      const d = directives(csp);
      // OWASP CSP Cheat Sheet: no inline script, no eval, nothing from other origins; no plugins; no framing.
      expect(d['default-src']).toEqual(["'self'"]);
      expect(d['script-src']).toEqual(["'self'"]);
      for (const v of Object.values(d).flat()) expect(["'unsafe-eval'", '*', 'http:', 'https:']).not.toContain(v);
      expect(d['script-src']).not.toContain("'unsafe-inline'");
      expect(d['object-src']).toEqual(["'none'"]);
      expect(d['frame-ancestors']).toEqual(["'none'"]);
      expect(d['base-uri']).toEqual(["'self'"]);
      expect(d['form-action']).toEqual(["'self'"]);
      expect(r.headers['x-content-type-options']).toBe('nosniff');
      expect(r.headers['x-powered-by']).toBeUndefined();
    });
  }

  it('served files are sandboxed: a stored SVG preview cannot run script even when opened directly', async () => {
    const t = await signIn('viewer@larchmere.example', 'larchmere-viewer');
    for (const p of ['preview.svg', 'download?format=svg']) {
      const r = await ctx.http.get(`/api/revisions/${revisionId}/${p}`).set(bearer(t));
      expect(r.status).toBe(200);
      const d = directives(String(r.headers['content-security-policy']));
      expect(d['default-src']).toEqual(["'none'"]);
      expect(d).toHaveProperty('sandbox');
    }
  });
});

describe('session tokens', () => {
  it('a signed-out token is refused, over Bearer and over the cookie', async () => {
    const r = await ctx.http.post('/api/auth/sign-in').send({ email: 'viewer@larchmere.example', password: 'larchmere-viewer' });
    const token = r.body.token as string;
    const cookie = String(r.headers['set-cookie']).split(';')[0];
    expect((await me(token)).status).toBe(200);
    expect((await ctx.http.get('/api/me').set('Cookie', cookie)).status).toBe(200);
    expect((await ctx.http.post('/api/auth/sign-out').set(bearer(token))).status).toBe(204);
    for (const res of [await me(token), await ctx.http.get('/api/me').set('Cookie', cookie)]) {
      expect(errorAnswerProblems(res, 401)).toEqual([]);
    }
  });

  it('changing the password keeps this session and ends every other one', async () => {
    const email = 'editor@larchmere.example';
    const a = await signIn(email, 'larchmere-editor');
    const b = await signIn(email, 'larchmere-editor');
    const ch = await ctx.http.post('/api/auth/password').set(bearer(a)).send({ currentPassword: 'larchmere-editor', newPassword: 'a-much-newer-password-1' });
    expect(ch.status, JSON.stringify(ch.body)).toBe(204);
    expect((await me(a)).status).toBe(200);
    expect(errorAnswerProblems(await me(b), 401)).toEqual([]);
    expect((await ctx.http.post('/api/auth/sign-in').send({ email, password: 'larchmere-editor' })).status).toBe(401);
    // and back, for the other tests
    expect((await ctx.http.post('/api/auth/password').set(bearer(a)).send({ currentPassword: 'a-much-newer-password-1', newPassword: 'larchmere-editor' })).status).toBe(204);
  });

  it('a password reset ends every session', async () => {
    const a = await signIn('viewer@larchmere.example', 'larchmere-viewer');
    const token = newLinkToken();
    await ctx.db.insertInto('password_resets').values({ user_id: seed.users['viewer@larchmere.example'], token_hash: hashLinkToken(token), expires_at: new Date(Date.now() + 3600_000) }).execute();
    expect((await ctx.http.post('/api/auth/reset').send({ token, password: 'larchmere-viewer' })).status).toBe(200);
    expect(errorAnswerProblems(await me(a), 401)).toEqual([]);
  });

  it('an expired session is refused even with a valid signature', async () => {
    const a = await signIn('owner@larchmere.example', 'larchmere-owner');
    await ctx.db.updateTable('sessions').set({ expires_at: new Date(Date.now() - 1000) }).where('user_id', '=', seed.users['owner@larchmere.example']).execute();
    expect(errorAnswerProblems(await me(a), 401)).toEqual([]);
  });
});

describe('presigned download links', () => {
  it('the API hands out links that live at most five minutes and give the same bytes', async () => {
    const t = await signIn('viewer@larchmere.example', 'larchmere-viewer');
    const r = await ctx.http.get(`/api/revisions/${revisionId}/download?format=dxf&link=1`).set(bearer(t));
    expect(r.status).toBe(200);
    expect(r.body.expiresInSeconds).toBeLessThanOrEqual(300);
    const url = new URL(r.body.url);
    expect(Number(url.searchParams.get('X-Amz-Expires'))).toBeLessThanOrEqual(300);
    expect(url.hostname).toBe('127.0.0.1');
    const viaLink = Buffer.from(await (await fetch(url)).arrayBuffer());
    const direct = await ctx.http.get(`/api/revisions/${revisionId}/download?format=dxf`).set(bearer(t)).buffer(true).parse((res, cb) => {
      const c: Buffer[] = [];
      res.on('data', (x: Buffer) => c.push(x));
      res.on('end', () => cb(null, Buffer.concat(c)));
    });
    expect(createHash('sha256').update(viaLink).digest('hex')).toBe(createHash('sha256').update(direct.body as Buffer).digest('hex'));
  });

  it('a link is refused once it has expired, and when its signature is altered', async () => {
    const key = (await ctx.db.selectFrom('revision_files').select('object_key').where('revision_id', '=', revisionId).where('role', '=', 'dxf').executeTakeFirstOrThrow()).object_key;
    const url = await ctx.deps.objects.presignGet(key, 1, 'part.dxf', 'application/dxf');
    expect((await fetch(url)).status).toBe(200);
    const forged = new URL(url);
    const sig = forged.searchParams.get('X-Amz-Signature')!;
    forged.searchParams.set('X-Amz-Signature', (sig[0] === 'a' ? 'b' : 'a') + sig.slice(1));
    expect((await fetch(forged)).status).toBe(403);
    await new Promise((r) => setTimeout(r, 2200));
    const late = await fetch(url);
    expect(late.status).toBe(403);
    expect(await late.text()).toMatch(/expired/i);
  });
});

describe('per-route body limits', () => {
  let small: TestContext;
  let token: string;
  let designId: string;
  beforeAll(async () => {
    small = await createTestContext({ UPLOAD_MAX_BYTES: String(64 * 1024), ARCHIVE_MAX_BYTES: String(64 * 1024) });
    const s = await seedDemo(small.db, { bcryptCost: 4 });
    token = await signIn('owner@larchmere.example', 'larchmere-owner', small);
    designId = (await small.http.post(`/api/shops/${s.shopId}/designs`).set(bearer(token)).send({ kind: 'jig', title: 'Limits' })).body.id;
  });
  afterAll(async () => small?.close());

  it('JSON bodies: 256 KiB; a body just under is read (and judged on its fields), one over is 413', async () => {
    const under = await small.http.post(`/api/shops/${(await small.db.selectFrom('shops').select('id').executeTakeFirstOrThrow()).id}/devices`).set(bearer(token)).send({ name: 'x', padding: 'y'.repeat(250 * 1024) });
    expect(under.status).toBe(400);
    expect(under.body.error.code).toBe('invalid_input');
    const over = await small.http.post('/api/auth/sign-in').send({ email: 'a@b.example', password: 'y'.repeat(257 * 1024) });
    expect(errorAnswerProblems(over, 413)).toEqual([]);
    expect(over.body.error.code).toBe('too_large');
  });

  it('uploads: the configured limit (UPLOAD_MAX_BYTES); one byte over is 413', async () => {
    const at = await small.http.post(`/api/designs/${designId}/uploads/inspect`).set(bearer(token)).attach('file', Buffer.alloc(64 * 1024, 0x20), 'a.dxf');
    expect(at.status).toBe(400); // within the limit: read, and refused as empty
    const over = await small.http.post(`/api/designs/${designId}/uploads/inspect`).set(bearer(token)).attach('file', Buffer.alloc(64 * 1024 + 1, 0x20), 'a.dxf');
    expect(errorAnswerProblems(over, 413)).toEqual([]);
    expect(over.body.error.code).toBe('file_too_large');
  });

  it('archives: the configured limit (ARCHIVE_MAX_BYTES); over is 413', async () => {
    const shopId = (await small.db.selectFrom('shops').select('id').where('slug', '=', 'larchmere').executeTakeFirstOrThrow()).id;
    const over = await small.http.post(`/api/shops/${shopId}/archive`).set(bearer(token)).attach('archive', Buffer.alloc(64 * 1024 + 1, 1), 'a.tar.gz');
    expect(errorAnswerProblems(over, 413)).toEqual([]);
  });
});

describe('no stack traces', () => {
  it('an unexpected failure answers 500 with a plain message and nothing of the code', async () => {
    const t = await signIn('viewer@larchmere.example', 'larchmere-viewer');
    const objects = ctx.deps.objects;
    const real = objects.get.bind(objects);
    objects.get = async () => {
      throw new Error(`boom in ${path.join(process.cwd(), 'server/revisions/routes.ts')}:120:7`);
    };
    try {
      const r = await ctx.http.get(`/api/revisions/${revisionId}/preview.svg`).set(bearer(t));
      expect(r.status).toBe(500);
      expect(r.body.error).toEqual({ code: 'internal', message: 'Something went wrong on our side' });
      expect(r.text).not.toMatch(STACK_TRACE);
      expect(r.text).not.toMatch(/boom/);
    } finally {
      objects.get = real;
    }
  });

  it('malformed requests outside the API routes answer without internals too', async () => {
    for (const url of ['/%E0%A4%A', '/api/%E0%A4%A', '/api/designs/%ZZ', '/..%2f..%2fetc%2fpasswd']) {
      const r = await ctx.http.get(url);
      expect(r.status, url).toBeLessThan(500);
      expect(r.text, url).not.toMatch(STACK_TRACE);
    }
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../support/context';

describe('GET /api/health', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => ctx?.close());

  it('reports db, objects and mail up', async () => {
    const res = await ctx.http.get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: true, objects: true, mail: true });
  });

  it('sets security headers', async () => {
    const res = await ctx.http.get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('answers unknown API routes with a JSON 404', async () => {
    const res = await ctx.http.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(res.body.error.message).toMatch(/No API route/);
  });

  it('answers malformed JSON with a clear 400 and no stack trace', async () => {
    const res = await ctx.http.post('/api/health').set('Content-Type', 'application/json').send('{"oops":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
  });
});

describe('health when services are down', () => {
  it('answers 503 naming the object store and mail when they cannot be reached', async () => {
    const ctx = await createTestContext();
    try {
      // Point a second app at closed ports for objects and mail; the database stays up.
      const down = await createTestContext({ S3_PORT: '1', SMTP_URL: 'smtp://127.0.0.1:1' }).catch(() => null);
      expect(down).toBeNull(); // the bucket cannot even be created: startup refuses, as it should
      const { ObjectStore } = await import('../../files/objectStore');
      const { createMailer } = await import('../../server/mail/mailer');
      const { createApp } = await import('../../server/app');
      const supertest = (await import('supertest')).default;
      const deps = { ...ctx.deps, objects: new ObjectStore({ ...ctx.config.objects, port: 1 }), mailer: createMailer('smtp://127.0.0.1:1', 'x@y.invalid') };
      const res = await supertest(createApp(deps).app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toMatchObject({ ok: false, db: true, objects: false, mail: false, down: ['objects', 'mail'] });
    } finally {
      await ctx.close();
    }
  });
});

describe('request log', () => {
  it('writes method, path and status, and never the session cookie or token', async () => {
    const ctx = await createTestContext();
    try {
      const pino = (await import('pino')).default;
      const { createApp } = await import('../../server/app');
      const supertest = (await import('supertest')).default;
      const lines: string[] = [];
      const log = pino({ level: 'info' }, { write: (s: string) => lines.push(s) });
      const app = createApp({ ...ctx.deps, log }).app;
      await supertest(app).get('/api/no-such-thing?x=1').set('Cookie', 'jw_session=secret-cookie-value').set('Authorization', 'Bearer secret-token-value');
      const text = lines.join('');
      expect(text).toContain('"url":"/api/no-such-thing"');
      expect(text).toContain('"statusCode":404');
      expect(text).not.toContain('secret-cookie-value');
      expect(text).not.toContain('secret-token-value');
    } finally {
      await ctx.close();
    }
  });
});

describe('a service that does not answer in time', () => {
  it('is named "slow", apart from one that refuses ("down"), and the answer comes at the limit', async () => {
    const { checkServices } = await import('../../server/health/routes');
    const ctx = await createTestContext();
    try {
      const objects = Object.create(ctx.deps.objects) as typeof ctx.deps.objects;
      objects.check = () => new Promise((r) => setTimeout(() => r(true), 2000));
      const mailer = { ...ctx.deps.mailer, check: async () => false };
      const started = Date.now();
      const h = await checkServices({ db: ctx.db, objects, mailer }, 200);
      expect(Date.now() - started).toBeLessThan(1500);
      expect(h).toEqual({ ok: false, db: true, objects: false, mail: false, down: ['mail'], slow: ['objects'], limitMs: 200 });
      // Given time, the same slow store is up.
      expect(await checkServices({ db: ctx.db, objects, mailer: ctx.deps.mailer }, 3000)).toEqual({ ok: true, db: true, objects: true, mail: true });
    } finally {
      await ctx.close();
    }
  });
});

// A fresh database (cloned from the migrated template), its own bucket and the shared mail fake,
// wired into the real Express app: what each API test file works against.
import { randomUUID } from 'node:crypto';
import os from 'node:os';
import pg from 'pg';
import pino from 'pino';
import supertest from 'supertest';
import { createDb, type DB } from '../../db/connect';
import { ObjectStore } from '../../files/objectStore';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import type { Deps } from '../../server/deps';
import { createMailer } from '../../server/mail/mailer';
import { Mailbox } from './mailbox';

export interface TestContext {
  db: DB;
  deps: Deps;
  config: Config;
  app: ReturnType<typeof createApp>['app'];
  api: ReturnType<typeof createApp>['api'];
  http: ReturnType<typeof supertest>;
  mailbox: Mailbox;
  dbName: string;
  close(): Promise<void>;
}

function need(name: string): string {
  const v = process.env[name];
  if (!v) throw new Error(`${name} is not set: run tests through vitest with tests/support/globalSetup.ts`);
  return v;
}

/** Environment for the app against given services; mail goes to the shared fake. */
export function appEnv(v: { databaseUrl: string; s3Port: number | string; bucket: string }, extra: Record<string, string> = {}): Record<string, string> {
  return {
    DATABASE_URL: v.databaseUrl,
    S3_ENDPOINT: '127.0.0.1',
    S3_PORT: String(v.s3Port),
    S3_BUCKET: v.bucket,
    SMTP_URL: `smtp://127.0.0.1:${process.env.JW_TEST_SMTP_PORT ?? '1'}`,
    SESSION_SECRET: 'test-secret-that-is-long-enough-0123456789',
    BCRYPT_COST: '4',
    LOG_LEVEL: 'silent',
    RATE_LIMIT_DISABLED: 'true',
    PUBLIC_URL: 'http://127.0.0.1:1',
    WEB_DIST: '/nonexistent',
    ...extra,
  };
}

/** The real app in this process against the services `env` names; `afterClose` runs once it is closed. */
export async function contextOn(env: Record<string, string>, afterClose: () => Promise<void> = async () => undefined): Promise<TestContext> {
  const config = loadConfig(env);
  const db = createDb(config.databaseUrl, { max: config.databasePoolMax });
  const objects = new ObjectStore(config.objects);
  await objects.ensureBucket();
  const mailer = createMailer(config.smtpUrl, config.mailFrom);
  const deps: Deps = { config, db, objects, mailer, log: pino({ level: 'silent' }) };
  const { app, api } = createApp(deps);
  return {
    db,
    deps,
    config,
    app,
    api,
    http: supertest(app),
    mailbox: new Mailbox(process.env.JW_TEST_MAIL_DIR ?? os.tmpdir()),
    dbName: new URL(config.databaseUrl).pathname.slice(1),
    async close() {
      mailer.close();
      await db.destroy();
      await afterClose();
    },
  };
}

export async function createTestContext(envOverrides: Record<string, string> = {}): Promise<TestContext> {
  const adminUrl = need('JW_TEST_ADMIN_URL');
  need('JW_TEST_MAIL_DIR');
  const dbName = `t_${randomUUID().replace(/-/g, '').slice(0, 20)}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${dbName} TEMPLATE jw_template`);
  await admin.end();
  const u = new URL(adminUrl);
  u.pathname = `/${dbName}`;
  const env = appEnv({ databaseUrl: u.toString(), s3Port: need('JW_TEST_S3_PORT'), bucket: dbName.replace(/_/g, '-') }, { SMTP_URL: `smtp://127.0.0.1:${need('JW_TEST_SMTP_PORT')}`, ...envOverrides });
  return contextOn(env, async () => {
    const a = new pg.Client({ connectionString: adminUrl });
    await a.connect();
    await a.query(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
    await a.end();
  });
}

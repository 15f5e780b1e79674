// Starts the services a test run needs: a private PostgreSQL cluster (fsync off), the object-store
// fake and the mail fake, each on a free loopback port, all in one temporary folder.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort, startFake, startPostgres } from '../../scripts/lib/services.mjs';

export interface TestServices {
  adminUrl: string;
  s3Port: number;
  smtpPort: number;
  mailDir: string;
  root: string;
  stop(): Promise<void>;
}

export async function startTestServices(label: string): Promise<TestServices> {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), `jw-${label}-`));
  fs.chmodSync(root, 0o755);
  const pgPort = await freePort();
  const pg = await startPostgres({ dataDir: path.join(root, 'pg'), port: pgPort, fast: true });
  const s3Port = await freePort();
  const objects = await startFake('objects', { port: s3Port, dir: path.join(root, 'objects'), extraEnv: { FAKE_BUCKET: 'jigwright' } });
  const smtpPort = await freePort();
  const mailDir = path.join(root, 'mail');
  const mail = await startFake('mail', { port: smtpPort, dir: mailDir });
  return {
    adminUrl: pg.url,
    s3Port,
    smtpPort,
    mailDir,
    root,
    async stop() {
      await Promise.all([mail.stop(), objects.stop()]);
      await pg.stop();
      fs.rmSync(root, { recursive: true, force: true });
    },
  };
}

/** Environment for a server process (or createApp) pointed at these services. */
export function serviceEnv(s: TestServices, databaseUrl: string, bucket = 'jigwright'): Record<string, string> {
  return {
    DATABASE_URL: databaseUrl,
    S3_ENDPOINT: '127.0.0.1',
    S3_PORT: String(s.s3Port),
    S3_BUCKET: bucket,
    SMTP_URL: `smtp://127.0.0.1:${s.smtpPort}`,
    SESSION_SECRET: 'test-secret-that-is-long-enough-0123456789',
    BCRYPT_COST: '4',
    LOG_LEVEL: 'silent',
  };
}

export function databaseUrl(adminUrl: string, name: string): string {
  const u = new URL(adminUrl);
  u.pathname = `/${name}`;
  return u.toString();
}

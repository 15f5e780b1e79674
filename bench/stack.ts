// The bench's own services, started the way the tests start theirs (tests/support/services.ts):
// a private PostgreSQL cluster, the object-store fake and the mail fake in a temporary folder,
// a fresh `bench` database, and the real server (`tsx server/main.ts`) on a free loopback port.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import pino from 'pino';
import { createDb, type DB } from '../db/connect';
import { migrateToLatest } from '../db/migrate';
import { seedDemo, type SeedResult } from '../db/seed';
import { ObjectStore } from '../files/objectStore';
import { loadConfig } from '../server/config';
import type { Deps } from '../server/deps';
import { createMailer } from '../server/mail/mailer';
import { freePort, repoRoot, stopChild, waitForPort } from '../scripts/lib/services.mjs';
import { databaseUrl, serviceEnv, startTestServices, type TestServices } from '../tests/support/services';

export interface BenchStack {
  services: TestServices;
  url: string;
  db: DB;
  seed: SeedResult;
  env: Record<string, string>;
  /** A Deps like the server's, for in-process baselines. */
  deps(): Deps;
  startServer(): Promise<{ baseUrl: string; child: ChildProcess }>;
  stop(): Promise<void>;
}

export async function startBenchStack(): Promise<BenchStack> {
  const services = await startTestServices('bench');
  const stops: (() => Promise<void>)[] = [() => services.stop()];
  const stop = async () => {
    while (stops.length) {
      const s = stops.pop()!;
      await s().catch((e) => console.error(`[bench] stopping: ${(e as Error).message}`));
    }
  };
  try {
    const admin = new pg.Client({ connectionString: services.adminUrl });
    await admin.connect();
    await admin.query('CREATE DATABASE bench');
    await admin.end();
    const url = databaseUrl(services.adminUrl, 'bench');
    const db = createDb(url);
    stops.push(() => db.destroy());
    await migrateToLatest(db);
    const seed = await seedDemo(db, { bcryptCost: 4 });
    const env = { ...serviceEnv(services, url), RATE_LIMIT_DISABLED: 'true', LOG_LEVEL: 'silent', BCRYPT_COST: '4' };
    let deps: Deps | undefined;
    return {
      services,
      url,
      db,
      seed,
      env,
      deps() {
        if (deps) return deps;
        const config = loadConfig({ ...env, WEB_DIST: '/nonexistent' });
        const ddb = createDb(config.databaseUrl, { max: config.databasePoolMax });
        const mailer = createMailer(config.smtpUrl, config.mailFrom);
        stops.push(async () => {
          mailer.close();
          await ddb.destroy();
        });
        deps = { config, db: ddb, objects: new ObjectStore(config.objects), mailer, log: pino({ level: 'silent' }) };
        return deps;
      },
      async startServer() {
        const port = await freePort();
        const childEnv = { ...process.env, ...env, PORT: String(port), HOST: '127.0.0.1', WEB_DIST: path.join(repoRoot, 'dist'), PUBLIC_URL: `http://127.0.0.1:${port}` };
        const child = spawn(path.join(repoRoot, 'node_modules', '.bin', 'tsx'), ['server/main.ts'], { cwd: repoRoot, env: childEnv, stdio: ['ignore', 'inherit', 'inherit'] });
        stops.push(() => stopChild(child));
        await waitForPort(port, 60_000);
        return { baseUrl: `http://127.0.0.1:${port}`, child };
      },
      stop,
    };
  } catch (e) {
    await stop();
    throw e;
  }
}

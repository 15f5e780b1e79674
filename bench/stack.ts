// The bench's own services, started the way the tests start theirs (tests/support/services.ts):
// a private PostgreSQL cluster, the object-store fake and the mail fake in a temporary folder,
// a fresh `bench` database, and the real server (`tsx server/main.ts`) on a free loopback port.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
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

/**
 * Stops the cluster's postmaster by its pid (from postmaster.pid) with SIGINT, PostgreSQL's fast
 * shutdown, and waits for it. Run as root, the helpers start postgres under `runuser`, which does
 * not pass SIGINT on: their stop then waits 10 s and kills runuser, leaving postgres running.
 */
async function stopPostmaster(root: string): Promise<void> {
  const pidFile = path.join(root, 'pg', 'pgdata', 'postmaster.pid');
  if (!fs.existsSync(pidFile)) return;
  const pid = Number(fs.readFileSync(pidFile, 'utf8').split('\n')[0]);
  if (!Number.isInteger(pid) || pid <= 1) return;
  const alive = () => {
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  };
  if (!alive()) return;
  process.kill(pid, 'SIGINT');
  const deadline = Date.now() + 15_000;
  while (alive() && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
}

export async function startBenchStack(): Promise<BenchStack> {
  const services = await startTestServices('bench');
  const stops: (() => Promise<void>)[] = [
    async () => {
      await stopPostmaster(services.root);
      await services.stop();
    },
  ];
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
        const exited = new Promise<never>((_, reject) => child.once('exit', (code) => reject(new Error(`the server exited (code ${code}) before it listened`))));
        exited.catch(() => undefined); // it also exits when stopped at the end
        await Promise.race([waitForPort(port, 60_000), exited]);
        return { baseUrl: `http://127.0.0.1:${port}`, child };
      },
      stop,
    };
  } catch (e) {
    await stop();
    throw e;
  }
}

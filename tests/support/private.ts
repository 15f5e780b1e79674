// Private services for the fault and soak suites: a PostgreSQL cluster, an object-store fake or the
// API as its own process, each on a free loopback port in its own temporary folder, that a test
// may stop, restart or kill without touching the shared ones from globalSetup.
import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { createDb } from '../../db/connect';
import { migrateToLatest } from '../../db/migrate';
import { freePort, repoRoot, startFake, startPostgres, stopChild, waitForPort } from '../../scripts/lib/services.mjs';
import { databaseUrl } from './services';

function tempRoot(label: string): string {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), `jw-${label}-`));
  fs.chmodSync(root, 0o755);
  return root;
}

export interface PrivatePostgres {
  adminUrl: string;
  port: number;
  /** Fast shutdown (SIGINT): open connections are ended by the server. */
  stop(): Promise<void>;
  /** Starts it again on the same port and data. */
  start(): Promise<void>;
  /** Stops it and removes its folder. */
  destroy(): Promise<void>;
}

export async function privatePostgres(label = 'pg'): Promise<PrivatePostgres> {
  const root = tempRoot(label);
  const dataDir = path.join(root, 'pg');
  const port = await freePort();
  let server = await startPostgres({ dataDir, port, fast: true });
  let running = true;
  const stop = async () => {
    if (!running) return;
    running = false;
    await server.stop(); // fast shutdown; resolves once PostgreSQL has exited
  };
  return {
    adminUrl: server.url,
    port,
    stop,
    async start() {
      if (!running) server = await startPostgres({ dataDir, port, fast: true });
      running = true;
    },
    async destroy() {
      await stop().catch(() => undefined);
      fs.rmSync(root, { recursive: true, force: true });
    },
  };
}

export interface PrivateObjects {
  port: number;
  stop(): Promise<void>;
  /** Ends the fake at once (SIGKILL), as a crashed store would. */
  kill(): Promise<void>;
  start(): Promise<void>;
  destroy(): Promise<void>;
}

export async function privateObjects(label = 'objects', bucket = 'jigwright'): Promise<PrivateObjects> {
  const root = tempRoot(label);
  const port = await freePort();
  const launch = () => startFake('objects', { port, dir: path.join(root, 'objects'), extraEnv: { FAKE_BUCKET: bucket } });
  let fake: Awaited<ReturnType<typeof launch>> | null = await launch();
  const exited = (c: ChildProcess) => new Promise<void>((r) => (c.exitCode !== null || c.signalCode !== null ? r() : c.once('exit', () => r())));
  return {
    port,
    async stop() {
      if (fake) await fake.stop();
      fake = null;
    },
    async kill() {
      if (!fake) return;
      const child = fake.child;
      child.kill('SIGKILL');
      await exited(child);
      fake = null;
    },
    async start() {
      if (!fake) fake = await launch();
    },
    async destroy() {
      if (fake) await fake.stop();
      fake = null;
      fs.rmSync(root, { recursive: true, force: true });
    },
  };
}

/** Creates a database on a cluster and migrates it. */
export async function migratedDatabase(adminUrl: string, name: string): Promise<string> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.end();
  const url = databaseUrl(adminUrl, name);
  const db = createDb(url);
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
  return url;
}

export { appEnv, contextOn } from './context';

export interface ServerProcess {
  pid: number;
  port: number;
  url: string;
  child: ChildProcess;
  /** Resident set size of the server process, in kB (VmRSS in /proc/<pid>/status). */
  rssKb(): number;
  kill(signal: NodeJS.Signals): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Starts `server/main.ts` as its own process, one node process with tsx loaded (`node --import
 * tsx`, the same as the `tsx` command without its wrapper process), so its pid is the server's.
 */
export async function startServerProcess(env: Record<string, string>, { port }: { port?: number } = {}): Promise<ServerProcess> {
  const p = port ?? (await freePort());
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: repoRoot,
    env: { ...process.env, ...env, PORT: String(p), HOST: '127.0.0.1', NODE_ENV: 'production' },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (c: Buffer) => (stderr = (stderr + c.toString()).slice(-4000)));
  try {
    await waitForPort(p, 60_000);
  } catch (e) {
    child.kill('SIGKILL');
    throw new Error(`${(e as Error).message}\n${stderr}`);
  }
  const exited = () => new Promise<void>((r) => (child.exitCode !== null || child.signalCode !== null ? r() : child.once('exit', () => r())));
  return {
    pid: child.pid!,
    port: p,
    url: `http://127.0.0.1:${p}`,
    child,
    rssKb() {
      const status = fs.readFileSync(`/proc/${child.pid}/status`, 'utf8');
      return Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1] ?? NaN);
    },
    async kill(signal) {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill(signal);
      await exited();
    },
    async stop() {
      await stopChild(child);
    },
  };
}

export { freePort, repoRoot, tempRoot };

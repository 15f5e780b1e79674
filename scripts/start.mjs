// `npm start`: everything a newcomer needs, on a fresh clone. Data lives under .data/ and is kept
// between runs. Ctrl-C stops every child.
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import { ensureNodeModules, log, repoRoot, startFake, startPostgres, stopChild, waitForPort } from './lib/services.mjs';

const dataDir = path.join(repoRoot, '.data');
const env = { ...process.env };
const children = [];
let stopping = false;

async function stopAll(code = 0) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  for (const c of children.reverse()) await c.stop().catch(() => undefined);
  log('stopped');
  process.exit(code);
}
process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));

try {
  ensureNodeModules();

  if (!env.DATABASE_URL) {
    const pgPort = Number(env.PG_PORT || 54329);
    const pg = await startPostgres({ dataDir: path.join(dataDir, 'pg'), port: pgPort });
    children.push(pg);
    env.DATABASE_URL = `postgres://postgres@127.0.0.1:${pgPort}/jigwright`;
    log(`PostgreSQL on 127.0.0.1:${pgPort}`);
  }
  if (!env.S3_ENDPOINT) {
    env.S3_ENDPOINT = '127.0.0.1';
    env.S3_PORT = env.S3_PORT || '9329';
    children.push(await startFake('objects', { port: Number(env.S3_PORT), dir: path.join(dataDir, 'objects'), extraEnv: { FAKE_BUCKET: env.S3_BUCKET || 'jigwright' } }));
  }
  if (!env.SMTP_URL) {
    const mailPort = Number(env.MAIL_PORT || 2529);
    env.SMTP_URL = `smtp://127.0.0.1:${mailPort}`;
    children.push(await startFake('mail', { port: mailPort, dir: path.join(dataDir, 'mail') }));
  }

  const tsx = path.join(repoRoot, 'node_modules', '.bin', 'tsx');
  const prep = spawnSync(tsx, ['server/cli/prepare.ts'], { cwd: repoRoot, env, stdio: 'inherit' });
  if (prep.status !== 0) throw new Error('database preparation failed');

  const { ensureWebExport } = await import('./lib/web.mjs');
  ensureWebExport();

  const port = Number(env.PORT || 8329);
  env.PORT = String(port);
  const server = spawn(tsx, ['server/main.ts'], { cwd: repoRoot, env, stdio: ['ignore', 'inherit', 'inherit'] });
  children.push({ stop: () => stopChild(server) });
  server.on('exit', (code) => {
    if (!stopping) {
      log(`the API server exited (code ${code})`);
      stopAll(1);
    }
  });
  await waitForPort(port, 60000);

  const url = `http://127.0.0.1:${port}`;
  log('');
  log(`ready: ${url}`);
  log('demo sign-ins (invented shops "Larchmere Workshop" and "Otterbrook Makerspace"):');
  const accounts = JSON.parse(spawnSync(tsx, ['db/cli.ts', 'accounts'], { cwd: repoRoot, env, encoding: 'utf8' }).stdout || '[]');
  for (const a of accounts) log(`  ${a.role.padEnd(7)} ${a.email.padEnd(28)} ${a.password}`);
  log(`captured mail: ${path.join(dataDir, 'mail')} (one .eml file per message)`);
  log('Ctrl-C stops everything; data stays in .data/');
} catch (e) {
  console.error(`[jigwright] ${e.message}`);
  await stopAll(1);
}

// Browser suite: its own services, a fresh database with the invented demo shop seeded, and the
// real server (web export + API on one port), as `npm start` runs it.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { prepare } from '../../server/cli/prepare';
import { freePort, repoRoot, stopChild, waitForPort } from '../../scripts/lib/services.mjs';
import { databaseUrl, serviceEnv, startTestServices } from '../support/services';

export default async function setup() {
  if (!fs.existsSync(path.join(repoRoot, 'dist', 'index.html'))) {
    throw new Error('dist/ has no web export: run `npm test` (it builds one) or `npm run web:export`');
  }
  const services = await startTestServices('web');
  let server: ReturnType<typeof spawn> | undefined;
  try {
    server = await prepareAndServe(services);
  } catch (e) {
    if (server) await stopChild(server);
    await services.stop();
    throw e;
  }
  return async () => {
    await stopChild(server!);
    await services.stop();
  };
}

async function prepareAndServe(services: Awaited<ReturnType<typeof startTestServices>>) {
  const admin = new pg.Client({ connectionString: services.adminUrl });
  await admin.connect();
  await admin.query('CREATE DATABASE e2e');
  await admin.end();
  const url = databaseUrl(services.adminUrl, 'e2e');
  await prepare({ ...serviceEnv(services, url) });

  const port = await freePort();
  const env = { ...process.env, ...serviceEnv(services, url), PORT: String(port), WEB_DIST: path.join(repoRoot, 'dist'), PUBLIC_URL: `http://127.0.0.1:${port}`, RATE_LIMIT_DISABLED: 'true' };
  const server = spawn(path.join(repoRoot, 'node_modules', '.bin', 'tsx'), ['server/main.ts'], { cwd: repoRoot, env, stdio: ['ignore', 'inherit', 'inherit'] });
  try {
    await waitForPort(port, 60000);
  } catch (e) {
    await stopChild(server);
    throw e;
  }
  process.env.E2E_BASE_URL = `http://127.0.0.1:${port}`;
  process.env.E2E_MAIL_DIR = services.mailDir;
  process.env.E2E_DATABASE_URL = url;
  return server;
}

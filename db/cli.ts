// `tsx db/cli.ts migrate`: create the database when missing and migrate it (a release step).
// `tsx db/cli.ts accounts`: the demo sign-ins as JSON. The full demo set-up is server/cli/prepare.ts.
import pg from 'pg';
import { createDb } from './connect';
import { migrateToLatest } from './migrate';
import { DEMO_ACCOUNTS, SECOND_ACCOUNT } from './seed';

export async function ensureDatabase(url: string): Promise<void> {
  const target = new URL(url);
  const name = decodeURIComponent(target.pathname.slice(1));
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const found = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE "${name.replace(/"/g, '""')}"`);
  } finally {
    await client.end();
  }
}

async function main() {
  const cmd = process.argv[2] ?? 'migrate';
  if (cmd === 'accounts') {
    console.log(JSON.stringify([...DEMO_ACCOUNTS, SECOND_ACCOUNT]));
    return;
  }
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set');
  await ensureDatabase(url);
  const db = createDb(url);
  try {
    if (cmd === 'migrate') {
      const ran = await migrateToLatest(db);
      console.log(`[db] migrations: ${ran.length ? ran.join(', ') : 'up to date'}`);
    }
    else throw new Error(`unknown command ${cmd}: use migrate or accounts`);
  } finally {
    await db.destroy();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().catch((e) => {
    console.error(`[db] ${e.message}`);
    process.exit(1);
  });
}

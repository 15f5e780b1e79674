// `tsx server/cli/prepare.ts`: create the database when missing, migrate, seed the invented demo
// shops and their library (through the real save pipeline, so the object store is needed too).
import pino from 'pino';
import { ensureDatabase } from '../../db/cli';
import { createDb } from '../../db/connect';
import { migrateToLatest } from '../../db/migrate';
import { seedDemo } from '../../db/seed';
import { ObjectStore } from '../../files/objectStore';
import { loadConfig } from '../config';
import { seedDemoLibrary } from '../library/demoLibrary';
import { createMailer } from '../mail/mailer';

export async function prepare(env: Record<string, string | undefined> = process.env) {
  const config = loadConfig(env);
  await ensureDatabase(config.databaseUrl);
  const db = createDb(config.databaseUrl);
  const mailer = createMailer(config.smtpUrl, config.mailFrom);
  try {
    const ran = await migrateToLatest(db);
    console.log(`[db] migrations: ${ran.length ? ran.join(', ') : 'up to date'}`);
    const seed = await seedDemo(db, { bcryptCost: config.bcryptCost });
    const objects = new ObjectStore(config.objects);
    await objects.ensureBucket();
    const lib = await seedDemoLibrary({ config, db, objects, mailer, log: pino({ level: 'warn' }) }, seed);
    console.log(`[db] demo shops seeded${lib.created ? ` with ${lib.created} designs` : ''}`);
  } finally {
    mailer.close();
    await db.destroy();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  prepare().catch((e) => {
    console.error(`[prepare] ${e.message}`);
    process.exit(1);
  });
}

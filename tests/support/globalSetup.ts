// vitest global setup for unit and API suites: one private cluster per run with a migrated
// template database; each test context clones it (CREATE DATABASE … TEMPLATE) in well under a second.
import pg from 'pg';
import { createDb } from '../../db/connect';
import { migrateToLatest } from '../../db/migrate';
import { databaseUrl, startTestServices } from './services';

export const TEMPLATE_DB = 'jw_template';

export default async function setup() {
  const services = await startTestServices('api');
  try {
    await prepareTemplate(services.adminUrl);
  } catch (e) {
    await services.stop(); // leave no cluster behind when set-up fails
    throw e;
  }
  process.env.JW_TEST_ADMIN_URL = services.adminUrl;
  process.env.JW_TEST_S3_PORT = String(services.s3Port);
  process.env.JW_TEST_SMTP_PORT = String(services.smtpPort);
  process.env.JW_TEST_MAIL_DIR = services.mailDir;
  return async () => services.stop();
}

async function prepareTemplate(adminUrl: string) {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${TEMPLATE_DB}`);
  await admin.end();
  const db = createDb(databaseUrl(adminUrl, TEMPLATE_DB));
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy(); // no connection may stay open on a template
  }
}

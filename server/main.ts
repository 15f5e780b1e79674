import pino from 'pino';
import { createDb } from '../db/connect';
import { ObjectStore } from '../files/objectStore';
import { createApp } from './app';
import { loadConfig } from './config';
import { startHousekeeping } from './housekeeping';
import { createMailer } from './mail/mailer';

const config = loadConfig();
const log = pino({ level: config.logLevel });
const db = createDb(config.databaseUrl, { max: config.databasePoolMax });
const objects = new ObjectStore(config.objects);
const mailer = createMailer(config.smtpUrl, config.mailFrom);
await objects.ensureBucket();

const { app } = createApp({ config, db, objects, mailer, log });
const housekeeping = startHousekeeping({ db, objects, log });
const server = app.listen(config.port, config.host, () => {
  log.info(`Jigwright listening on http://${config.host}:${config.port}`);
  process.send?.({ ready: true, port: config.port });
});

async function shutdown() {
  server.close();
  await housekeeping.stop();
  mailer.close();
  await db.destroy().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

import type { Logger } from 'pino';
import type { DB } from '../db/connect';
import type { ObjectStore } from '../files/objectStore';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';

/** Everything a route needs, built once in main.ts (or by the test context). */
export interface Deps {
  config: Config;
  db: DB;
  objects: ObjectStore;
  mailer: Mailer;
  log: Logger;
}

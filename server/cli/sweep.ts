// `npm run sweep [-- --dry-run] [-- --grace SECONDS]`: remove stored objects no revision refers to.
import { createDb } from '../../db/connect';
import { ObjectStore } from '../../files/objectStore';
import { loadConfig } from '../config';
import { sweepOrphans } from '../revisions/sweep';

const config = loadConfig();
const args = process.argv.slice(2);
const graceArg = args.indexOf('--grace');
const graceSeconds = graceArg >= 0 ? Number(args[graceArg + 1]) : 600;
const db = createDb(config.databaseUrl);
try {
  const out = await sweepOrphans({ db, objects: new ObjectStore(config.objects) }, { graceSeconds, dryRun: args.includes('--dry-run') });
  console.log(`${args.includes('--dry-run') ? 'would remove' : 'removed'} ${out.removed.length} orphan object(s)`);
  for (const k of out.removed) console.log(`  ${k}`);
} finally {
  await db.destroy();
}

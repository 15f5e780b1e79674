import { sql } from 'kysely';
import type { ApiRouter } from '../http/router';

async function within<T>(ms: number, p: Promise<T>, fallback: T): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<T>((resolve) => { timer = setTimeout(() => resolve(fallback), ms); });
  try {
    return await Promise.race([p.catch(() => fallback), timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export function healthRoutes(api: ApiRouter): void {
  api.route('get', '/health', { kind: 'public' }, async (_req, res) => {
    const { db, objects, mailer } = api.deps;
    const [dbUp, objectsUp, mailUp] = await Promise.all([
      within(2000, sql`select 1`.execute(db).then(() => true), false),
      within(2000, objects.check(), false),
      within(2000, mailer.check(), false),
    ]);
    const ok = dbUp && objectsUp && mailUp;
    const down = [!dbUp && 'db', !objectsUp && 'objects', !mailUp && 'mail'].filter(Boolean);
    res.status(ok ? 200 : 503).json({ ok, db: dbUp, objects: objectsUp, mail: mailUp, ...(ok ? {} : { down }) });
  });
}

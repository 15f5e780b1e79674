import { sql } from 'kysely';
import type { Deps } from '../deps';
import type { ApiRouter } from '../http/router';

/** How long each service may take to answer. Under heavy load the store can take seconds; 2 s read as "down". */
export const HEALTH_LIMIT_MS = 5000;

type Reading = { state: 'up' | 'down' | 'slow'; ms: number };

/** Up, refused ("down"), or no answer within the limit ("slow": it may be overloaded or hung). */
async function reading(limitMs: number, check: () => Promise<boolean>): Promise<Reading> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<'slow'>((resolve) => { timer = setTimeout(() => resolve('slow'), limitMs); });
  try {
    const answered = check().then(
      (up): Reading['state'] => (up ? 'up' : 'down'),
      (): Reading['state'] => 'down',
    );
    const state = await Promise.race([answered, late]);
    return { state, ms: Math.round(performance.now() - started) };
  } finally {
    clearTimeout(timer);
  }
}

export async function checkServices(deps: Pick<Deps, 'db' | 'objects' | 'mailer'>, limitMs = HEALTH_LIMIT_MS) {
  const [db, objects, mail] = await Promise.all([
    reading(limitMs, () => sql`select 1`.execute(deps.db).then(() => true)),
    reading(limitMs, () => deps.objects.check()),
    reading(limitMs, () => deps.mailer.check()),
  ]);
  const all = { db, objects, mail };
  const named = (state: Reading['state']) => Object.entries(all).filter(([, r]) => r.state === state).map(([name]) => name);
  const down = named('down');
  const slow = named('slow');
  const ok = down.length === 0 && slow.length === 0;
  return {
    ok,
    db: db.state === 'up',
    objects: objects.state === 'up',
    mail: mail.state === 'up',
    ...(down.length ? { down } : {}),
    ...(slow.length ? { slow, limitMs } : {}),
  };
}

export function healthRoutes(api: ApiRouter): void {
  api.route('get', '/health', { kind: 'public' }, async (_req, res) => {
    const health = await checkServices(api.deps);
    res.status(health.ok ? 200 : 503).json(health);
  });
}

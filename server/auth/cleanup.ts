// Spent sign-in rows: sessions that expired or were ended, and password-reset links that were used
// or ran out. A token for a removed session is refused exactly as one for a revoked session is
// (sessionUser finds no live row), so removing them changes no answer; it only keeps the tables
// from growing with every sign-in. They are kept for a day first, for whoever reads the logs.
import type { DB } from '../../db/connect';

export const SPENT_KEEP_HOURS = 24;

export async function removeSpentAuthRows(db: DB, { keepHours = SPENT_KEEP_HOURS, now = new Date() } = {}): Promise<{ sessions: number; resets: number }> {
  const before = new Date(now.getTime() - keepHours * 3600 * 1000);
  const sessions = await db
    .deleteFrom('sessions')
    .where((eb) => eb.or([eb('expires_at', '<', before), eb('revoked_at', '<', before)]))
    .executeTakeFirst();
  const resets = await db
    .deleteFrom('password_resets')
    .where((eb) => eb.or([eb('expires_at', '<', before), eb('used_at', '<', before)]))
    .executeTakeFirst();
  return { sessions: Number(sessions.numDeletedRows), resets: Number(resets.numDeletedRows) };
}

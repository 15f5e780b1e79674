import type { Config } from '../config';
import { HttpError } from '../http/errors';
import type { Mailer, OutgoingMail } from '../mail/mailer';

/** An absolute link into the web app, e.g. linkTo(config, '/invite/abc'). */
export function linkTo(config: Config, path: string): string {
  return config.publicUrl.replace(/\/+$/, '') + path;
}

/** Sends, or fails with a clear 503 so the caller's transaction rolls back and nothing is kept. */
export async function sendOrRefuse(mailer: Mailer, mail: OutgoingMail, what: string): Promise<void> {
  try {
    await mailer.send(mail);
  } catch {
    throw new HttpError(503, 'mail_unavailable', `The ${what} e-mail could not be sent, so nothing was saved; try again in a moment`);
  }
}

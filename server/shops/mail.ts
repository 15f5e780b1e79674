import { ROLE_HELP, ROLE_WITH_ARTICLE, type Role } from '../../shared/schemas/auth';
import type { OutgoingMail } from '../mail/mailer';

/** The invite link is the first link in the text, so it is what a mail client turns into the button. */
export function inviteMail(v: { to: string; shopName: string; role: Role; inviterName: string; link: string; expiresAt: Date }): OutgoingMail {
  const until = v.expiresAt.toUTCString();
  return {
    to: v.to,
    subject: `Join ${v.shopName} on Jigwright`,
    text: [
      `${v.inviterName} invited you to ${v.shopName} as ${ROLE_WITH_ARTICLE[v.role]}: you will be able to ${ROLE_HELP[v.role]}.`,
      '',
      'Open this link to join. It works once and until ' + until + ':',
      v.link,
      '',
      `Sign in, or create an account, with this address (${v.to}); the invite only works for it.`,
      'If you did not expect this, ignore the message and nothing happens.',
    ].join('\n'),
  };
}

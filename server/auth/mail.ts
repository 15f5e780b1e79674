import type { OutgoingMail } from '../mail/mailer';

export function resetMail(v: { to: string; name: string; link: string; minutes: number }): OutgoingMail {
  return {
    to: v.to,
    subject: 'Choose a new Jigwright password',
    text: [
      `Hello ${v.name},`,
      '',
      `Someone asked to reset the password of this Jigwright account. Open this link within ${v.minutes} minutes to choose a new one; it works once:`,
      v.link,
      '',
      'Choosing a new password signs the account out everywhere.',
      'If you did not ask for this, ignore the message: your password stays as it is.',
    ].join('\n'),
  };
}

import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  check(): Promise<boolean>;
  close(): void;
}

/** nodemailer over SMTP_URL: the local fake in development and tests, a real relay in production. */
export function createMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl, { from });
  return {
    async send(mail) {
      await transport.sendMail({ from, ...mail });
    },
    async check() {
      try {
        await transport.verify();
        return true;
      } catch {
        return false;
      }
    },
    close() {
      transport.close();
    },
  };
}

// Reads what the SMTP fake captured (an .eml per message, listed in index.jsonl).
import fs from 'node:fs';
import path from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';

export class Mailbox {
  constructor(private dir: string) {}

  private entries(): { file: string; to: string[] }[] {
    const index = path.join(this.dir, 'index.jsonl');
    if (!fs.existsSync(index)) return [];
    return fs.readFileSync(index, 'utf8').split('\n').filter(Boolean).map((l) => JSON.parse(l));
  }

  /** Waits for the newest message to `to` after `after` messages had arrived for them. */
  async latestFor(to: string, { timeoutMs = 5000, after = 0 } = {}): Promise<ParsedMail> {
    const start = Date.now();
    while (Date.now() - start < timeoutMs) {
      const mine = this.entries().filter((e) => e.to.map((x) => x.toLowerCase()).includes(to.toLowerCase()));
      if (mine.length > after) return simpleParser(fs.readFileSync(path.join(this.dir, mine[mine.length - 1].file)));
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error(`no mail for ${to} within ${timeoutMs} ms`);
  }

  countFor(to: string): number {
    return this.entries().filter((e) => e.to.map((x) => x.toLowerCase()).includes(to.toLowerCase())).length;
  }
}

/** The first http(s) link in a mail's text. */
export function firstLink(mail: ParsedMail): string {
  const m = (mail.text ?? '').match(/https?:\/\/\S+/);
  if (!m) throw new Error('mail has no link');
  return m[0];
}

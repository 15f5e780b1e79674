// Local SMTP fake: accepts every message on 127.0.0.1:FAKE_PORT and keeps it as an .eml file in
// FAKE_DIR (newest last), plus one line per message in FAKE_DIR/index.jsonl for quick reading.
import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

const dir = process.env.FAKE_DIR;
const port = Number(process.env.FAKE_PORT || 2529);
fs.mkdirSync(dir, { recursive: true });
let seq = 0;

const server = new SMTPServer({
  authOptional: true,
  // The library's built-in certificate has expired; the fake speaks plain SMTP on loopback.
  disabledCommands: ['STARTTLS'],
  banner: 'jigwright mail fake',
  logger: false,
  onData(stream, session, callback) {
    const chunks = [];
    stream.on('data', (c) => chunks.push(c));
    stream.on('end', () => {
      const stamp = new Date().toISOString().replace(/[:.]/g, '-');
      const name = `${stamp}-${String(++seq).padStart(4, '0')}.eml`;
      fs.writeFileSync(path.join(dir, name), Buffer.concat(chunks));
      const entry = {
        file: name,
        from: session.envelope.mailFrom && session.envelope.mailFrom.address,
        to: session.envelope.rcptTo.map((r) => r.address),
        at: new Date().toISOString(),
      };
      fs.appendFileSync(path.join(dir, 'index.jsonl'), JSON.stringify(entry) + '\n');
      callback();
    });
  },
});
server.listen(port, '127.0.0.1', () => console.log(`[mail] fake SMTP on 127.0.0.1:${port}, mail kept in ${dir}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

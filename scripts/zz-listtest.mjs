import { startFake, freePort } from './lib/services.mjs';
import { Client } from 'minio';
import fs from 'node:fs';
const dir = fs.mkdtempSync('/tmp/jw-listtest-');
const port = await freePort();
const fake = await startFake('objects', { port, dir, extraEnv: { FAKE_BUCKET: 'b' } });
const c = new Client({ endPoint: '127.0.0.1', port, useSSL: false, accessKey: 'S3RVER', secretKey: 'S3RVER', region: 'us-east-1', pathStyle: true });
await Promise.all(Array.from({ length: 1105 }, (_, i) => c.putObject('b', `revisions/${String(i).padStart(5, '0')}/x.dxf`, Buffer.from('x'), 1)));
for (const v of ['V2', 'V1']) {
  try {
    const keys = [];
    const s = v === 'V2' ? c.listObjectsV2('b', 'revisions/', true) : c.listObjects('b', 'revisions/', true);
    for await (const o of s) keys.push(o.name);
    console.log(v, 'ok', keys.length);
  } catch (e) { console.log(v, 'failed', e.message.slice(0, 200)); }
}
await fake.stop();
fs.rmSync(dir, { recursive: true, force: true });

// Reading and rewriting shop archives (gzip'd tar) in tests, to build damaged and hostile ones from
// a real export. Uses tar-stream, the same package the server writes with; the archive test also
// reads every export with GNU tar and checks it with GNU coreutils' sha256sum, as independent readers.
import { Readable } from 'node:stream';
import { gunzipSync, gzipSync } from 'node:zlib';
import tar from 'tar-stream';

export interface TarEntry {
  header: tar.Headers;
  body: Buffer;
}

export async function unpack(archive: Buffer): Promise<TarEntry[]> {
  const extract = tar.extract();
  const out: TarEntry[] = [];
  Readable.from([archive[0] === 0x1f ? gunzipSync(archive) : archive]).pipe(extract as never);
  for await (const entry of extract) {
    const chunks: Buffer[] = [];
    for await (const c of entry) chunks.push(c);
    out.push({ header: entry.header, body: Buffer.concat(chunks) });
  }
  return out;
}

/** Packs entries (size taken from the body unless the header says otherwise) and gzips them. */
export async function pack(entries: TarEntry[], { gzip = true } = {}): Promise<Buffer> {
  const p = tar.pack();
  const chunks: Buffer[] = [];
  const done = (async () => {
    for await (const c of p) chunks.push(c as Buffer);
  })();
  for (const e of entries) {
    await new Promise<void>((resolve, reject) => {
      const header = { ...e.header, size: e.header.type === 'symlink' || e.header.type === 'directory' ? 0 : e.body.length };
      if (header.type === 'symlink' || header.type === 'directory') p.entry(header, (err) => (err ? reject(err) : resolve()));
      else p.entry(header, e.body, (err) => (err ? reject(err) : resolve()));
    });
  }
  p.finalize();
  await done;
  const tarBuf = Buffer.concat(chunks);
  return gzip ? gzipSync(tarBuf) : tarBuf;
}

export const manifestOf = (entries: TarEntry[]) => JSON.parse(entries.find((e) => e.header.name === 'manifest.json')!.body.toString('utf8'));

/** The entries with manifest.json replaced by `edit(manifest)`. */
export function withManifest(entries: TarEntry[], edit: (m: any) => any): TarEntry[] {
  return entries.map((e) => (e.header.name === 'manifest.json' ? { header: e.header, body: Buffer.from(JSON.stringify(edit(structuredClone(manifestOf(entries))))) } : e));
}

// Matrix rows for the shop archive routes (merged into MATRIX in authz-matrix.table.ts): only a
// shop's owners may download its library or import an archive into it.
import { PassThrough } from 'node:stream';
import { buildManifest, writeArchive } from '../../server/archive/export';
import type { MatrixFixture, Principal } from './authz-matrix.fixture';
import type { MatrixRow } from './authz-matrix.table';

const ownerOnly = (ok: number): Record<Principal, number> => ({ anonymous: 401, outsider: 404, viewer: 403, editor: 403, owner: ok });

/** A real archive of a fresh, empty shop: valid, and quick to import. */
async function emptyArchive(f: MatrixFixture): Promise<Buffer> {
  const built = await buildManifest(f.ctx.deps, await f.addShop());
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  await writeArchive(f.ctx.deps, built, out);
  return Buffer.concat(chunks);
}

export const ARCHIVE_ROWS: Record<string, MatrixRow> = {
  'GET /api/shops/:shopId/archive': { request: (f) => ({ path: `/api/shops/${f.shopId}/archive` }), expect: ownerOnly(200) },
  'POST /api/shops/:shopId/archive': {
    request: async (f) => {
      const archive = await emptyArchive(f);
      return { path: `/api/shops/${f.shopId}/archive`, prepare: (req) => req.attach('archive', archive, 'library.tar.gz') };
    },
    expect: ownerOnly(201),
  },
};

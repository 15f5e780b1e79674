// A shop's whole library as one archive: owners download it and import it into a shop they own.
import fs from 'node:fs';
import os from 'node:os';
import multer from 'multer';
import { HttpError } from '../http/errors';
import { authOf, type Policy } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { readMultipart } from '../http/upload';
import { shopFromParam } from '../library/locators';
import { ArchiveImportQuery } from '../../shared/schemas/archive';
import { archiveName, buildManifest, writeArchive } from './export';
import { DEFAULT_IMPORT_LIMITS, importArchive } from './import';

export function archiveRoutes(api: ApiRouter): void {
  const deps = api.deps;
  const owner: Policy = { kind: 'shop', role: 'owner', shop: shopFromParam };
  // Archives can be large: they go to a temporary file, never into memory whole.
  const upload = readMultipart(
    multer({
      storage: multer.diskStorage({ destination: os.tmpdir(), filename: (_req, _file, cb) => cb(null, `jw-archive-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.upload`) }),
      limits: { fileSize: deps.config.archiveMaxBytes, files: 1, fields: 2, fieldSize: 1024, parts: 3 },
    }).single('archive'),
  );

  api.route('get', '/shops/:shopId/archive', owner, async (req, res) => {
    const shopId = authOf(req).shopId!;
    const built = await buildManifest(deps, shopId);
    res.setHeader('Content-Type', 'application/gzip');
    res.setHeader('Content-Disposition', `attachment; filename="${archiveName(built.manifest.shop.slug)}"`);
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Archive-Designs', String(built.manifest.counts.designs));
    try {
      await writeArchive(deps, built, res);
    } catch (err) {
      // Part of the archive is already sent: break the connection so the download fails visibly.
      deps.log.error({ err, shopId }, 'archive export failed');
      res.destroy(err as Error);
    }
  });

  api.route('post', '/shops/:shopId/archive', owner, upload, async (req, res) => {
    const { shopId, user } = authOf(req);
    if (!req.file) throw new HttpError(400, 'bad_request', 'Attach the archive (.tar.gz) in the "archive" field');
    try {
      // ?again=true: the owner chose to import an archive this shop already has as a further copy.
      const q = ArchiveImportQuery.parse(req.query);
      const result = await importArchive(deps, { shopId: shopId!, userId: user.id, again: q.again === 'true' }, req.file.path, { ...DEFAULT_IMPORT_LIMITS, maxUnpackedBytes: deps.config.archiveMaxUnpackedBytes });
      res.status(201).json(result);
    } finally {
      await fs.promises.rm(req.file.path, { force: true });
    }
  });
}

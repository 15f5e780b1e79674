import { randomUUID } from 'node:crypto';
import multer from 'multer';
import { suggestClearance } from '../../shared/fit/clearance';
import { CutLogFields, CutLogInput, FitHistoryQuery } from '../../shared/schemas/cuts';
import { logActivity } from '../designs/repository';
import { HttpError, notFound } from '../http/errors';
import { authOf } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { readMultipart } from '../http/upload';
import { shopFromParam, shopOfCut, shopOfRevision } from '../library/locators';
import { cutsOfRevision, deviceKeyOf, fitHistory, insertCut } from './repository';

/** Photos are JPEG or PNG, told by their first bytes (never by the sent type). */
function photoType(buf: Buffer): { ext: 'jpg' | 'png'; type: string } | null {
  if (buf.length > 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return { ext: 'jpg', type: 'image/jpeg' };
  if (buf.length > 8 && buf.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return { ext: 'png', type: 'image/png' };
  return null;
}

export function cutRoutes(api: ApiRouter): void {
  const { db, objects } = api.deps;
  const photo = readMultipart(multer({ storage: multer.memoryStorage(), limits: { fileSize: 8 * 1024 * 1024, files: 1, fields: 12, fieldSize: 4096 } }).single('photo'));

  api.route('get', '/revisions/:revisionId/cuts', { kind: 'shop', role: 'viewer', shop: shopOfRevision }, async (req, res) => {
    res.json({ items: await cutsOfRevision(db, req.params.revisionId as string) });
  });

  api.route('post', '/revisions/:revisionId/cuts', { kind: 'shop', role: 'editor', shop: shopOfRevision }, photo, async (req, res) => {
    const input = req.is('multipart/form-data') ? CutLogFields.parse(req.body ?? {}) : CutLogInput.parse(req.body);
    const { user, shopId } = authOf(req);
    const revisionId = req.params.revisionId as string;
    const rev = await db.selectFrom('revisions').select(['fit_notes', 'params', 'design_id', 'number']).where('id', '=', revisionId).executeTakeFirstOrThrow();
    const fitNotes = rev.fit_notes as { device?: { name?: string; width: number; length: number; thickness: number }; clearancePerSide?: number };
    // The clearance cut defaults to the one the revision was drawn with.
    const clearanceMm = input.clearanceMm ?? fitNotes?.clearancePerSide;
    let photoKey: string | null = null;
    if (req.file) {
      const kind = photoType(req.file.buffer);
      if (!kind) throw new HttpError(400, 'bad_photo', 'The photo must be a JPEG or PNG image');
      photoKey = `photos/${randomUUID()}.${kind.ext}`;
      try {
        await objects.put(photoKey, req.file.buffer, kind.type);
      } catch {
        throw new HttpError(503, 'storage_unavailable', 'The file store is not answering; nothing was saved. Try again in a moment.');
      }
    }
    try {
      const row = await db.transaction().execute(async (tx) => {
        const r = await insertCut(tx as never, { ...input, clearanceMm, revisionId, shopId: shopId!, authorId: user.id, deviceKey: deviceKeyOf(fitNotes), photoKey });
        await logActivity(tx, { shopId: shopId!, designId: rev.design_id, revisionId, actorId: user.id, action: 'cut.logged', detail: { number: rev.number, result: input.result, material: input.material } });
        return r;
      });
      res.status(201).json({ id: row.id, deviceKey: deviceKeyOf(fitNotes), clearanceMm: clearanceMm ?? null });
    } catch (e) {
      if (photoKey) await objects.remove([photoKey]).catch(() => undefined);
      throw e;
    }
  });

  api.route('get', '/cuts/:cutId/photo', { kind: 'shop', role: 'viewer', shop: shopOfCut }, async (req, res) => {
    const row = await db.selectFrom('cut_logs').select('photo_key').where('id', '=', req.params.cutId as string).executeTakeFirst();
    if (!row?.photo_key) throw notFound('No photo for that cut');
    res.setHeader('Content-Type', row.photo_key.endsWith('.png') ? 'image/png' : 'image/jpeg');
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.send(await objects.get(row.photo_key));
  });

  // Fit history per device and material, with the clearance to try next.
  api.route('get', '/shops/:shopId/fit-history', { kind: 'shop', role: 'viewer', shop: shopFromParam }, async (req, res) => {
    const q = FitHistoryQuery.parse(req.query);
    const cuts = await fitHistory(db, authOf(req).shopId!, q.device, q.material);
    const suggestion = suggestClearance(cuts.filter((c) => c.clearanceMm !== undefined).map((c) => ({ clearanceMm: c.clearanceMm!, result: c.result })));
    res.json({ device: q.device, material: q.material, cuts, suggestion });
  });
}

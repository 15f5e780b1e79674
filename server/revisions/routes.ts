import type { Request, Response } from 'express';
import { pipeline } from 'node:stream/promises';
import multer from 'multer';
import { sql } from 'kysely';
import { getGenerator, runGenerator } from '../../shared/generators';
import { deviceParamValues } from '../../shared/generators/catalogDevice';
import { ChangeStatus, DownloadQuery, TemplateQuery, InspectUploadFields, Regenerate, UploadRevisionFields } from '../../shared/schemas/library';
import { logActivity } from '../designs/repository';
import { badRequest, HttpError, notFound } from '../http/errors';
import { authOf } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { readMultipart } from '../http/upload';
import { isUuid, shopOfDesign, shopOfRevision } from '../library/locators';
import { templatePdf } from '../../files/print/template';
import { compareRevisions, type Comparable } from '../../shared/compare';
import { importUpload } from './geometry';
import { fileOf, getRevision, loadRevisionForCopy } from './repository';
import { saveRevision } from './store';

/** A file name a shop floor computer is happy with: `<title>-r<N>.<ext>`. */
export function downloadName(title: string, number: number, ext: string): string {
  const base = title.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().replace(/\s+/g, '-').toLowerCase().slice(0, 80) || 'design';
  return `${base}-r${number}.${ext}`;
}

/** The files/ importers throw errors with a user-facing message; turn them into 4xx answers. */
function uploadError(e: unknown): never {
  const err = e as { name?: string; code?: string; message?: string };
  if (err?.name === 'UnitsNeeded' || err?.code === 'units_needed') {
    throw new HttpError(422, 'units_needed', err.message || 'This file does not say its units: choose millimetres or inches and send it again');
  }
  if (err?.name === 'FileRejected' || err?.name === 'DxfImportError' || err?.name === 'SvgImportError') {
    throw new HttpError(400, err.code && err.code !== 'FileRejected' ? `file_${err.code}`.replace(/^file_file_/, 'file_') : 'file_rejected', err.message || 'The file was refused');
  }
  throw e;
}

export function revisionRoutes(api: ApiRouter): void {
  const { db, objects, config } = api.deps;
  const upload = readMultipart(
    multer({
      storage: multer.memoryStorage(),
      limits: { fileSize: config.uploadMaxBytes, files: 1, fields: 8, fieldSize: 64 * 1024, parts: 10 },
    }).single('file'),
  );
  const viewerOfRevision = { kind: 'shop' as const, role: 'viewer' as const, shop: shopOfRevision };
  const editorOfRevision = { kind: 'shop' as const, role: 'editor' as const, shop: shopOfRevision };
  const editorOfDesign = { kind: 'shop' as const, role: 'editor' as const, shop: shopOfDesign };

  /** The attached file, read as a drawing in `units` when it does not say its own; refusals as 4xx. */
  function readDrawing(req: Request, units: Parameters<typeof importUpload>[1]) {
    if (!req.file) throw badRequest('Attach a DXF or SVG file in the "file" field');
    if (req.file.size === 0) throw new HttpError(400, 'file_empty', 'The file is empty');
    const body = req.file.buffer;
    try {
      return { body, imported: importUpload(body, units) };
    } catch (e) {
      uploadError(e);
    }
  }

  // Check a file and show what Jigwright read from it, before anything is saved.
  api.route('post', '/designs/:designId/uploads/inspect', editorOfDesign, upload, async (req, res) => {
    const fields = InspectUploadFields.parse(req.body ?? {});
    const { imported } = readDrawing(req, fields.units);
    const { modelToSvg } = await import('../../files/svg/render');
    res.json({
      format: imported.format,
      sourceUnits: imported.sourceUnits,
      unitsFrom: imported.unitsFrom,
      entityCounts: imported.entityCounts,
      warnings: imported.warnings,
      sizeCheck: imported.sizeCheck ?? null,
      summary: imported.summary,
      svg: modelToSvg(imported.model, {}),
    });
  });

  api.route('post', '/designs/:designId/revisions/upload', editorOfDesign, upload, async (req, res) => {
    const fields = UploadRevisionFields.parse(req.body ?? {});
    const { body, imported } = readDrawing(req, fields.units);
    const designId = req.params.designId as string;
    const design = await db.selectFrom('designs').select('title').where('id', '=', designId).executeTakeFirstOrThrow();
    const saved = await saveRevision(api.deps, designId, {
      authorId: authOf(req).user.id,
      source: 'uploaded',
      message: fields.message,
      status: fields.status,
      fitNotes: fields.fitNotes,
      model: imported.model,
      summary: imported.summary,
      title: design.title,
      original: { body, contentType: imported.format === 'dxf' ? 'application/dxf' : 'image/svg+xml', ext: imported.format },
      activity: { action: 'revision.uploaded', detail: { format: imported.format, sourceUnits: imported.sourceUnits, warnings: imported.warnings.length } },
    });
    res.status(201).json({ ...saved, warnings: imported.warnings, sizeCheck: imported.sizeCheck ?? null, summary: imported.summary });
  });

  api.route('get', '/revisions/:revisionId', viewerOfRevision, async (req, res) => {
    const r = await getRevision(db, req.params.revisionId as string);
    if (!r) throw notFound('That revision does not exist');
    res.json({ ...r.info, designTitle: r.title });
  });

  // Status is the one thing that moves on a saved revision: its life from draft to retired.
  api.route('patch', '/revisions/:revisionId/status', editorOfRevision, async (req, res) => {
    const { status } = ChangeStatus.parse(req.body);
    const revisionId = req.params.revisionId as string;
    const { user, shopId } = authOf(req);
    const out = await db.transaction().execute(async (tx) => {
      const before = await tx.selectFrom('revisions').select(['status', 'design_id', 'number']).where('id', '=', revisionId).forUpdate().executeTakeFirstOrThrow();
      await tx.updateTable('revisions').set({ status }).where('id', '=', revisionId).execute();
      // The library filters on the status of each design's newest revision.
      await tx
        .updateTable('designs')
        .set({ latest_status: status, updated_at: sql`now()` })
        .where('id', '=', before.design_id)
        .where('latest_revision_number', '=', before.number)
        .execute();
      await logActivity(tx, { shopId: shopId!, designId: before.design_id, revisionId, actorId: user.id, action: 'revision.status', detail: { number: before.number, from: before.status, to: status } });
      return { id: revisionId, status, previous: before.status };
    });
    res.json(out);
  });

  api.route('get', '/revisions/:revisionId/download', viewerOfRevision, async (req: Request, res: Response) => {
    const q = DownloadQuery.parse(req.query);
    const r = await getRevision(db, req.params.revisionId as string);
    if (!r) throw notFound('That revision does not exist');
    const role = q.format === 'svg' ? 'svg' : q.units === 'in' ? 'dxf_in' : 'dxf';
    const file = await fileOf(db, r.info.id, role);
    if (!file) throw notFound('That file is not stored for this revision');
    const name = downloadName(r.title, r.info.number, q.format);
    if (q.link === '1') {
      // Short-lived: the link works for five minutes.
      const url = await objects.presignGet(file.object_key, 300, name, file.content_type);
      res.json({ url, name, expiresInSeconds: 300 });
      return;
    }
    res.setHeader('Content-Type', file.content_type);
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.setHeader('Content-Length', String(file.bytes));
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; sandbox");
    const stream = await objects.stream(file.object_key);
    // A store that fails mid-file must cut this download off, not crash the API (an 'error' event
    // with no listener ends the process).
    await pipeline(stream, res).catch((err) => {
      api.deps.log.warn({ err }, 'download interrupted');
      res.destroy();
    });
  });

  // The generated preview (never an uploaded SVG as-is), for thumbnails and the drawing view.
  api.route('get', '/revisions/:revisionId/preview.svg', viewerOfRevision, async (req, res) => {
    const file = await fileOf(db, req.params.revisionId as string, 'svg');
    if (!file) throw notFound('No preview for that revision');
    res.setHeader('Content-Type', 'image/svg+xml');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; sandbox");
    res.send(await objects.get(file.object_key));
  });

  api.route('get', '/revisions/:revisionId/model', viewerOfRevision, async (req, res) => {
    const file = await fileOf(db, req.params.revisionId as string, 'model');
    if (!file) throw notFound('No stored geometry for that revision');
    res.setHeader('Content-Type', 'application/json');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.send(await objects.get(file.object_key));
  });

  // A printable 1:1 template (cover sheet with calibration bars and cautions, then tiles).
  api.route('get', '/revisions/:revisionId/template.pdf', viewerOfRevision, async (req, res) => {
    const q = TemplateQuery.parse(req.query);
    const rev = await loadRevisionForCopy(api.deps, req.params.revisionId as string);
    if (!rev) throw notFound('That revision does not exist');
    const pdf = await templatePdf(rev.model, { designTitle: rev.title, revisionNumber: rev.number, units: q.units, date: new Date().toISOString().slice(0, 10), paper: q.paper });
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${downloadName(rev.title, rev.number, 'pdf').replace(/\.pdf$/, `-template-${q.paper}.pdf`)}"`);
    res.send(pdf);
  });

  // Compare with any revision the caller may see: same design, a fork's lineage, or another shop's.
  api.route('get', '/revisions/:revisionId/compare/:otherId', viewerOfRevision, async (req, res) => {
    const otherId = req.params.otherId as string;
    const other = isUuid(otherId) ? await getRevision(db, otherId) : null;
    const member = other
      ? await db.selectFrom('memberships').select('role').where('shop_id', '=', other.shopId).where('user_id', '=', authOf(req).user.id).executeTakeFirst()
      : undefined;
    if (!other || !member) throw notFound('The revision to compare with does not exist');
    const base = (await getRevision(db, req.params.revisionId as string))!;
    const rows = compareRevisions(base.info as Comparable, other.info as Comparable);
    res.json({
      a: { ...base.info, designTitle: base.title },
      b: { ...other.info, designTitle: other.title },
      rows,
    });
  });

  // Regenerate for another device: same generator and parameters, only the device ones change.
  api.route('post', '/revisions/:revisionId/regenerate', editorOfRevision, async (req, res) => {
    const body = Regenerate.parse(req.body);
    const { user, shopId } = authOf(req);
    const rev = await loadRevisionForCopy(api.deps, req.params.revisionId as string);
    if (!rev) throw notFound('That revision does not exist');
    if (rev.source !== 'generated' || !rev.generatorId || !rev.params) {
      throw new HttpError(409, 'not_generated', 'Only generated revisions can be regenerated; upload a new file instead');
    }
    const gen = getGenerator(rev.generatorId);
    if (!gen) throw new HttpError(409, 'unknown_generator', `The generator "${rev.generatorId}" is no longer available`);
    const deviceKeys = gen.deviceParams ?? [];
    let device: Record<string, number>;
    let deviceName: string | undefined;
    if (body.deviceId) {
      const d = await db.selectFrom('devices').selectAll().where('id', '=', body.deviceId).where('shop_id', '=', shopId!).executeTakeFirst();
      if (!d) throw new HttpError(404, 'not_found', 'That device is not in this shop’s catalog');
      device = deviceParamValues(deviceKeys, { widthMm: d.width_mm, lengthMm: d.length_mm, thicknessMm: d.thickness_mm, caseAllowanceMm: d.case_allowance_mm });
      deviceName = d.name;
    } else {
      device = body.device!;
      const stray = Object.keys(device).filter((k) => !deviceKeys.includes(k));
      if (stray.length) throw new HttpError(400, 'invalid_params', `Only device parameters may change here: ${stray.join(', ')} is not one`, { fields: Object.fromEntries(stray.map((k) => [`device.${k}`, 'Not a device parameter'])) });
    }
    const run = runGenerator(rev.generatorId, { ...rev.params, ...device });
    if (!run.ok) throw new HttpError(400, 'invalid_params', run.message, { fields: run.fields });
    const fitNotes = { ...rev.fitNotes };
    if (fitNotes.device || deviceName) {
      fitNotes.device = {
        ...(fitNotes.device ?? { cased: false }),
        name: deviceName ?? fitNotes.device?.name,
        width: Number(run.params[deviceKeys.find((k) => /width/i.test(k)) ?? ''] ?? fitNotes.device?.width),
        length: Number(run.params[deviceKeys.find((k) => /length/i.test(k)) ?? ''] ?? fitNotes.device?.length),
        thickness: Number(run.params[deviceKeys.find((k) => /thick/i.test(k)) ?? ''] ?? fitNotes.device?.thickness),
      } as typeof fitNotes.device;
    }
    const saved = await saveRevision(api.deps, rev.designId, {
      authorId: user.id,
      source: 'generated',
      generatorId: rev.generatorId,
      params: run.params,
      message: body.message || `Regenerated from r${rev.number} for ${deviceName ?? 'a new device'}`,
      status: 'draft',
      fitNotes,
      model: run.result.model,
      summary: run.result.summary,
      title: rev.title,
      activity: { action: 'revision.regenerated', detail: { fromNumber: rev.number, device: deviceName ?? device } },
    });
    res.status(201).json({ ...saved, fromRevisionId: rev.id });
  });
}

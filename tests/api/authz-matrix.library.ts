// Matrix rows for the library, catalog and cut-log routes (merged into MATRIX in
// authz-matrix.table.ts). The hook gives each row's fixture shop a generated insert with two
// revisions, a device, a charger pad and a cut with a photo.
import { randomUUID } from 'node:crypto';
import { insertDesign } from '../../server/designs/repository';
import { saveRevision } from '../../server/revisions/store';
import { runGenerator } from '../../shared/generators';
import { dxfFile, rectLines } from '../support/dxf';
import type { FixtureHook, MatrixFixture, Principal } from './authz-matrix.fixture';
import type { MatrixRow } from './authz-matrix.table';

type Expect = Record<Principal, number>;
const viewerOk = (ok: number): Expect => ({ anonymous: 401, outsider: 404, viewer: ok, editor: ok, owner: ok });
const editorOk = (ok: number): Expect => ({ anonymous: 401, outsider: 404, viewer: 403, editor: ok, owner: ok });

// 1×1 PNG (PNG specification, ISO/IEC 15948: signature 89 50 4E 47 0D 0A 1A 0A, IHDR, IDAT, IEND).
const PNG = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8ffff3f0005fe02fea7d6a6e00000000049454e44ae426082', 'hex');
const DXF = Buffer.from(dxfFile(rectLines(40, 30)));

export const libraryFixture: FixtureHook = async (f: MatrixFixture) => {
  const { db } = f.ctx;
  const author = f.people.editor.id;
  const design = await insertDesign(db, f.shopId, author, { kind: 'insert', title: 'Matrix plate', description: '', tags: [], material: 'birch plywood' });
  const run = runGenerator('charger-insert', {});
  if (!run.ok) throw new Error(run.message);
  const draft = {
    authorId: author,
    source: 'generated' as const,
    generatorId: 'charger-insert',
    params: run.params,
    message: 'matrix',
    status: 'draft' as const,
    fitNotes: { device: { name: 'Matrix phone', width: 70, length: 150, thickness: 8, cased: false }, clearancePerSide: 0.5 },
    model: run.result.model,
    summary: run.result.summary,
    title: 'Matrix plate',
    activity: { action: 'revision.generated' },
  };
  const r1 = await saveRevision(f.ctx.deps, design.id, draft);
  const r2 = await saveRevision(f.ctx.deps, design.id, { ...draft, message: 'matrix r2' });
  const photoKey = `photos/${randomUUID()}.png`;
  await f.ctx.deps.objects.put(photoKey, PNG, 'image/png');
  const cut = await db
    .insertInto('cut_logs')
    .values({ revision_id: r1.id, shop_id: f.shopId, author_id: author, cut_on: '2026-11-01', material: 'birch plywood', bit_mm: 6.35, device_key: 'Matrix phone', clearance_mm: 0.5, result: 'good', photo_key: photoKey })
    .returning('id')
    .executeTakeFirstOrThrow();
  Object.assign(f.ids, { designId: design.id, revisionId: r1.id, revision2Id: r2.id, cutId: cut.id });
};

const freshDevice = async (f: MatrixFixture) =>
  (await f.ctx.db.insertInto('devices').values({ shop_id: f.shopId, name: `Matrix device ${randomUUID()}`, width_mm: 70, length_mm: 150, thickness_mm: 8 }).returning('id').executeTakeFirstOrThrow()).id;
const freshCharger = async (f: MatrixFixture) =>
  (await f.ctx.db.insertInto('chargers').values({ shop_id: f.shopId, name: `Matrix pad ${randomUUID()}`, shape: 'round', width_mm: 56, length_mm: 56, thickness_mm: 6 }).returning('id').executeTakeFirstOrThrow()).id;

export const LIBRARY_ROWS: Record<string, MatrixRow> = {
  'GET /api/shops/:shopId/designs': { request: (f) => ({ path: `/api/shops/${f.shopId}/designs?q=matrix` }), expect: viewerOk(200) },
  'POST /api/shops/:shopId/designs': { request: (f) => ({ path: `/api/shops/${f.shopId}/designs`, body: { kind: 'jig', title: 'Matrix jig' } }), expect: editorOk(201) },
  'GET /api/designs/:designId': { request: (f) => ({ path: `/api/designs/${f.ids.designId}` }), expect: viewerOk(200) },
  'PATCH /api/designs/:designId': { request: (f) => ({ path: `/api/designs/${f.ids.designId}`, body: { description: 'Edited' } }), expect: editorOk(200) },
  'POST /api/designs/:designId/revisions': {
    request: (f) => ({ path: `/api/designs/${f.ids.designId}/revisions`, body: { generatorId: 'charger-insert', params: {}, message: 'From the matrix' } }),
    expect: editorOk(201),
  },
  // Viewers of the source may fork, but only into a shop where they are editor or owner: the
  // fixture shop is the target, so its viewer is refused there.
  'POST /api/designs/:designId/forks': {
    request: (f) => ({ path: `/api/designs/${f.ids.designId}/forks`, body: { revisionId: f.ids.revisionId, targetShopId: f.shopId } }),
    expect: { anonymous: 401, outsider: 404, viewer: 403, editor: 201, owner: 201 },
  },
  'POST /api/designs/:designId/uploads/inspect': {
    request: (f) => ({ path: `/api/designs/${f.ids.designId}/uploads/inspect`, prepare: (req) => req.attach('file', DXF, 'part.dxf') }),
    expect: editorOk(200),
  },
  'POST /api/designs/:designId/revisions/upload': {
    request: (f) => ({ path: `/api/designs/${f.ids.designId}/revisions/upload`, prepare: (req) => req.field('message', 'Uploaded in the matrix').attach('file', DXF, 'part.dxf') }),
    expect: editorOk(201),
  },
  'GET /api/revisions/:revisionId': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}` }), expect: viewerOk(200) },
  'PATCH /api/revisions/:revisionId/status': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/status`, body: { status: 'trial' } }), expect: editorOk(200) },
  'GET /api/revisions/:revisionId/download': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/download?format=dxf&units=in` }), expect: viewerOk(200) },
  'GET /api/revisions/:revisionId/preview.svg': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/preview.svg` }), expect: viewerOk(200) },
  'GET /api/revisions/:revisionId/model': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/model` }), expect: viewerOk(200) },
  'GET /api/revisions/:revisionId/template.pdf': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/template.pdf?paper=letter` }), expect: viewerOk(200) },
  'GET /api/revisions/:revisionId/compare/:otherId': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/compare/${f.ids.revision2Id}` }), expect: viewerOk(200) },
  'POST /api/revisions/:revisionId/regenerate': {
    request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/regenerate`, body: { device: { deviceWidth: 72 } } }),
    expect: editorOk(201),
  },
  'GET /api/shops/:shopId/devices': { request: (f) => ({ path: `/api/shops/${f.shopId}/devices` }), expect: viewerOk(200) },
  'POST /api/shops/:shopId/devices': {
    request: (f) => ({ path: `/api/shops/${f.shopId}/devices`, body: { name: `Matrix phone ${randomUUID()}`, widthMm: 70, lengthMm: 150, thicknessMm: 8 } }),
    expect: editorOk(201),
  },
  'DELETE /api/shops/:shopId/devices/:deviceId': { request: async (f) => ({ path: `/api/shops/${f.shopId}/devices/${await freshDevice(f)}` }), expect: editorOk(204) },
  'GET /api/shops/:shopId/chargers': { request: (f) => ({ path: `/api/shops/${f.shopId}/chargers` }), expect: viewerOk(200) },
  'POST /api/shops/:shopId/chargers': {
    request: (f) => ({ path: `/api/shops/${f.shopId}/chargers`, body: { name: `Matrix pad ${randomUUID()}`, shape: 'round', widthMm: 56, thicknessMm: 6 } }),
    expect: editorOk(201),
  },
  'DELETE /api/shops/:shopId/chargers/:chargerId': { request: async (f) => ({ path: `/api/shops/${f.shopId}/chargers/${await freshCharger(f)}` }), expect: editorOk(204) },
  'GET /api/revisions/:revisionId/cuts': { request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/cuts` }), expect: viewerOk(200) },
  'POST /api/revisions/:revisionId/cuts': {
    request: (f) => ({ path: `/api/revisions/${f.ids.revisionId}/cuts`, body: { cutOn: '2026-11-30', material: 'birch plywood', bitMm: 6.35, result: 'tight' } }),
    expect: editorOk(201),
  },
  'GET /api/cuts/:cutId/photo': { request: (f) => ({ path: `/api/cuts/${f.ids.cutId}/photo` }), expect: viewerOk(200) },
  'GET /api/shops/:shopId/fit-history': { request: (f) => ({ path: `/api/shops/${f.shopId}/fit-history?device=Matrix%20phone&material=birch%20plywood` }), expect: viewerOk(200) },
};

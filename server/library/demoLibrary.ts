// The demo shop's library: invented designs with several revisions, fit notes and one fork,
// saved through the same pipeline as real saves (objects first, then rows). Idempotent.
import makerjs from 'makerjs';
import { DEMO_CHARGERS, DEMO_DEVICES, type SeedResult } from '../../db/seed';
import { runGenerator } from '../../shared/generators';
import type { FitNotes, RevisionStatus } from '../../shared/schemas/library';
import type { Deps } from '../deps';
import { insertDesign, logActivity } from '../designs/repository';
import { summarizeModel } from '../../shared/geometry/summary';
import { saveRevision } from '../revisions/store';
import { modelToDxf } from '../../files/dxf/export';

type Params = Record<string, number | string | boolean>;

const phoneS = DEMO_DEVICES[0];
const phoneL = DEMO_DEVICES[1];
const roundPad = DEMO_CHARGERS[0];
const squarePad = DEMO_CHARGERS[1];

function deviceParams(d: (typeof DEMO_DEVICES)[number]): Params {
  return { deviceWidth: d.width_mm, deviceLength: d.length_mm, deviceThickness: d.thickness_mm, caseAllowance: d.case_allowance_mm };
}
function insertNotes(d: (typeof DEMO_DEVICES)[number], pad: (typeof DEMO_CHARGERS)[number], stock: string, thickness: number, clearance: number, text: string): FitNotes {
  return {
    device: { name: d.name, width: d.width_mm, length: d.length_mm, thickness: d.thickness_mm, cased: d.case_allowance_mm > 0 },
    clearancePerSide: clearance,
    charger: { name: pad.name, shape: pad.shape, width: pad.width_mm, length: pad.length_mm, thickness: pad.thickness_mm, rangeMin: pad.range_min_mm, rangeMax: pad.range_max_mm },
    stock: { material: stock, thickness },
    bitDiameter: 6.35,
    grain: 'along-length',
    text,
  };
}

interface DemoRevision {
  generatorId?: string;
  params?: Params;
  model?: makerjs.IModel;
  message: string;
  status: RevisionStatus;
  fitNotes?: FitNotes;
}
interface DemoDesign {
  kind: 'insert' | 'jig' | 'template';
  title: string;
  description: string;
  tags: string[];
  material: string;
  revisions: DemoRevision[];
}

const bedsideBase: Params = {
  openingWidth: 130, openingLength: 210, plateThickness: 12, stock: 'plywood', ...deviceParams(phoneS),
  padShape: 'round', padDiameter: roundPad.width_mm, padThickness: roundPad.thickness_mm, skinThickness: 2.5,
  ratedRange: true, ratedMin: roundPad.range_min_mm!, ratedMax: roundPad.range_max_mm!, pocketDepth: 3, pocketClearance: 1, fitClearance: 0.4,
};

const DEMO_DESIGNS: DemoDesign[] = [
  {
    kind: 'insert',
    title: 'Bedside charger plate',
    description: 'Drop-in plate for the nightstand top: phone pocket above, round pad below, cord out the back.',
    tags: ['charger', 'nightstand'],
    material: 'walnut',
    revisions: [
      { generatorId: 'charger-insert', params: bedsideBase, message: 'Plywood test piece for the small phone', status: 'trial', fitNotes: insertNotes(phoneS, roundPad, 'birch plywood', 12, 1, 'Test cut: plate dropped in with an even gap; the phone sits in its pocket with room to lift it out.') },
      { generatorId: 'charger-insert', params: { ...bedsideBase, stock: 'black-walnut', cut: 'quartersawn', fitClearance: 0.6 }, message: 'Walnut, quartersawn; more clearance for seasonal movement', status: 'proven', fitNotes: insertNotes(phoneS, roundPad, 'black walnut', 12, 1, 'Plate fits the opening in winter and summer.') },
      { generatorId: 'charger-insert', params: { ...bedsideBase, stock: 'black-walnut', cut: 'quartersawn', fitClearance: 0.6, ...deviceParams(phoneL), openingWidth: 140, openingLength: 220 }, message: 'Regenerated for the large phone', status: 'draft', fitNotes: insertNotes(phoneL, roundPad, 'black walnut', 12, 1, '') },
    ],
  },
  {
    kind: 'insert',
    title: 'Desk dock insert',
    description: 'Square-pad insert for the writing desk, square pocket corners with dogbones.',
    tags: ['charger', 'desk'],
    material: 'white oak',
    revisions: [
      { generatorId: 'charger-insert', params: { ...bedsideBase, ...deviceParams(phoneL), openingWidth: 150, openingLength: 230, padShape: 'rect', padWidth: 72, padLength: 72, padThickness: 7.5, ratedMin: 1, ratedMax: 5, stock: 'white-oak', cornerStyle: 'dogbone', plateThickness: 16, pocketClearance: 0.5 }, message: 'First draw', status: 'trial', fitNotes: insertNotes(phoneL, squarePad, 'white oak', 16, 0.5, 'The phone pocket came out tight on the long sides.') },
      { generatorId: 'charger-insert', params: { ...bedsideBase, ...deviceParams(phoneL), openingWidth: 150, openingLength: 230, padShape: 'rect', padWidth: 72, padLength: 72, padThickness: 7.5, ratedMin: 1, ratedMax: 5, stock: 'white-oak', cornerStyle: 'dogbone', plateThickness: 16, pocketClearance: 0.8, fitClearance: 0.7 }, message: 'Opened the pocket clearance to 0.8 mm and the plate fit to 0.7 mm', status: 'proven', fitNotes: insertNotes(phoneL, squarePad, 'white oak', 16, 0.8, 'Good fit: the phone lifts out easily, the plate sits flush.') },
      { generatorId: 'charger-insert', params: { ...bedsideBase, ...deviceParams(DEMO_DEVICES[2]), openingWidth: 150, openingLength: 230, padShape: 'rect', padWidth: 72, padLength: 72, padThickness: 7.5, ratedMin: 1, ratedMax: 5, stock: 'white-oak', cornerStyle: 'dogbone', plateThickness: 16, pocketClearance: 0.8, fitClearance: 0.7 }, message: 'Rugged case needs a bigger pocket', status: 'draft', fitNotes: insertNotes(DEMO_DEVICES[2], squarePad, 'white oak', 16, 0.8, '') },
    ],
  },
  {
    kind: 'jig',
    title: 'Leg taper sled',
    description: 'Sled for tapering table legs on the table saw.',
    tags: ['taper', 'table saw'],
    material: 'MDF',
    revisions: [
      { generatorId: 'taper-jig', params: { wideEnd: 50.8, narrowEnd: 25.4, taperLength: 609.6, edges: 'one' }, message: 'Two inches to one over two feet', status: 'trial' },
      { generatorId: 'taper-jig', params: { wideEnd: 50.8, narrowEnd: 25.4, taperLength: 609.6, edges: 'two' }, message: 'Split the taper over two edges', status: 'proven' },
      { generatorId: 'taper-jig', params: { wideEnd: 45, narrowEnd: 28, taperLength: 560, edges: 'two' }, message: 'Side-table legs', status: 'draft' },
    ],
  },
  {
    kind: 'jig',
    title: 'Hexagon planter bevels',
    description: 'Six splayed sides at 30°: blade tilt, miter gauge and panel outline.',
    tags: ['bevel', 'planter'],
    material: 'cedar',
    revisions: [{ generatorId: 'splayed-box', params: { sides: 6, splay: 30 }, message: 'First planter', status: 'proven' }],
  },
  {
    kind: 'template',
    title: 'Stretcher crossing half-lap',
    description: 'Layout template for two stretchers crossing under a coffee table.',
    tags: ['half-lap', 'layout'],
    material: 'hardboard',
    revisions: [
      { generatorId: 'half-lap', params: { angle: 90 }, message: 'Square crossing', status: 'proven' },
      { generatorId: 'half-lap', params: { angle: 70 }, message: 'Crossing at 70°', status: 'trial' },
    ],
  },
  {
    kind: 'template',
    title: 'Cord grommet template',
    description: 'Hand-router template: 60 mm grommet hole and a slot for the plug.',
    tags: ['cord', 'grommet'],
    material: 'acrylic',
    revisions: [{ model: grommetTemplate(), message: 'Uploaded from the shop drawing', status: 'proven' }],
  },
];

function grommetTemplate(): makerjs.IModel {
  const plate = new makerjs.models.RoundRectangle(120, 100, 8);
  const hole: makerjs.IModel = { paths: { hole: new makerjs.paths.Circle([60, 55], 30) }, layer: 'outline' };
  const slot = makerjs.model.move(new makerjs.models.Slot([0, 0], [0, 25], 7), [60, 10]);
  return { models: { plate: { ...plate, layer: 'outline' }, hole, slot: { ...slot, layer: 'outline' } } };
}

export async function seedDemoLibrary(deps: Deps, seed: SeedResult): Promise<{ created: number }> {
  const existing = await deps.db.selectFrom('designs').select('id').where('shop_id', '=', seed.shopId).limit(1).execute();
  if (existing.length) return { created: 0 };
  const author = seed.users['editor@larchmere.example'];
  const ids: Record<string, { designId: string; revisionIds: string[] }> = {};
  for (const d of DEMO_DESIGNS) {
    const design = await insertDesign(deps.db, seed.shopId, author, { kind: d.kind, title: d.title, description: d.description, tags: d.tags, material: d.material });
    await logActivity(deps.db, { shopId: seed.shopId, designId: design.id, actorId: author, action: 'design.created', detail: { title: d.title } });
    ids[d.title] = { designId: design.id, revisionIds: [] };
    for (const r of d.revisions) {
      let model: makerjs.IModel;
      let summary;
      let params: Params | null = null;
      if (r.generatorId) {
        const run = runGenerator(r.generatorId, r.params ?? {});
        if (!run.ok) throw new Error(`demo ${d.title}: ${run.message} ${JSON.stringify(run.fields)}`);
        model = run.result.model;
        summary = run.result.summary;
        params = run.params;
      } else {
        model = r.model!;
        summary = summarizeModel(model);
      }
      const saved = await saveRevision(deps, design.id, {
        authorId: author,
        source: r.generatorId ? 'generated' : 'uploaded',
        generatorId: r.generatorId ?? null,
        params,
        message: r.message,
        status: r.status,
        fitNotes: r.fitNotes ?? {},
        model,
        summary,
        title: d.title,
        original: r.generatorId ? undefined : { body: Buffer.from(modelToDxf(model, 'mm')), contentType: 'application/dxf', ext: 'dxf' },
        activity: { action: r.generatorId ? 'revision.generated' : 'revision.uploaded' },
      });
      ids[d.title].revisionIds.push(saved.id);
    }
  }
  await seedDemoCuts(deps, seed, ids['Bedside charger plate'].revisionIds, ids['Desk dock insert'].revisionIds);
  // One fork: the demo editor (member of both shops) forks the taper sled r2 into the second shop.
  const sled = ids['Leg taper sled'];
  const { loadRevisionForCopy } = await import('../revisions/repository');
  const rev = (await loadRevisionForCopy(deps, sled.revisionIds[1]))!;
  await saveRevision(
    deps,
    async (tx) => {
      const f = await insertDesign(tx, seed.secondShopId, author, { kind: 'jig', title: 'Leg taper sled', description: 'Forked for the makerspace saw.', tags: ['taper', 'table saw'], material: 'MDF' }, { designId: sled.designId, revisionId: rev.id });
      await logActivity(tx, { shopId: seed.shopId, designId: sled.designId, revisionId: rev.id, actorId: author, action: 'design.forked', detail: { into: 'Otterbrook Makerspace', number: 2, forkId: f.id } });
      return f.id;
    },
    { authorId: author, source: 'generated', generatorId: rev.generatorId, params: rev.params, message: 'Forked from Leg taper sled r2 (Larchmere Workshop)', status: 'draft', fitNotes: {}, model: rev.model, summary: rev.summary, title: 'Leg taper sled', activity: { action: 'design.created-as-fork', detail: { from: 'Leg taper sled', fromNumber: 2, fromShop: 'Larchmere Workshop' } } },
  );
  return { created: DEMO_DESIGNS.length + 1 };
}

// A few invented test cuts so the fit history has something to suggest from. Their clearance is the
// device's in its pocket, per side, as the fit notes and the cut log record it.
async function seedDemoCuts(deps: Deps, seed: SeedResult, bedside: string[], desk: string[]) {
  const author = seed.users['editor@larchmere.example'];
  const rows = [
    { revision_id: bedside[0], cut_on: '2026-09-12', material: 'birch plywood', clearance_mm: 1, result: 'good' as const, device_key: phoneS.name },
    { revision_id: desk[0], cut_on: '2026-10-03', material: 'white oak', clearance_mm: 0.5, result: 'tight' as const, device_key: phoneL.name },
    { revision_id: desk[1], cut_on: '2026-10-10', material: 'white oak', clearance_mm: 0.8, result: 'good' as const, device_key: phoneL.name },
  ];
  await deps.db
    .insertInto('cut_logs')
    .values(rows.map((r) => ({ ...r, shop_id: seed.shopId, author_id: author, bit_mm: 6.35, machine_note: 'hobby CNC, 2 passes' })))
    .execute();
}

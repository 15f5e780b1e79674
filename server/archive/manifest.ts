// The shop archive's manifest.json (format documented in DEVELOPERS.md, "Shop archive format").
// One schema for both directions: export writes exactly this, import accepts only this.
import { z } from 'zod';
import { DESIGN_KINDS, FitNotes, REVISION_STATUSES } from '../../shared/schemas/library';
import { CUT_RESULTS } from '../../shared/schemas/cuts';
import { GeometrySummary } from '../../shared/schemas/geometry';

export const ARCHIVE_FORMAT = 'jigwright.shop-archive';
export const ARCHIVE_SCHEMA_VERSION = 1;
export const MANIFEST_NAME = 'manifest.json';
export const CHECKSUMS_NAME = 'SHA256SUMS';
/** The four files every revision keeps (server/revisions/geometry.ts); an upload adds `original`. */
export const REQUIRED_ROLES = ['dxf', 'dxf_in', 'svg', 'model'] as const;
export const FILE_ROLES = [...REQUIRED_ROLES, 'original'] as const;

const text = (max: number) => z.string().max(max);
const id = z.uuid();
const when = z.iso.datetime({ offset: true });
/** A path inside the archive: relative, forward slashes, no "." or ".." segments, no odd characters. */
export const ArchivePath = z
  .string()
  .max(240)
  .regex(/^[A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*$/, 'is not a plain relative path')
  .refine((p) => !p.split('/').some((s) => s === '.' || s === '..'), 'climbs out of the archive');

const Person = z.strictObject({ id: id.nullable(), name: text(200) }).nullable();

export const ArchiveFile = z.strictObject({
  path: ArchivePath,
  contentType: z.string().regex(/^[\w.+-]+\/[\w.+-]+$/).max(100),
  bytes: z.number().int().min(0).max(2 ** 31 - 1),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});
export type ArchiveFile = z.infer<typeof ArchiveFile>;

export const ArchiveDesign = z.strictObject({
  id,
  kind: z.enum(DESIGN_KINDS),
  title: text(500).min(1),
  description: text(20_000),
  tags: z.array(text(100)).max(100),
  material: text(200),
  author: Person,
  createdAt: when,
  updatedAt: when,
  latestRevisionNumber: z.number().int().min(0),
  latestStatus: z.enum(REVISION_STATUSES),
  /** Where the design was forked from: a design in this archive (inArchive) or, in words, one outside it. */
  forkedFrom: z
    .strictObject({
      inArchive: z.boolean(),
      designId: id.nullable(),
      revisionId: id.nullable(),
      revisionNumber: z.number().int().min(1).nullable(),
      title: text(500).nullable(),
      shopName: text(200).nullable(),
      text: text(1000),
    })
    .nullable(),
});
export type ArchiveDesign = z.infer<typeof ArchiveDesign>;

export const ArchiveRevision = z.strictObject({
  id,
  designId: id,
  number: z.number().int().min(1),
  message: text(5000),
  author: Person,
  createdAt: when,
  source: z.enum(['generated', 'uploaded']),
  generatorId: text(100).nullable(),
  params: z.record(z.string().max(100), z.union([z.number(), z.string().max(1000), z.boolean()])).nullable(),
  status: z.enum(REVISION_STATUSES),
  // Checked against the schemas the API saves them with, and kept exactly as written.
  fitNotes: z.record(z.string(), z.unknown()).refine((v) => FitNotes.safeParse(v).success, 'are not valid fit notes'),
  summary: z.record(z.string(), z.unknown()).refine((v) => GeometrySummary.safeParse(v).success, 'is not a geometry summary'),
  units: z.enum(['mm', 'in']),
  files: z.array(ArchiveFile.extend({ role: z.enum(FILE_ROLES) })).min(1).max(FILE_ROLES.length),
});
export type ArchiveRevision = z.infer<typeof ArchiveRevision>;

export const ArchiveCutLog = z.strictObject({
  id,
  revisionId: id,
  cutOn: z.iso.date(),
  material: text(200),
  bitMm: z.number().finite(),
  machineNote: text(5000),
  deviceKey: text(500).nullable(),
  clearanceMm: z.number().finite().nullable(),
  measuredWidthMm: z.number().finite().nullable(),
  measuredLengthMm: z.number().finite().nullable(),
  result: z.enum(CUT_RESULTS),
  author: Person,
  createdAt: when,
  photo: ArchiveFile.nullable(),
});
export type ArchiveCutLog = z.infer<typeof ArchiveCutLog>;

const positive = z.number().finite().positive();
export const ArchiveDevice = z.strictObject({ name: text(200).min(1), widthMm: positive, lengthMm: positive, thicknessMm: positive, caseAllowanceMm: z.number().finite().min(0) });
export const ArchiveCharger = z.strictObject({
  name: text(200).min(1),
  shape: z.enum(['round', 'rect']),
  widthMm: positive,
  lengthMm: positive,
  thicknessMm: positive,
  rangeMinMm: z.number().finite().nullable(),
  rangeMaxMm: z.number().finite().nullable(),
});

export const ArchiveActivity = z.strictObject({
  designId: id.nullable(),
  revisionId: id.nullable(),
  action: text(100),
  actor: text(200).nullable(),
  detail: z.record(z.string(), z.unknown()),
  createdAt: when,
});

export const ArchiveManifest = z.strictObject({
  format: z.literal(ARCHIVE_FORMAT, { error: `This is not a Jigwright shop archive (its manifest's format is not "${ARCHIVE_FORMAT}")` }),
  schemaVersion: z.number().int(),
  exportedAt: when,
  app: z.strictObject({ name: text(100), version: text(50) }),
  shop: z.strictObject({ id, name: text(200), slug: text(200) }),
  counts: z.strictObject({
    designs: z.number().int().min(0),
    revisions: z.number().int().min(0),
    files: z.number().int().min(0),
    cutLogs: z.number().int().min(0),
    photos: z.number().int().min(0),
    devices: z.number().int().min(0),
    chargers: z.number().int().min(0),
    activity: z.number().int().min(0),
  }),
  designs: z.array(ArchiveDesign).max(100_000),
  revisions: z.array(ArchiveRevision).max(1_000_000),
  cutLogs: z.array(ArchiveCutLog).max(1_000_000),
  devices: z.array(ArchiveDevice).max(10_000),
  chargers: z.array(ArchiveCharger).max(10_000),
  activity: z.array(ArchiveActivity).max(2_000_000),
});
export type ArchiveManifest = z.infer<typeof ArchiveManifest>;

/** A file-name-safe short form of a title: "Bedside charger plate" → "bedside-charger-plate". */
export function slugOf(title: string): string {
  return (
    title
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .replace(/[\s_]+/g, '-')
      .replace(/-+/g, '-')
      .toLowerCase()
      .slice(0, 40)
      .replace(/^-+|-+$/g, '') || 'design'
  );
}

/** Names inside the archive, readable when it is unpacked by hand. */
export const FILE_NAME: Record<(typeof FILE_ROLES)[number], (base: string, ext: string) => string> = {
  dxf: (b) => `${b}-mm.dxf`,
  dxf_in: (b) => `${b}-in.dxf`,
  svg: (b) => `${b}-preview.svg`,
  model: (b) => `${b}-model.json`,
  original: (b, ext) => `${b}-original.${ext}`,
};

/**
 * Everything wrong with a manifest beyond its shape: unknown references, duplicate ids or paths,
 * numbering with gaps, counts that do not match. Empty when the manifest is consistent.
 */
export function manifestProblems(m: ArchiveManifest): string[] {
  const problems: string[] = [];
  const designs = new Map<string, ArchiveDesign>();
  for (const d of m.designs) {
    if (designs.has(d.id)) problems.push(`design ${d.id} is listed twice`);
    designs.set(d.id, d);
  }
  const revisions = new Map<string, ArchiveRevision>();
  const numbers = new Map<string, number[]>();
  const paths = new Set<string>();
  const addPath = (p: string) => {
    if (p === MANIFEST_NAME || p === CHECKSUMS_NAME || paths.has(p)) problems.push(`the path ${p} is used twice`);
    paths.add(p);
  };
  for (const r of m.revisions) {
    if (revisions.has(r.id)) problems.push(`revision ${r.id} is listed twice`);
    revisions.set(r.id, r);
    if (!designs.has(r.designId)) problems.push(`revision ${r.id} belongs to design ${r.designId}, which is not in the archive`);
    numbers.set(r.designId, [...(numbers.get(r.designId) ?? []), r.number]);
    const roles = new Set(r.files.map((f) => f.role));
    if (roles.size !== r.files.length) problems.push(`revision ${r.id} lists a file role twice`);
    for (const role of REQUIRED_ROLES) if (!roles.has(role)) problems.push(`revision ${r.id} (r${r.number}) has no ${role} file`);
    for (const f of r.files) addPath(f.path);
  }
  for (const d of m.designs) {
    const n = (numbers.get(d.id) ?? []).sort((a, b) => a - b);
    if (n.some((x, i) => x !== i + 1)) problems.push(`design ${d.id} has revisions numbered ${n.join(', ')}, not 1 to ${n.length}`);
    if (d.latestRevisionNumber !== n.length) problems.push(`design ${d.id} says its newest revision is r${d.latestRevisionNumber} but has ${n.length}`);
    const f = d.forkedFrom;
    if (f?.inArchive) {
      if (!f.designId || !designs.has(f.designId)) problems.push(`design ${d.id} is forked from ${f.designId}, which is not in the archive`);
      else if (f.designId === d.id) problems.push(`design ${d.id} is forked from itself`);
      if (f.revisionId && revisions.get(f.revisionId)?.designId !== f.designId) problems.push(`design ${d.id} is forked from revision ${f.revisionId}, which is not a revision of its source`);
    }
  }
  const cuts = new Set<string>();
  for (const c of m.cutLogs) {
    if (cuts.has(c.id)) problems.push(`cut log ${c.id} is listed twice`);
    cuts.add(c.id);
    if (!revisions.has(c.revisionId)) problems.push(`cut log ${c.id} is for revision ${c.revisionId}, which is not in the archive`);
    if (c.photo) {
      addPath(c.photo.path);
      if (!/^image\/(jpeg|png)$/.test(c.photo.contentType)) problems.push(`the photo of cut log ${c.id} is ${c.photo.contentType}, not JPEG or PNG`);
    }
  }
  for (const a of m.activity) {
    if (a.designId && !designs.has(a.designId)) problems.push(`an activity entry names design ${a.designId}, which is not in the archive`);
    if (a.revisionId && !revisions.has(a.revisionId)) problems.push(`an activity entry names revision ${a.revisionId}, which is not in the archive`);
  }
  const files = m.revisions.reduce((s, r) => s + r.files.length, 0);
  const photos = m.cutLogs.filter((c) => c.photo).length;
  const counted = { designs: m.designs.length, revisions: m.revisions.length, files, cutLogs: m.cutLogs.length, photos, devices: m.devices.length, chargers: m.chargers.length, activity: m.activity.length };
  for (const [k, v] of Object.entries(counted)) {
    if (m.counts[k as keyof typeof counted] !== v) problems.push(`counts.${k} says ${m.counts[k as keyof typeof counted]} but the manifest lists ${v}`);
  }
  return problems;
}

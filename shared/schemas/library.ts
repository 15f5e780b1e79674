import { z } from 'zod';
import { GeometrySummary } from './geometry';

export const DESIGN_KINDS = ['insert', 'jig', 'template'] as const;
export const DesignKind = z.enum(DESIGN_KINDS);
export type DesignKind = z.infer<typeof DesignKind>;

/** The life of a cut file, in our own words. */
export const REVISION_STATUSES = ['draft', 'trial', 'proven', 'retired'] as const;
export const RevisionStatus = z.enum(REVISION_STATUSES);
export type RevisionStatus = z.infer<typeof RevisionStatus>;
export const STATUS_LABEL: Record<RevisionStatus, string> = {
  draft: 'Draft',
  trial: 'Trial cut',
  proven: 'Shop-proven',
  retired: 'Retired',
};
export const STATUS_HELP: Record<RevisionStatus, string> = {
  draft: 'Drawn, not cut yet',
  trial: 'Being tried in scrap or plywood',
  proven: 'Fits; cut it in the good stock',
  retired: 'Kept for the record; do not cut',
};

const mm = (label: string, max = 3000) =>
  z.number({ error: `${label} must be a number (mm)` }).positive(`${label} must be more than 0 mm`).max(max, `${label} must be at most ${max} mm`);

/** What a revision fits, in millimetres. Every part is optional; present parts are checked. */
export const FitNotes = z
  .strictObject({
    device: z
      .strictObject({
        name: z.string().trim().max(120).optional(),
        width: mm('Device width', 1000),
        length: mm('Device length', 1000),
        thickness: mm('Device thickness', 200),
        cased: z.boolean(),
      })
      .optional(),
    clearancePerSide: z.number().min(0, 'Clearance cannot be negative').max(20, 'Clearance above 20 mm per side is not a fit').optional(),
    charger: z
      .strictObject({
        name: z.string().trim().max(120).optional(),
        shape: z.enum(['round', 'rect']),
        width: mm('Pad width', 500),
        length: mm('Pad length', 500),
        thickness: mm('Pad thickness', 100),
        rangeMin: z.number().min(0).max(50).optional(),
        rangeMax: z.number().min(0).max(50).optional(),
      })
      .refine((c) => c.rangeMin === undefined || c.rangeMax === undefined || c.rangeMin <= c.rangeMax, {
        message: 'The rated range must run from low to high',
        path: ['rangeMax'],
      })
      .optional(),
    stock: z.strictObject({ material: z.string().trim().min(1).max(80), thickness: mm('Stock thickness', 300) }).optional(),
    bitDiameter: mm('Bit diameter', 100).optional(),
    grain: z.enum(['along-length', 'along-width', 'none']).optional(),
    text: z.string().max(4000, 'Notes must be at most 4000 characters').optional(),
  })
  .default({});
export type FitNotes = z.infer<typeof FitNotes>;

const Tags = z
  .array(z.string().trim().toLowerCase().min(1).max(40, 'A tag must be at most 40 characters').regex(/^[\p{L}\p{N} _-]+$/u, 'Tags use letters, digits, spaces, - and _'))
  .max(20, 'At most 20 tags')
  .default([]);

export const CreateDesign = z.strictObject({
  kind: DesignKind,
  title: z.string().trim().min(1, 'Give the design a title').max(120, 'Title must be at most 120 characters'),
  description: z.string().max(4000).default(''),
  tags: Tags,
  material: z.string().trim().max(80).default(''),
});
export type CreateDesign = z.infer<typeof CreateDesign>;

export const UpdateDesign = CreateDesign.omit({ kind: true }).partial();

const RevisionMeta = {
  message: z.string().trim().min(1, 'Say what changed in this revision').max(500),
  status: RevisionStatus.default('draft'),
  fitNotes: FitNotes,
};

export const CreateGeneratedRevision = z.strictObject({
  generatorId: z.string().min(1).max(60),
  params: z.record(z.string(), z.union([z.number(), z.string(), z.boolean()])),
  ...RevisionMeta,
});
export type CreateGeneratedRevision = z.infer<typeof CreateGeneratedRevision>;

/** Text fields sent beside an uploaded file (multipart). fitNotes arrives as a JSON string. */
export const UploadRevisionFields = z.strictObject({
  message: RevisionMeta.message,
  status: RevisionMeta.status,
  fitNotes: z
    .string()
    .default('{}')
    .transform((s, ctx) => {
      try {
        return JSON.parse(s);
      } catch {
        ctx.addIssue({ code: 'custom', message: 'Fit notes are not valid JSON' });
        return z.NEVER;
      }
    })
    .pipe(FitNotes),
  units: z.enum(['mm', 'in']).optional(),
});

export const InspectUploadFields = z.strictObject({ units: z.enum(['mm', 'in']).optional() });

export const ChangeStatus = z.strictObject({ status: RevisionStatus });

export const ForkDesign = z.strictObject({
  revisionId: z.uuid('Pick a revision to fork'),
  targetShopId: z.uuid('Pick the shop to fork into'),
  title: z.string().trim().min(1).max(120).optional(),
});

export const Regenerate = z.strictObject({
  deviceId: z.uuid().optional(),
  device: z.record(z.string(), z.number()).optional(),
  message: z.string().trim().max(500).optional(),
}).refine((r) => r.deviceId || r.device, { message: 'Pick a device from the catalog or give its dimensions', path: ['deviceId'] });

export const LIBRARY_SORTS = ['updated', 'title', 'created'] as const;
export const LibraryQuery = z.strictObject({
  q: z.string().trim().max(200).optional(),
  kind: DesignKind.optional(),
  status: RevisionStatus.optional(),
  material: z.string().trim().max(80).optional(),
  tag: z.string().trim().toLowerCase().max(40).optional(),
  sort: z.enum(LIBRARY_SORTS).default('updated'),
  dir: z.enum(['asc', 'desc']).optional(),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export type LibraryQuery = z.infer<typeof LibraryQuery>;

export const DownloadQuery = z.strictObject({
  format: z.enum(['dxf', 'svg']).default('dxf'),
  units: z.enum(['mm', 'in']).default('mm'),
  link: z.enum(['1', '0']).optional(),
});

export const TemplateQuery = z.strictObject({
  paper: z.enum(['a4', 'letter']).default('a4'),
  units: z.enum(['mm', 'in']).default('mm'),
});

// Response shapes (what the API returns; the client reads these types).
export interface DesignListItem {
  id: string;
  kind: DesignKind;
  title: string;
  description: string;
  tags: string[];
  material: string;
  latestRevision: number;
  latestStatus: RevisionStatus;
  latestRevisionId: string | null;
  updatedAt: string;
  forkedFrom: { designId: string; title: string } | null;
}
export interface DesignPage {
  items: DesignListItem[];
  nextCursor: string | null;
}
export interface RevisionInfo {
  id: string;
  designId: string;
  number: number;
  message: string;
  author: { id: string; name: string } | null;
  createdAt: string;
  source: 'generated' | 'uploaded';
  generatorId: string | null;
  params: Record<string, number | string | boolean> | null;
  status: RevisionStatus;
  fitNotes: FitNotes;
  summary: GeometrySummary;
  files: { role: string; bytes: number; sha256: string }[];
}
export interface DesignDetail {
  id: string;
  shopId: string;
  shopName: string;
  kind: DesignKind;
  title: string;
  description: string;
  tags: string[];
  material: string;
  author: { id: string; name: string } | null;
  createdAt: string;
  updatedAt: string;
  forkedFrom: { designId: string; designTitle: string; shopName: string; revisionId: string | null; revisionNumber: number | null } | null;
  /** Lineage kept in words when the design came from a shop archive and its source was not in it. */
  forkedFromText?: string | null;
  forks: { designId: string; title: string; shopName: string; fromRevisionNumber: number | null }[];
  revisions: RevisionInfo[];
  activity: { id: string; action: string; actor: string | null; detail: Record<string, unknown>; createdAt: string }[];
}

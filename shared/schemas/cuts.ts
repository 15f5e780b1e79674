import { z } from 'zod';

export const CUT_RESULTS = ['tight', 'good', 'loose'] as const;
export const CutResult = z.enum(CUT_RESULTS);

/** A record that a revision was cut: what, with what, and how it fitted. Lengths in mm. */
export const CutLogInput = z.strictObject({
  cutOn: z.iso.date('Give the date as YYYY-MM-DD'),
  material: z.string().trim().min(1, 'Say what stock was cut').max(80),
  bitMm: z.number({ error: 'Bit diameter must be a number (mm)' }).positive('Bit diameter must be more than 0 mm').max(50),
  machineNote: z.string().max(1000).default(''),
  clearanceMm: z.number().min(0).max(20).optional(),
  measuredWidthMm: z.number().positive().max(2000).optional(),
  measuredLengthMm: z.number().positive().max(2000).optional(),
  result: CutResult,
});
export type CutLogInput = z.infer<typeof CutLogInput>;

/** Multipart variant (a photo may come with it): numbers arrive as text. */
export const CutLogFields = z.strictObject({
  cutOn: CutLogInput.shape.cutOn,
  material: CutLogInput.shape.material,
  bitMm: z.coerce.number().positive('Bit diameter must be more than 0 mm').max(50),
  machineNote: CutLogInput.shape.machineNote,
  clearanceMm: z.coerce.number().min(0).max(20).optional(),
  measuredWidthMm: z.coerce.number().positive().max(2000).optional(),
  measuredLengthMm: z.coerce.number().positive().max(2000).optional(),
  result: CutResult,
});

export const FitHistoryQuery = z.strictObject({
  device: z.string().trim().min(1).max(200),
  material: z.string().trim().min(1).max(80),
});

export interface CutLogEntry extends CutLogInput {
  id: string;
  revisionId: string;
  revisionNumber: number;
  deviceKey: string | null;
  author: string | null;
  hasPhoto: boolean;
}

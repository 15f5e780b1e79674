// The form beside an upload: change message, status and fit notes. Its checks are the shared
// FitNotes and upload schemas; this file only decides which optional parts are switched on.
import { zodResolver } from '@hookform/resolvers/zod';
import type { Control, Resolver, UseFormSetValue } from 'react-hook-form';
import { z } from 'zod';
import { FitNotes, RevisionStatus, UploadRevisionFields } from '../../shared/schemas/library';
import type { Length } from '../library/LengthBox';

export type { Length };

export interface RevisionFormValues {
  message: string;
  status: RevisionStatus;
  include: { device: boolean; charger: boolean; stock: boolean };
  fitNotes: {
    device: { name: string; width: Length; length: Length; thickness: Length; cased: boolean };
    clearancePerSide: Length;
    charger: { name: string; shape: 'round' | 'rect'; width: Length; length: Length; thickness: Length; rangeMin: Length; rangeMax: Length };
    stock: { material: string; thickness: Length };
    bitDiameter: Length;
    grain: '' | NonNullable<FitNotes['grain']>;
    text: string;
  };
}

export const emptyRevisionForm = (): RevisionFormValues => ({
  message: '',
  status: 'draft',
  include: { device: false, charger: false, stock: false },
  fitNotes: {
    device: { name: '', width: undefined, length: undefined, thickness: undefined, cased: false },
    clearancePerSide: undefined,
    charger: { name: '', shape: 'round', width: undefined, length: undefined, thickness: undefined, rangeMin: undefined, rangeMax: undefined },
    stock: { material: '', thickness: undefined },
    bitDiameter: undefined,
    grain: '',
    text: '',
  },
});

/** Start from an earlier revision's fit notes, so a new cut of the same part keeps them. */
export function formFromFitNotes(n: FitNotes | undefined): RevisionFormValues {
  const v = emptyRevisionForm();
  if (!n) return v;
  if (n.device) {
    v.include.device = true;
    v.fitNotes.device = { name: n.device.name ?? '', width: n.device.width, length: n.device.length, thickness: n.device.thickness, cased: n.device.cased };
  }
  if (n.charger) {
    v.include.charger = true;
    v.fitNotes.charger = { ...n.charger, name: n.charger.name ?? '', rangeMin: n.charger.rangeMin, rangeMax: n.charger.rangeMax };
  }
  if (n.stock) {
    v.include.stock = true;
    v.fitNotes.stock = { ...n.stock };
  }
  v.fitNotes.clearancePerSide = n.clearancePerSide;
  v.fitNotes.bitDiameter = n.bitDiameter;
  v.fitNotes.grain = n.grain ?? '';
  v.fitNotes.text = n.text ?? '';
  return v;
}

const blankToUndefined = (s: unknown) => (typeof s === 'string' && s.trim() === '' ? undefined : s);

/** Form values → the shape FitNotes checks: switched-off parts and empty boxes left out. */
export function toFitNotesInput(v: RevisionFormValues): Record<string, unknown> {
  const n = v.fitNotes;
  const out: Record<string, unknown> = {
    clearancePerSide: n.clearancePerSide,
    bitDiameter: n.bitDiameter,
    grain: blankToUndefined(n.grain),
    text: blankToUndefined(n.text),
  };
  if (v.include.device) out.device = { ...n.device, name: blankToUndefined(n.device.name) };
  // A round pad's length is its diameter too.
  if (v.include.charger) out.charger = { ...n.charger, name: blankToUndefined(n.charger.name), length: n.charger.shape === 'round' ? n.charger.width : n.charger.length };
  if (v.include.stock) out.stock = { ...n.stock, material: n.stock.material.trim() };
  for (const k of Object.keys(out)) if (out[k] === undefined) delete out[k];
  return out;
}

export const RevisionForm = z.preprocess(
  (raw) => {
    const v = raw as RevisionFormValues;
    return { message: v.message, status: v.status, fitNotes: toFitNotesInput(v) };
  },
  z.object({ message: UploadRevisionFields.shape.message, status: RevisionStatus, fitNotes: FitNotes }),
);
export type RevisionFormOutput = z.output<typeof RevisionForm>;

/**
 * Plain sentences for the few checks the shared schemas leave to zod's defaults (a blank stock
 * material, a missing choice). Messages the schemas give win over these.
 */
export const plainErrors: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === 'too_small' && issue.origin === 'string') return 'Fill this in';
  if (issue.code === 'too_big' && issue.origin === 'string') return `Use at most ${issue.maximum} characters`;
  if (issue.code === 'too_small' && issue.origin === 'number') return `Must be at least ${issue.minimum} mm`;
  if (issue.code === 'too_big' && issue.origin === 'number') return `Must be at most ${issue.maximum} mm`;
  if (issue.code === 'invalid_type' && issue.expected === 'number') return 'Enter a length in mm';
  if (issue.code === 'invalid_value') return 'Pick one of the choices';
  return undefined;
};

/** The form's resolver: the schema above, with the plain fallback messages. */
export const revisionFormResolver = zodResolver(RevisionForm as unknown as z.ZodType<RevisionFormOutput, RevisionFormValues>, {
  error: plainErrors,
}) as Resolver<RevisionFormValues, unknown, RevisionFormOutput>;

export type RevisionFormControl = Control<RevisionFormValues, unknown, RevisionFormOutput>;
export type RevisionFormSetValue = UseFormSetValue<RevisionFormValues>;

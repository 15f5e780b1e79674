// What changed between two revisions: parameters, fit notes and the geometry summary, with
// signed deltas (B − A) for numbers. Used by the compare view and after "regenerate".
import type { GeometrySummary } from './schemas/geometry';

export type Scalar = number | string | boolean | null;
export interface DiffRow {
  section: 'parameters' | 'fit notes' | 'geometry';
  key: string;
  a: Scalar;
  b: Scalar;
  /** B − A when both are numbers. */
  delta: number | null;
  /** 'mm' for lengths, 'mm2' for areas, null for counts and text. */
  unit: 'mm' | 'mm2' | null;
  changed: boolean;
}

export interface Comparable {
  params: Record<string, Scalar> | null;
  fitNotes: Record<string, unknown>;
  summary: GeometrySummary;
}

/** Flattens nested objects to dotted keys: { device: { width: 70 } } → { 'device.width': 70 }. */
export function flatten(obj: Record<string, unknown>, prefix = ''): Record<string, Scalar> {
  const out: Record<string, Scalar> = {};
  for (const [k, v] of Object.entries(obj ?? {})) {
    const key = prefix ? `${prefix}.${k}` : k;
    if (v && typeof v === 'object' && !Array.isArray(v)) Object.assign(out, flatten(v as Record<string, unknown>, key));
    else out[key] = Array.isArray(v) ? v.join(', ') : ((v as Scalar) ?? null);
  }
  return out;
}

function geometryFacts(s: GeometrySummary): Record<string, { v: number; unit: DiffRow['unit'] }> {
  const facts: Record<string, { v: number; unit: DiffRow['unit'] }> = {
    'extents.width': { v: s.extents.width, unit: 'mm' },
    'extents.height': { v: s.extents.height, unit: 'mm' },
    area: { v: s.area, unit: 'mm2' },
    perimeter: { v: s.perimeter, unit: 'mm' },
    closedContours: { v: s.closedContours, unit: null },
    openContours: { v: s.openContours, unit: null },
  };
  for (const [name, f] of Object.entries(s.features ?? {})) {
    facts[`${name}.width`] = { v: f.width, unit: 'mm' };
    facts[`${name}.height`] = { v: f.height, unit: 'mm' };
    if (f.depth !== undefined) facts[`${name}.depth`] = { v: f.depth, unit: 'mm' };
  }
  return facts;
}

// Numbers that are not lengths (counts, angles, moisture percentages); text and flags have no unit anyway.
const LENGTHLESS = /count|sides|angle|splay|^mc|percent|moisture/i;

function row(section: DiffRow['section'], key: string, a: Scalar, b: Scalar, unit: DiffRow['unit']): DiffRow {
  const numeric = typeof a === 'number' && typeof b === 'number';
  const delta = numeric ? round((b as number) - (a as number)) : null;
  const changed = numeric ? Math.abs(delta!) > 1e-9 : a !== b;
  return { section, key, a, b, delta, unit: numeric ? unit : null, changed };
}

const round = (x: number) => Math.round(x * 1e6) / 1e6;

export function compareRevisions(a: Comparable, b: Comparable): DiffRow[] {
  const rows: DiffRow[] = [];
  const pa = a.params ?? {};
  const pb = b.params ?? {};
  for (const k of union(Object.keys(pa), Object.keys(pb))) {
    rows.push(row('parameters', k, pa[k] ?? null, pb[k] ?? null, LENGTHLESS.test(k) ? null : 'mm'));
  }
  const fa = flatten(a.fitNotes);
  const fb = flatten(b.fitNotes);
  for (const k of union(Object.keys(fa), Object.keys(fb))) {
    rows.push(row('fit notes', k, fa[k] ?? null, fb[k] ?? null, LENGTHLESS.test(k) ? null : 'mm'));
  }
  const ga = geometryFacts(a.summary);
  const gb = geometryFacts(b.summary);
  for (const k of union(Object.keys(ga), Object.keys(gb))) {
    rows.push(row('geometry', k, ga[k]?.v ?? null, gb[k]?.v ?? null, (ga[k] ?? gb[k]).unit));
  }
  return rows;
}

function union(a: string[], b: string[]): string[] {
  return [...new Set([...a, ...b])];
}

// How the table of differences reads: values and signed deltas (B − A) in the chosen units.
import type { DiffRow, Scalar } from '../../shared/compare';
import { MM_PER_INCH, type LengthUnit } from '../../shared/units';

const MINUS = '−';

function signed(n: number, digits: number): string {
  // A real change too small for the usual figures gets up to two more, so it never reads as ±0.
  for (let extra = 0; extra < 2 && n !== 0 && Number(Math.abs(n).toFixed(digits)) === 0; extra++) digits++;
  const s = Math.abs(n).toFixed(digits);
  if (Number(s) === 0) return `±${s}`;
  return `${n > 0 ? '+' : MINUS}${s}`;
}

/** "+10.0 mm", "+0.394 in", "−120 mm²", "+2" (a count); null when there is no number to subtract. */
export function formatDelta(row: Pick<DiffRow, 'delta' | 'unit'>, units: LengthUnit): string | null {
  if (row.delta === null) return null;
  if (row.unit === 'mm') return units === 'in' ? `${signed(row.delta / MM_PER_INCH, 3)} in` : `${signed(row.delta, 1)} mm`;
  if (row.unit === 'mm2') return units === 'in' ? `${signed(row.delta / (MM_PER_INCH * MM_PER_INCH), 2)} in²` : `${signed(row.delta, 0)} mm²`;
  return signed(row.delta, Number.isInteger(row.delta) ? 0 : 2);
}

/** One side's value: a length in the units, an area, a count, or the text as stored. */
export function formatValue(v: Scalar, unit: DiffRow['unit'], units: LengthUnit): string {
  if (v === null) return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') {
    if (unit === 'mm') return units === 'in' ? `${(v / MM_PER_INCH).toFixed(3)} in` : `${round(v, 2)} mm`;
    if (unit === 'mm2') return units === 'in' ? `${(v / (MM_PER_INCH * MM_PER_INCH)).toFixed(2)} in²` : `${round(v, 0)} mm²`;
    return String(round(v, 3));
  }
  return v === '' ? '(empty)' : v;
}

const round = (v: number, digits: number) => String(Number(v.toFixed(digits)));

/** Changed rows first (keeping the server's order within each group). */
export function changedFirst(rows: DiffRow[]): DiffRow[] {
  return [...rows.filter((r) => r.changed), ...rows.filter((r) => !r.changed)];
}

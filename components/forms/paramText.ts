// What a number field shows and how typed text becomes a value. Lengths (unit 'mm') are shown
// and typed in the chosen display unit; everything else is a plain number.
import type { NumberParam } from '../../shared/params';
import { MM_PER_INCH, formatLength, inchFraction, parseLength } from '../../shared/units';
import type { DisplayUnits } from './useDisplayUnits';

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string };

const PLAIN_NUMBER = /^[-−]?(\d+(?:\.\d*)?|\.\d+)$/;

export const isLength = (d: NumberParam) => d.unit === 'mm';

/** Reads a number field's text: lengths through parseLength (fractions, unit suffixes), others as decimals. */
export function parseParamText(d: NumberParam, text: string, units: DisplayUnits): ParsedNumber {
  if (isLength(d)) {
    const r = parseLength(text, units);
    return r.ok ? { ok: true, value: r.mm } : r;
  }
  const s = text.trim();
  if (!s) return { ok: false, message: d.unit === 'count' ? 'Enter a whole number' : 'Enter a number' };
  if (!PLAIN_NUMBER.test(s)) return { ok: false, message: d.unit === 'count' ? 'Enter a whole number, like 4' : 'Enter a number, like 15 or 7.5' };
  return { ok: true, value: Number(s.replace('−', '-')) };
}

/**
 * The text a field shows for a stored value. Inches appear as a fraction when the value is an
 * exact sixty-fourth (19.05 mm → 3/4), otherwise as a decimal; the exact millimetres are kept
 * beside the text, so switching units never nudges a value.
 */
export function formatParamInput(d: NumberParam, value: number, units: DisplayUnits): string {
  if (!isLength(d)) return String(value);
  if (units === 'in') {
    const sixtyFourths = (value / MM_PER_INCH) * 64;
    if (Math.abs(sixtyFourths - Math.round(sixtyFourths)) < 1e-6) return inchFraction(value).replace(/"$/, '');
    return formatLength(value, 'in', { digits: 4 }).replace(/"$/, '');
  }
  return formatLength(value, 'mm', { digits: 3 }).replace(/ mm$/, '');
}

/** A value with its unit for help lines and messages: "40 mm", `1.575"`, "15°", "6 %". */
export function formatParamValue(d: NumberParam, value: number, units: DisplayUnits): string {
  if (isLength(d)) return formatLength(value, units, { digits: units === 'in' ? 3 : 2 });
  if (d.unit === 'deg') return `${value}°`;
  if (d.unit === 'percent') return `${value} %`;
  return String(value);
}

/** The short unit shown inside the field. */
export function unitSuffix(d: NumberParam, units: DisplayUnits): string {
  if (isLength(d)) return units === 'in' ? 'in' : 'mm';
  return d.unit === 'deg' ? '°' : d.unit === 'percent' ? '%' : '';
}

/** "40 mm – 300 mm" in the display unit. */
export function rangeText(d: NumberParam, units: DisplayUnits): string {
  return `${formatParamValue(d, d.min, units)} – ${formatParamValue(d, d.max, units)}`;
}

// The one units module. Everything Jigwright stores and computes is in millimetres; inches exist
// only at the edges (what the user types, what the screen shows).
// 1 in = 25.4 mm exactly: 16 CFR 500.19, from the 1959 international yard and pound agreement.

export const MM_PER_INCH = 25.4;

export type LengthUnit = 'mm' | 'in';
export const LENGTH_UNITS: readonly LengthUnit[] = ['mm', 'in'];

/** A length in `unit` as millimetres. */
export function toMm(value: number, unit: LengthUnit): number {
  // × 254 / 10 rather than × 25.4: 3/4 in comes out as 19.05, not 19.049999999999997.
  return unit === 'in' ? (value * 254) / 10 : value;
}

/** Millimetres as a length in `unit`. */
export function fromMm(mm: number, unit: LengthUnit): number {
  return unit === 'in' ? (mm * 10) / 254 : mm;
}

export type ParsedLength = { ok: true; mm: number } | { ok: false; message: string };

const SUFFIXES: [RegExp, LengthUnit][] = [
  [/\s*(mm|millimet(?:er|re)s?)$/i, 'mm'],
  [/\s*(in|inch|inches|"|”|″)$/i, 'in'],
];

const DECIMAL = /^(\d+(?:\.\d*)?|\.\d+)$/;
const FRACTION = /^(\d+)\/(\d+)$/;
const MIXED = /^(\d+)(?:\s*-\s*|\s+)(\d+)\/(\d+)$/;

/**
 * Reads what a user typed as a length: "12.5", "3/4", "1-1/2", "1 1/2", with an optional unit
 * suffix ("mm", "in", `"`) that overrides `unit`. Negative lengths are refused.
 */
export function parseLength(text: string, unit: LengthUnit): ParsedLength {
  let s = String(text ?? '').trim();
  if (!s) return { ok: false, message: 'Enter a length' };
  let u = unit;
  for (const [re, suffixUnit] of SUFFIXES) {
    if (re.test(s)) {
      s = s.replace(re, '').trim();
      u = suffixUnit;
      break;
    }
  }
  if (s.startsWith('-') || s.startsWith('−')) return { ok: false, message: 'A length cannot be negative' };
  // Kept as numerator / denominator so 3/4 in is 3 × 254 / 40 = 19.05 mm exactly as printed.
  let numerator: number | null = null;
  let denominator = 1;
  let m: RegExpMatchArray | null;
  if ((m = s.match(DECIMAL))) numerator = Number(m[1]);
  else if ((m = s.match(FRACTION))) {
    numerator = Number(m[1]);
    denominator = Number(m[2]);
  } else if ((m = s.match(MIXED))) {
    denominator = Number(m[3]);
    numerator = Number(m[1]) * denominator + Number(m[2]);
  }
  if (denominator === 0) return { ok: false, message: 'A fraction cannot have 0 below the line' };
  if (numerator === null || !Number.isFinite(numerator) || !Number.isFinite(denominator)) {
    return { ok: false, message: `Enter a length like ${u === 'in' ? '3/4, 1-1/2 or 0.75' : '12.5'}` };
  }
  return { ok: true, mm: u === 'in' ? (numerator * 254) / (denominator * 10) : numerator / denominator };
}

export interface FormatOptions {
  /** Inches only: show the nearest 1/64 as a fraction, e.g. 1-1/2". */
  fraction?: boolean;
  /** Decimal places (default 2 for mm, 3 for inches); trailing zeros are dropped. */
  digits?: number;
}

function trimmed(value: number, digits: number): string {
  const s = value.toFixed(digits);
  const t = s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  return t === '-0' ? '0' : t;
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** The nearest 1/64 in, reduced: 38.1 mm → 1-1/2", 19.05 mm → 3/4". */
export function inchFraction(mm: number): string {
  const sign = mm < 0 ? '-' : '';
  const sixtyFourths = Math.round((Math.abs(mm) / MM_PER_INCH) * 64);
  const whole = Math.floor(sixtyFourths / 64);
  let num = sixtyFourths % 64;
  if (num === 0) return `${whole === 0 ? '' : sign}${whole}"`;
  const g = gcd(num, 64);
  num /= g;
  const den = 64 / g;
  return whole === 0 ? `${sign}${num}/${den}"` : `${sign}${whole}-${num}/${den}"`;
}

/** A length in millimetres for display: "12.5 mm", `0.75"`, or with `fraction` `3/4"`. */
export function formatLength(mm: number, unit: LengthUnit, opts: FormatOptions = {}): string {
  if (unit === 'in') {
    if (opts.fraction) return inchFraction(mm);
    return `${trimmed(fromMm(mm, 'in'), opts.digits ?? 3)}"`;
  }
  return `${trimmed(mm, opts.digits ?? 2)} mm`;
}

/** A length inside a sentence, in millimetres; see `lengthText`. */
export interface LengthMark {
  readonly lengthMm: number;
}
export const len = (mm: number): LengthMark => ({ lengthMm: mm });

/** A sentence with lengths in it: as written in mm, and as a template a screen can fill in inches. */
export interface LengthText {
  message: string;
  /** The sentence with `{0}`, `{1}`, … where the lengths go. */
  template: string;
  lengthsMm: number[];
}

const isLengthMark = (v: unknown): v is LengthMark => typeof v === 'object' && v !== null && typeof (v as LengthMark).lengthMm === 'number';

/**
 * `lengthText\`The ${len(4)} skin is too thick\`` → message "The 4 mm skin is too thick", plus a
 * template so that the same sentence can be shown as "The 0.157" skin is too thick".
 */
export function lengthText(strings: TemplateStringsArray, ...values: unknown[]): LengthText {
  const braces = (x: string) => x.replace(/[{}]/g, (c) => c + c);
  let message = strings[0];
  let template = braces(strings[0]);
  const lengthsMm: number[] = [];
  values.forEach((v, i) => {
    if (isLengthMark(v)) {
      message += formatLength(v.lengthMm, 'mm');
      template += `{${lengthsMm.length}}`;
      lengthsMm.push(v.lengthMm);
    } else {
      message += String(v);
      template += braces(String(v));
    }
    message += strings[i + 1];
    template += braces(strings[i + 1]);
  });
  return { message, template, lengthsMm };
}

/** A sentence from `lengthText` in the reader's units; a plain message as it is. */
export function textInUnits(t: { message: string; template?: string; lengthsMm?: number[] }, unit: LengthUnit): string {
  if (unit === 'mm' || t.template === undefined || !t.lengthsMm) return t.message;
  const lengths = t.lengthsMm;
  return t.template.replace(/\{\{|\}\}|\{(\d+)\}/g, (m, i: string | undefined) => (i === undefined ? m[0] : formatLength(lengths[Number(i)] ?? NaN, unit)));
}

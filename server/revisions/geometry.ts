// The one bridge between stored files and the internal geometry (a makerjs model in mm).
import type makerjs from 'makerjs';
import { modelToDxf } from '../../files/dxf/export';
import { importDxf } from '../../files/dxf/import';
import { FileRejected } from '../../files/errors';
import { sniffUpload, uploadText } from '../../files/sniff';
import { MM_PER_INCH } from '../../shared/units';
import { importSvg } from '../../files/svg/import';
import { modelToSvg } from '../../files/svg/render';
import { summarizeModel } from '../../shared/geometry/summary';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import type { FileRole } from '../../db/schema';

export interface ImportedUpload {
  format: 'dxf' | 'svg';
  model: makerjs.IModel;
  summary: GeometrySummary;
  sourceUnits: string;
  unitsFrom: string;
  entityCounts: Record<string, number>;
  warnings: string[];
  /** Set when the part is implausibly small or large, the usual sign of a mm/inch mix-up. */
  sizeCheck?: SizeCheck;
}

/**
 * The size window outside which a part is flagged. Under 10 mm on its longest side is smaller than
 * any jig or insert we draw, and is what an inch drawing read as millimetres looks like (25.4×
 * too small); over 3050 mm is longer than the longest sheet goods commonly sold (10 ft; the usual
 * sheet is 2440 × 1220 mm, 8 × 4 ft: common practice, from memory), what a millimetre drawing read
 * as inches looks like (25.4× too large).
 */
export const PLAUSIBLE_SIZE_MM = { min: 10, max: 3050 } as const;

export interface SizeCheck {
  problem: 'tiny' | 'huge';
  widthMm: number;
  heightMm: number;
  /** What the part would measure in the other unit, when that one would be plausible. */
  otherUnits?: { units: 'mm' | 'in'; widthMm: number; heightMm: number };
}

const round = (v: number) => Math.round(v * 100) / 100;

/** Flags a part whose size suggests its units were read wrongly; never refuses it (a small part may be meant). */
export function checkSize(summary: GeometrySummary, sourceUnits: string): { check?: SizeCheck; warning?: string } {
  const { width, height } = summary.extents;
  const longest = Math.max(width, height);
  const plausible = (w: number, h: number) => Math.max(w, h) >= PLAUSIBLE_SIZE_MM.min && Math.max(w, h) <= PLAUSIBLE_SIZE_MM.max;
  const size = `${round(width)} × ${round(height)} mm`;
  if (longest < PLAUSIBLE_SIZE_MM.min) {
    const asInches = { units: 'in' as const, widthMm: round(width * MM_PER_INCH), heightMm: round(height * MM_PER_INCH) };
    const other = sourceUnits === 'mm' && plausible(asInches.widthMm, asInches.heightMm) ? asInches : undefined;
    return {
      check: { problem: 'tiny', widthMm: round(width), heightMm: round(height), otherUnits: other },
      warning: other
        ? `The part is only ${size}. If it was drawn in inches, send it again as inches: it would be ${other.widthMm} × ${other.heightMm} mm.`
        : `The part is only ${size}; check the file's units before cutting it.`,
    };
  }
  if (longest > PLAUSIBLE_SIZE_MM.max) {
    const asMm = { units: 'mm' as const, widthMm: round(width / MM_PER_INCH), heightMm: round(height / MM_PER_INCH) };
    const other = sourceUnits === 'in' && plausible(asMm.widthMm, asMm.heightMm) ? asMm : undefined;
    return {
      check: { problem: 'huge', widthMm: round(width), heightMm: round(height), otherUnits: other },
      warning: other
        ? `The part is ${size}, longer than a 3050 mm sheet. If it was drawn in millimetres, send it again as millimetres: it would be ${other.widthMm} × ${other.heightMm} mm.`
        : `The part is ${size}, longer than a 3050 mm sheet; check the file's units before cutting it.`,
    };
  }
  return {};
}

/**
 * The upload as text. DXF: UTF-8, else Latin-1 (older DXF files use a single-byte code page).
 * SVG is XML: without a byte-order mark or an encoding declaration it must be UTF-8 (W3C XML 1.0
 * §4.3.3, "it is a fatal error … to use an encoding other than UTF-8"), so other bytes are refused
 * unless the declaration names a Latin-1 family encoding.
 */
function textOf(body: Buffer, format: 'dxf' | 'svg'): string {
  const text = uploadText(body); // refuses empty and binary files; Latin-1 when not UTF-8
  if (format === 'dxf' || isUtf8(body)) return text;
  const declared = /^\s*<\?xml[^>]*\sencoding\s*=\s*["']([A-Za-z0-9._-]+)["']/.exec(body.subarray(0, 200).toString('latin1'))?.[1]?.toLowerCase();
  if (declared && /^(iso-8859-1|iso_8859-1|latin-?1|l1|windows-1252|cp1252)$/.test(declared)) return text;
  const at = firstBadUtf8(body);
  const where = at >= 0 ? ` (byte 0x${body[at].toString(16).toUpperCase().padStart(2, '0')} at position ${at + 1})` : '';
  throw new FileRejected(
    'not_text',
    `The SVG file is not valid UTF-8 text${where}${declared ? `, and Jigwright does not read its declared encoding "${declared.slice(0, 30)}"` : ' and does not declare another encoding'}. Save it as UTF-8 and upload it again.`,
  );
}

const UTF8 = new TextDecoder('utf-8', { fatal: true });
function isUtf8(b: Buffer): boolean {
  try {
    UTF8.decode(b);
    return true;
  } catch {
    return false;
  }
}

/** Index of the first byte that cannot start or continue a UTF-8 sequence (RFC 3629 §4), or −1. */
function firstBadUtf8(b: Buffer): number {
  for (let i = 0; i < b.length; ) {
    const c = b[i];
    const n = c < 0x80 ? 1 : c >= 0xc2 && c <= 0xdf ? 2 : c >= 0xe0 && c <= 0xef ? 3 : c >= 0xf0 && c <= 0xf4 ? 4 : 0;
    if (n === 0) return i;
    for (let k = 1; k < n; k++) if (i + k >= b.length || (b[i + k] & 0xc0) !== 0x80) return i;
    i += n;
  }
  return -1;
}

/** Sniffs and imports an uploaded file; throws the files/ errors (rejected, units needed). */
export function importUpload(body: Buffer, units?: 'mm' | 'in'): ImportedUpload {
  const format = sniffUpload(body);
  const text = textOf(body, format);
  const imported = format === 'dxf' ? importDxf(text, { units }) : importSvg(text);
  const summary = summarizeModel(imported.model);
  const size = checkSize(summary, String(imported.sourceUnits));
  return {
    format,
    model: imported.model,
    summary,
    sourceUnits: String(imported.sourceUnits),
    unitsFrom: String(imported.unitsFrom),
    entityCounts: imported.entityCounts,
    warnings: size.warning ? [...imported.warnings, size.warning] : imported.warnings,
    ...(size.check ? { sizeCheck: size.check } : {}),
  };
}

export interface RenderedFile {
  role: FileRole;
  body: Buffer;
  contentType: string;
  ext: string;
}

/** The files every revision keeps beside its row: DXF in mm and in inches, an SVG preview, the model. */
export function renderRevisionFiles(model: makerjs.IModel, title: string): RenderedFile[] {
  return [
    { role: 'dxf', body: Buffer.from(modelToDxf(model, 'mm')), contentType: 'application/dxf', ext: 'dxf' },
    { role: 'dxf_in', body: Buffer.from(modelToDxf(model, 'in')), contentType: 'application/dxf', ext: 'dxf' },
    { role: 'svg', body: Buffer.from(modelToSvg(model, { title })), contentType: 'image/svg+xml', ext: 'svg' },
    { role: 'model', body: Buffer.from(JSON.stringify(model)), contentType: 'application/json', ext: 'json' },
  ];
}

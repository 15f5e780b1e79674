// Decides what an upload is from its bytes alone: the sent content type and file name are never
// trusted. Only ASCII DXF and SVG are accepted; everything else gets a message that says what it
// looks like instead.
import { FileRejected } from './errors';

export type UploadKind = 'dxf' | 'svg';

/** Leading bytes of common non-drawing files, to name what was sent instead. */
const SIGNATURES: { bytes: number[]; name: string }[] = [
  { bytes: [0x89, 0x50, 0x4e, 0x47], name: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], name: 'a JPEG image' },
  { bytes: [0x47, 0x49, 0x46, 0x38], name: 'a GIF image' },
  { bytes: [0x25, 0x50, 0x44, 0x46], name: 'a PDF document' },
  { bytes: [0x50, 0x4b, 0x03, 0x04], name: 'a ZIP archive (or an office document)' },
  { bytes: [0x1f, 0x8b], name: 'a gzip-compressed file (a .svgz or .gz: unpack it first)' },
];

/** The sentinel that opens a binary DXF (Autodesk DXF Reference, "Binary DXF Files"). */
const BINARY_DXF = Buffer.from('AutoCAD Binary DXF', 'latin1');
const UTF8 = new TextDecoder('utf-8', { fatal: true });
const SNIFF_GROUPS = 64;

export function sniffUpload(buf: Buffer): UploadKind {
  const text = uploadText(buf);
  const start = text.replace(/^\s+/, '').slice(0, 4096);
  if (looksLikeSvg(start)) return 'svg';
  if (looksLikeDxf(start)) return 'dxf';
  const hint = start.startsWith('{') || start.startsWith('[') ? ' It looks like JSON.' : start.startsWith('<') ? ' It is XML or HTML without an <svg> root element.' : '';
  throw new FileRejected('unknown_format', `The file is neither an ASCII DXF nor an SVG drawing.${hint} Export the drawing as DXF or SVG and upload that.`);
}

/**
 * The upload as text: UTF-8 when it is valid UTF-8 (byte-order mark removed), otherwise Latin-1,
 * which older DXF files use (an SVG only when it declares it). Refuses empty and binary files. Importers should read this, not
 * `buf.toString('utf8')`, so Latin-1 files are not mangled.
 */
export function uploadText(buf: Buffer): string {
  if (buf.length === 0 || buf.every((b) => b === 0x20 || b === 0x09 || b === 0x0a || b === 0x0d)) {
    throw new FileRejected('empty', 'The file is empty.');
  }
  if (buf.subarray(0, BINARY_DXF.length).equals(BINARY_DXF)) {
    throw new FileRejected('binary_dxf', 'This is a binary DXF file, which is not supported; save it as ASCII DXF and upload that.');
  }
  for (const sig of SIGNATURES) {
    if (sig.bytes.every((b, i) => buf[i] === b)) throw new FileRejected('binary', `The file is ${sig.name}, not a DXF or SVG drawing.`);
  }
  if ((buf[0] === 0xff && buf[1] === 0xfe) || (buf[0] === 0xfe && buf[1] === 0xff)) {
    throw new FileRejected('not_text', 'The file is saved as UTF-16 text; save it as UTF-8 (or ASCII) and upload it again.');
  }
  if (buf.indexOf(0) >= 0) throw new FileRejected('binary', 'The file is binary (it contains NUL bytes), not a DXF or SVG text file.');
  // Text has no control characters other than tab, line ends, form feed and the old DOS end-of-file mark.
  for (let i = 0; i < buf.length; i++) {
    const b = buf[i];
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d && b !== 0x0c && b !== 0x1a) {
      throw new FileRejected('not_text', `The file is not text (it has a control character, byte ${b}, at position ${i + 1}).`);
    }
  }
  let text: string;
  try {
    text = UTF8.decode(buf);
  } catch {
    text = buf.toString('latin1');
    // XML without an encoding declaration is UTF-8 (W3C XML 1.0 §4.3.3); only a declared Latin-1 SVG may be read as such
    if (looksLikeSvg(text.replace(/^\s+/, '').slice(0, 4096)) && !/^\s*<\?xml[^>]*\bencoding\s*=\s*["'](iso-8859-1|latin-?1|windows-1252)["']/i.test(text)) {
      throw new FileRejected('not_text', 'The SVG file is not valid UTF-8 text, and it does not declare another encoding. Save it as UTF-8 and upload it again.');
    }
  }
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** An <svg> root: after an optional XML declaration, comments, processing instructions and DOCTYPE. */
function looksLikeSvg(start: string): boolean {
  let s = start;
  for (;;) {
    s = s.replace(/^\s+/, '');
    const prolog = /^(<\?[\s\S]*?\?>|<!--[\s\S]*?-->|<!DOCTYPE[^>[]*(\[[\s\S]*?\])?\s*>)/i.exec(s);
    if (!prolog) break;
    s = s.slice(prolog[0].length);
  }
  return /^<([A-Za-z_][\w.-]*:)?svg[\s>/]/.test(s);
}

/** DXF group-code structure: integer code lines alternating with values, reaching 0/SECTION (or 0/EOF). */
function looksLikeDxf(start: string): boolean {
  const lines = start.split(/\r\n|\r|\n/);
  for (let i = 0; i + 1 < lines.length && i < 2 * SNIFF_GROUPS; i += 2) {
    const code = lines[i].trim();
    if (!/^-?\d{1,6}$/.test(code)) return false;
    const value = lines[i + 1].trim();
    if (Number(code) === 0) return value === 'SECTION' || value === 'EOF';
    if (Number(code) !== 999) return false; // only comments may come before the first SECTION
  }
  return false;
}

// Invented hostile and broken drawing files for the bad-input suites. Each case names what is wrong
// with it, the reference it is checked against, and what the API must answer (status and the code
// the importer uses). DXF structure per the Autodesk DXF Reference (group codes, sections,
// POLYLINE…SEQEND, BLOCK…ENDBLK, $INSUNITS); SVG safety per the OWASP File Upload Cheat Sheet and
// the OWASP XSS Filter Evasion Cheat Sheet; XML entities per W3C XML 1.0 §4.2; text encodings per
// W3C XML 1.0 §4.3.3 and RFC 3629 (UTF-8).
import { arc, circle, dxfFile, line, rectLines } from './dxf';

export interface FileCase {
  label: string;
  body: Buffer;
  /** Expected HTTP status (default 400). */
  status?: number;
  /** Expected error.code, or a pattern for it. */
  code?: string | RegExp;
  /** The outside reference the case is checked against. */
  ref: string;
  /** Extra multipart fields (units…). */
  fields?: Record<string, string>;
}

const b = (s: string, enc: BufferEncoding = 'utf8') => Buffer.from(s, enc);
const good = dxfFile([...rectLines(120, 80), circle(60, 40, 10)], 4);
const DXF_REF = 'Autodesk DXF Reference (group codes, sections)';

/** A DXF with a BLOCKS section. */
export function dxfWithBlocks(blocks: { name: string; entities: string[] }[], entities: string[], insunits = 4): string {
  const header = `0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n${insunits}\n0\nENDSEC\n`;
  const blockText = blocks.map((bl) => `0\nBLOCK\n8\n0\n2\n${bl.name}\n70\n0\n10\n0\n20\n0\n30\n0\n3\n${bl.name}\n${bl.entities.join('')}0\nENDBLK\n8\n0\n`).join('');
  return `${header}0\nSECTION\n2\nBLOCKS\n${blockText}0\nENDSEC\n0\nSECTION\n2\nENTITIES\n${entities.join('')}0\nENDSEC\n0\nEOF\n`;
}
export const insert = (name: string, x = 0, y = 0, extra = '') => `0\nINSERT\n8\n0\n2\n${name}\n10\n${x}\n20\n${y}\n30\n0\n${extra}`;

/** LINE with raw group values, so non-numbers can be written. */
const rawLine = (x1: string, y1: string, x2: string, y2: string) => `0\nLINE\n8\n0\n10\n${x1}\n20\n${y1}\n30\n0\n11\n${x2}\n21\n${y2}\n31\n0\n`;

export function dxfCases(): FileCase[] {
  const cases: FileCase[] = [
    { label: 'empty file', body: Buffer.alloc(0), code: 'file_empty', ref: 'OWASP File Upload Cheat Sheet (validate content)' },
    { label: 'only blank lines', body: b('\n\n  \r\n\t\n'), code: 'file_empty', ref: 'OWASP File Upload Cheat Sheet' },
    { label: 'binary DXF sentinel', body: Buffer.concat([b('AutoCAD Binary DXF\r\n\x1a\x00'), Buffer.alloc(64, 7)]), code: 'file_binary_dxf', ref: 'Autodesk DXF Reference, "Binary DXF Files" (sentinel)' },
    { label: 'PNG sent as .dxf', body: Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), code: 'file_binary', ref: 'PNG signature (RFC 2083 §3.1)' },
    { label: 'JPEG sent as .dxf', body: Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46]), code: 'file_binary', ref: 'JPEG SOI marker (ITU T.81)' },
    { label: 'PDF sent as .dxf', body: b('%PDF-1.7\n%âãÏÓ\n1 0 obj\n'), code: 'file_binary', ref: 'PDF header (ISO 32000-1 §7.5.2)' },
    { label: 'ZIP sent as .dxf', body: Buffer.from([0x50, 0x4b, 0x03, 0x04, 20, 0, 0, 0]), code: 'file_binary', ref: 'ZIP local file header (PKWARE APPNOTE 4.3.7)' },
    { label: 'gzip sent as .dxf', body: Buffer.from([0x1f, 0x8b, 8, 0, 0, 0, 0, 0]), code: 'file_binary', ref: 'gzip member header (RFC 1952 §2.3)' },
    { label: 'UTF-16LE DXF (BOM FF FE)', body: Buffer.concat([Buffer.from([0xff, 0xfe]), b(good, 'utf16le')]), code: /file_(not_text|binary)/, ref: 'Unicode BOM (RFC 2781 §3.2)' },
    { label: 'UTF-16BE DXF (BOM FE FF)', body: Buffer.concat([Buffer.from([0xfe, 0xff]), Buffer.from(b(good, 'utf16le').swap16())]), code: /file_(not_text|binary)/, ref: 'Unicode BOM (RFC 2781 §3.2)' },
    { label: 'NUL byte inside a DXF', body: b(good.replace('ENTITIES', 'ENTI\u0000TIES')), code: 'file_binary', ref: 'OWASP File Upload Cheat Sheet (content checks)' },
    { label: 'control character (BEL) inside a DXF', body: b(good.replace('ENTITIES', 'ENTI\u0007TIES')), code: 'file_not_text', ref: 'ASCII control characters (ANSI X3.4)' },
    { label: 'JSON sent as .dxf', body: b('{"entities": [{"type": "LINE"}]}'), code: 'file_unknown_format', ref: 'RFC 8259 JSON' },
    { label: 'group code 12345 (not a DXF group code)', body: b(good.replace('0\nLINE\n8\n0\n', '0\nLINE\n12345\n7\n8\n0\n')), code: 'file_damaged_dxf', ref: `${DXF_REF}: group code value types` },
    { label: 'group code line is a word', body: b(good.replace('0\nLINE\n8\n0\n', '0\nLINE\nten\n0\n')), code: 'file_damaged_dxf', ref: DXF_REF },
    { label: 'seven-digit group code', body: b(good.replace('0\nLINE\n8\n0\n', '0\nLINE\n1000000\n0\n')), code: 'file_damaged_dxf', ref: DXF_REF },
    { label: 'negative group code -5 inside ENTITIES', body: b(good.replace('0\nLINE\n8\n0\n', '0\nLINE\n-5\n0\n')), code: 'file_damaged_dxf', ref: DXF_REF },
    { label: 'SECTION without its name', body: b('0\nSECTION\n0\nENTITIES\n0\nENDSEC\n0\nEOF\n'), code: 'file_damaged_dxf', ref: `${DXF_REF}: SECTION, 2 name` },
    { label: 'LAYER table without ENDTAB', body: b('0\nSECTION\n2\nTABLES\n0\nTABLE\n2\nLAYER\n0\nLAYER\n2\nCUT\n0\nENDSEC\n' + good.slice(good.indexOf('0\nSECTION\n2\nENTITIES'))), code: 'file_damaged_dxf', ref: `${DXF_REF}: TABLE…ENDTAB` },
    { label: 'POLYLINE without SEQEND', body: b(dxfFile(['0\nPOLYLINE\n8\n0\n66\n1\n70\n1\n', '0\nVERTEX\n8\n0\n10\n0\n20\n0\n', '0\nVERTEX\n8\n0\n10\n50\n20\n0\n', line(0, 0, 5, 5)])), code: 'file_damaged_dxf', ref: `${DXF_REF}: POLYLINE, VERTEX, SEQEND` },
    { label: 'BLOCK without ENDBLK', body: b('0\nSECTION\n2\nBLOCKS\n0\nBLOCK\n2\nA\n10\n0\n20\n0\n' + line(0, 0, 1, 1) + '0\nENDSEC\n0\nEOF\n'), code: 'file_damaged_dxf', ref: `${DXF_REF}: BLOCK…ENDBLK` },
    { label: 'ENDBLK without BLOCK', body: b('0\nSECTION\n2\nBLOCKS\n0\nENDBLK\n0\nENDSEC\n0\nEOF\n'), code: 'file_damaged_dxf', ref: `${DXF_REF}: BLOCK…ENDBLK` },
    { label: 'entity named __proto__', body: b(good.replace('0\nLINE\n', '0\n__proto__\n')), code: 'file_damaged_dxf', ref: 'OWASP Prototype Pollution Prevention Cheat Sheet' },
    { label: 'group code on the last line has no value', body: b(good.replace(/0\nEOF\n$/, '0\n')), code: /file_(truncated|damaged_dxf)/, ref: DXF_REF },
    { label: 'LINE without an end point', body: b(dxfFile(['0\nLINE\n8\n0\n10\n0\n20\n0\n30\n0\n'])), code: 'file_damaged_dxf', ref: `${DXF_REF}: LINE 11/21 end point` },
    { label: 'coordinate is NaN', body: b(dxfFile([rawLine('0', '0', 'NaN', '0')])), code: 'file_bad_coordinate', ref: 'IEEE 754 NaN; DXF real values' },
    { label: 'coordinate is a word', body: b(dxfFile([rawLine('0', '0', 'left', '0')])), code: 'file_bad_coordinate', ref: `${DXF_REF}: group 10 is a real` },
    { label: 'coordinate is Infinity', body: b(dxfFile([rawLine('0', '0', 'Infinity', '0')])), code: 'file_bad_coordinate', ref: 'IEEE 754 infinity' },
    { label: 'coordinate 1e308', body: b(dxfFile([line(0, 0, 1e308, 0), line(1e308, 0, 0, 10)])), code: 'file_bad_coordinate', ref: 'IEEE 754 binary64 range (max ≈ 1.8e308)' },
    { label: 'coordinate -1e308', body: b(dxfFile([line(-1e308, 0, 0, 0)])), code: 'file_bad_coordinate', ref: 'IEEE 754 binary64 range' },
    { label: 'coordinate 1e400 (overflows to infinity)', body: b(dxfFile([rawLine('0', '0', '1e400', '0')])), code: 'file_bad_coordinate', ref: 'IEEE 754 overflow' },
    { label: 'coordinate 2 km (beyond ±1 km)', body: b(dxfFile([line(0, 0, 2e6, 0)])), code: 'file_bad_coordinate', ref: 'files/model/collector.ts coordinate limit' },
    { label: 'inch file whose part is 100 000 in (2.54 km) long', body: b(dxfFile([line(0, 0, 1e5, 0)], 1)), code: 'file_bad_coordinate', ref: '1 in = 25.4 mm exactly (16 CFR 500.19)' },
    { label: 'circle radius 1e308', body: b(dxfFile([circle(0, 0, 1e308)])), code: 'file_bad_coordinate', ref: `${DXF_REF}: CIRCLE 40 radius` },
    { label: 'arc start angle NaN', body: b(dxfFile([`0\nARC\n8\n0\n10\n0\n20\n0\n30\n0\n40\n5\n50\nNaN\n51\n90\n`])), code: 'file_bad_coordinate', ref: `${DXF_REF}: ARC 50/51 angles` },
    { label: 'LWPOLYLINE bulge NaN', body: b(dxfFile([`0\nLWPOLYLINE\n8\n0\n90\n2\n70\n0\n10\n0\n20\n0\n42\nNaN\n10\n10\n20\n0\n`])), code: 'file_bad_coordinate', ref: `${DXF_REF}: LWPOLYLINE 42 bulge` },
    { label: 'INSERT scaled by 1e308', body: b(dxfWithBlocks([{ name: 'PART', entities: [line(0, 0, 10, 0)] }], [insert('PART', 0, 0, '41\n1e308\n42\n1e308\n')])), code: 'file_bad_coordinate', ref: `${DXF_REF}: INSERT 41/42 scale` },
    { label: 'INSERT scaled by zero', body: b(dxfWithBlocks([{ name: 'PART', entities: [line(0, 0, 10, 0)] }], [insert('PART', 0, 0, '41\n0\n')])), code: 'file_degenerate_entity', ref: `${DXF_REF}: INSERT 41 scale` },
    { label: 'INSERT rotation NaN', body: b(dxfWithBlocks([{ name: 'PART', entities: [line(0, 0, 10, 0)] }], [insert('PART', 0, 0, '50\nNaN\n')])), code: 'file_bad_coordinate', ref: `${DXF_REF}: INSERT 50 rotation` },
    { label: 'MINSERT array of 200 × 200 copies', body: b(dxfWithBlocks([{ name: 'PART', entities: [line(0, 0, 10, 0)] }], [insert('PART', 0, 0, '70\n200\n71\n200\n44\n20\n45\n20\n')])), code: 'file_too_complex', ref: `${DXF_REF}: INSERT 70/71 columns and rows` },
    { label: 'block nested 9 deep (limit 8)', body: b(nestedBlocks(9)), code: 'file_nesting_too_deep', ref: `${DXF_REF}: nested INSERT in BLOCK` },
    { label: 'block that inserts itself', body: b(dxfWithBlocks([{ name: 'LOOP', entities: [line(0, 0, 1, 0), insert('LOOP')] }], [insert('LOOP')])), code: 'file_nesting_too_deep', ref: `${DXF_REF}: BLOCK` },
    { label: 'two blocks inserting each other', body: b(dxfWithBlocks([{ name: 'A', entities: [insert('B')] }, { name: 'B', entities: [insert('A')] }], [insert('A')])), code: 'file_nesting_too_deep', ref: `${DXF_REF}: BLOCK` },
    { label: 'INSERT of a block that is not defined', body: b(dxfWithBlocks([{ name: 'A', entities: [line(0, 0, 1, 1)] }], [insert('MISSING')])), code: 'file_missing_block', ref: `${DXF_REF}: INSERT 2 block name` },
    { label: '$INSUNITS 3 (miles)', body: b(dxfFile(rectLines(1, 1), 3)), code: 'file_unsupported_units', ref: `${DXF_REF}: $INSUNITS values` },
    { label: 'no $INSUNITS: units must be chosen first', body: b(dxfFile(rectLines(4, 2), null)), status: 422, code: 'units_needed', ref: `${DXF_REF}: $INSUNITS 0/missing = unitless` },
    { label: 'only TEXT, nothing to cut', body: b(dxfFile(['0\nTEXT\n8\n0\n10\n0\n20\n0\n40\n5\n1\nHello\n'])), code: 'file_no_geometry', ref: `${DXF_REF}: TEXT` },
    { label: 'only zero-length lines', body: b(dxfFile([line(5, 5, 5, 5), line(1, 1, 1, 1)])), code: 'file_zero_length', ref: 'common practice: a zero-length path cannot be cut' },
    { label: 'only paper-space entities', body: b(dxfFile([`0\nLINE\n67\n1\n8\n0\n10\n0\n20\n0\n11\n10\n21\n0\n`])), code: 'file_no_geometry', ref: `${DXF_REF}: group 67 paper space` },
    { label: 'circle not in the XY plane (extrusion 1,0,0)', body: b(dxfFile([`0\nCIRCLE\n8\n0\n10\n0\n20\n0\n30\n0\n40\n5\n210\n1\n220\n0\n230\n0\n`])), code: 'file_not_flat', ref: `${DXF_REF}: Object Coordinate Systems, arbitrary axis algorithm` },
    { label: 'units field "cm" (only mm or in)', body: b(dxfFile(rectLines(4, 2), null)), fields: { units: 'cm' }, code: 'invalid_input', ref: 'server schema InspectUploadFields/UploadRevisionFields' },
    { label: 'more entities than the importer reads (200 001 LINEs)', body: manyLines(200_001), code: 'file_too_many_entities', ref: 'files/dxf/import.ts DEFAULT_MAX_ENTITIES = 200 000' },
  ];
  // Truncated at several points: every cut loses the closing EOF (DXF Reference: a file ends with 0/EOF).
  const full = b(dxfFile([...rectLines(120, 80), arc(60, 40, 20, 0, 180), circle(30, 30, 5)], 4));
  for (const frac of [0.05, 0.2, 0.35, 0.5, 0.65, 0.8, 0.95]) {
    cases.push({ label: `DXF cut off at ${Math.round(frac * 100)} %`, body: full.subarray(0, Math.floor(full.length * frac)), code: /file_(truncated|damaged_dxf|unknown_format)/, ref: `${DXF_REF}: 0/EOF ends the file` });
  }
  return cases;
}

function nestedBlocks(depth: number): string {
  const blocks = [];
  for (let i = 0; i < depth; i++) blocks.push({ name: `B${i}`, entities: i === depth - 1 ? [line(0, 0, 10, 0)] : [insert(`B${i + 1}`)] });
  return dxfWithBlocks(blocks, [insert('B0')]);
}

function manyLines(n: number): Buffer {
  const one = line(0, 0, 1, 1);
  const header = '0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nSECTION\n2\nENTITIES\n';
  return Buffer.from(header + one.repeat(n) + '0\nENDSEC\n0\nEOF\n');
}

const svg = (inner: string, attrs = 'width="100mm" height="50mm" viewBox="0 0 100 50"') => `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" ${attrs}>${inner}</svg>`;
const rect = '<rect x="10" y="10" width="60" height="30"/>';
const OWASP_SVG = 'OWASP File Upload Cheat Sheet (SVG can carry scripts)';
const XSS = 'OWASP XSS Filter Evasion Cheat Sheet';

export function svgCases(): FileCase[] {
  const cases: FileCase[] = [
    { label: 'SVG with <script>', body: b(svg(`${rect}<script>alert(document.cookie)</script>`)), code: 'file_unsafe_svg', ref: OWASP_SVG },
    { label: 'SVG with CDATA <script>', body: b(svg(`${rect}<script type="text/ecmascript"><![CDATA[fetch("/api/me")]]></script>`)), code: 'file_unsafe_svg', ref: OWASP_SVG },
    { label: 'onload on the root', body: b(svg(rect, 'width="100mm" height="50mm" viewBox="0 0 100 50" onload="alert(1)"')), code: 'file_unsafe_svg', ref: `${XSS}: event handlers` },
    { label: 'onclick on a rect', body: b(svg('<rect x="1" y="1" width="9" height="9" onclick="alert(1)"/>')), code: 'file_unsafe_svg', ref: `${XSS}: event handlers` },
    { label: 'ONMOUSEOVER in capitals', body: b(svg('<rect x="1" y="1" width="9" height="9" ONMOUSEOVER="alert(1)"/>')), code: 'file_unsafe_svg', ref: `${XSS}: case variations` },
    { label: '<set> that adds an onclick handler', body: b(svg(`<rect x="1" y="1" width="9" height="9"><set attributeName="onclick" to="alert(1)"/></rect>`)), code: 'file_unsafe_svg', ref: `${XSS}: SVG animation setting event handlers` },
    { label: '<animate> that rewrites href to javascript:', body: b(svg(`<a href="#x"><animate attributeName="href" values="javascript:alert(1)"/>${rect}</a>`)), code: 'file_unsafe_svg', ref: `${XSS}: SVG animate href` },
    { label: 'javascript: link', body: b(svg(`<a href="javascript:alert(1)">${rect}</a>`)), code: 'file_unsafe_svg', ref: `${XSS}: javascript: URLs` },
    { label: 'javascript: link split by a tab', body: b(svg(`<a href="java\tscript:alert(1)">${rect}</a>`)), code: 'file_unsafe_svg', ref: `${XSS}: embedded tab` },
    { label: 'xlink:href to a local file', body: b(svg(`${rect}<use xlink:href="file:///etc/passwd#x"/>`)), code: 'file_unsafe_svg', ref: 'OWASP File Upload Cheat Sheet (external references)' },
    { label: '<image> from another site', body: b(svg(`${rect}<image href="http://tracker.invalid/pixel.png" width="1" height="1"/>`)), code: 'file_unsafe_svg', ref: 'OWASP File Upload Cheat Sheet (external references)' },
    { label: 'external entity <!ENTITY … SYSTEM>', body: b(`<?xml version="1.0"?>\n<!DOCTYPE svg [<!ENTITY xxe SYSTEM "file:///etc/passwd">]>\n${svg(`<text>&xxe;</text>${rect}`)}`), code: 'file_unsafe_svg', ref: 'W3C XML 1.0 §4.2.2 external entities; OWASP XXE Prevention Cheat Sheet' },
    { label: 'parameter entity <!ENTITY % …>', body: b(`<!DOCTYPE svg [<!ENTITY % remote SYSTEM "http://evil.invalid/x.dtd"> %remote;]>${svg(rect)}`), code: 'file_unsafe_svg', ref: 'W3C XML 1.0 §4.1 parameter-entity references' },
    { label: 'billion laughs (nested internal entities)', body: b(`<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol"><!ENTITY lol2 "&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;"><!ENTITY lol3 "&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;">]>${svg(`<text>&lol3;</text>${rect}`)}`), code: 'file_unsafe_svg', ref: 'W3C XML 1.0 §4.2 entity declarations; OWASP XXE Prevention Cheat Sheet (billion laughs)' },
    { label: 'DOCTYPE naming an outside DTD', body: b(`<!DOCTYPE svg PUBLIC "-//W3C//DTD SVG 1.1//EN" "http://www.w3.org/Graphics/SVG/1.1/DTD/svg11.dtd">${svg(rect)}`), code: 'file_unsafe_svg', ref: 'W3C XML 1.0 §2.8 document type declaration' },
    { label: '<?xml-stylesheet?> to another site', body: b(`<?xml-stylesheet href="http://evil.invalid/a.css"?>${svg(rect)}`), code: 'file_unsafe_svg', ref: 'W3C Associating Style Sheets with XML documents 1.0' },
    { label: '<style> with @import', body: b(svg(`<style>@import url(http://evil.invalid/a.css);</style>${rect}`)), code: 'file_unsafe_svg', ref: 'OWASP File Upload Cheat Sheet (external references)' },
    { label: 'style attribute loading url(http:…)', body: b(svg('<rect x="1" y="1" width="9" height="9" style="fill:url(http://evil.invalid/p.svg#g)"/>')), code: 'file_unsafe_svg', ref: 'OWASP File Upload Cheat Sheet (external references)' },
    { label: '<foreignObject> with HTML', body: b(svg(`${rect}<foreignObject width="10" height="10"><body xmlns="http://www.w3.org/1999/xhtml"><img src="x"/></body></foreignObject>`)), code: 'file_unsafe_svg', ref: OWASP_SVG },
    { label: '<iframe> inside SVG', body: b(svg(`${rect}<iframe src="http://evil.invalid/"/>`)), code: 'file_unsafe_svg', ref: OWASP_SVG },
    { label: '<embed> inside SVG', body: b(svg(`${rect}<embed src="x.swf"/>`)), code: 'file_unsafe_svg', ref: OWASP_SVG },
    { label: 'not well-formed XML (unclosed <g>)', body: b(svg(`<g>${rect}`)), code: 'file_invalid_svg', ref: 'W3C XML 1.0 §2.1 well-formed documents' },
    { label: 'mismatched end tag', body: b(svg(`<g>${rect}</a>`)), code: 'file_invalid_svg', ref: 'W3C XML 1.0 §3 element type match' },
    { label: 'HTML page sent as SVG', body: b('<!doctype html><html><body><svg><rect width="5" height="5"/></svg></body></html>'), code: /file_(unknown_format|unsafe_svg)/, ref: 'WHATWG HTML, not SVG' },
    { label: '<svg> inside <svg>', body: b(svg(`<svg x="0" y="0">${rect}</svg>`)), code: 'file_unsupported_svg', ref: 'SVG 1.1 §5.1.2 nested svg' },
    { label: 'viewBox with a negative width', body: b(svg(rect, 'width="100mm" height="50mm" viewBox="0 0 -100 50"')), code: 'file_invalid_svg', ref: 'SVG 1.1 §7.7: a negative viewBox width is an error' },
    { label: 'width -5 mm', body: b(svg(rect, 'width="-5mm" height="50mm" viewBox="0 0 100 50"')), code: 'file_invalid_svg', ref: 'SVG 1.1 §7.1: a negative width is an error' },
    { label: 'width 0', body: b(svg(rect, 'width="0" height="50mm" viewBox="0 0 100 50"')), code: 'file_invalid_svg', ref: 'SVG 1.1 §7.1: width 0 disables rendering' },
    { label: 'width 1e400 mm', body: b(svg(rect, 'width="1e400mm" height="50mm" viewBox="0 0 100 50"')), code: 'file_invalid_svg', ref: 'IEEE 754 overflow' },
    { label: 'rect at 1e308', body: b(svg('<rect x="1e308" y="0" width="10" height="10"/>')), code: 'file_bad_coordinate', ref: 'IEEE 754 binary64 range' },
    { label: 'coordinate given in percent', body: b(svg('<rect x="10%" y="0" width="10" height="10"/>')), code: 'file_unsupported_svg', ref: 'SVG 1.1 §7.10 percentages' },
    { label: 'path data that is not path data', body: b(svg('<path d="M 0 0 L zz 10"/>')), code: 'file_invalid_svg', ref: 'SVG 1.1 §8.3.9 path data grammar' },
    { label: 'polygon with an odd number of coordinates', body: b(svg('<polygon points="0,0 10,0 10"/>')), code: 'file_invalid_svg', ref: 'SVG 1.1 §9.7 polygon points' },
    { label: 'transform that is not a transform', body: b(svg(`<g transform="rotate(quarter)">${rect}</g>`)), code: 'file_unsupported_svg', ref: 'SVG 1.1 §7.6 transform attribute' },
    { label: 'groups nested 70 deep', body: b(svg(`${'<g>'.repeat(70)}${rect}${'</g>'.repeat(70)}`)), code: 'file_unsupported_svg', ref: 'files/svg/import.ts MAX_DEPTH = 64' },
    { label: '<use> that uses itself', body: b(svg(`<g id="loop"><use href="#loop"/>${rect}</g>`)), code: 'file_invalid_svg', ref: 'SVG 1.1 §5.6: circular references are an error' },
    { label: '<use> of an id that is not there', body: b(svg(`${rect}<use href="#nowhere"/>`)), code: 'file_invalid_svg', ref: 'SVG 1.1 §5.6 use element' },
    { label: '<use> chain 9 deep (limit 8)', body: b(svg(useChain(9))), code: 'file_nesting_too_deep', ref: 'files/svg/import.ts MAX_USE_NESTING = 8' },
    { label: 'only <text>, nothing to cut', body: b(svg('<text x="5" y="5">label</text>')), code: 'file_no_geometry', ref: 'SVG 1.1 §10 text is not a path' },
    { label: 'empty <svg/>', body: b('<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm"/>'), code: 'file_no_geometry', ref: 'SVG 1.1' },
    { label: 'Latin-1 bytes in an SVG that declares no encoding', body: Buffer.concat([b(svg(`<title>K`)).subarray(0, -6), Buffer.from([0xe4]), b('stchen</title>' + rect + '</svg>')]), code: 'file_not_text', ref: 'W3C XML 1.0 §4.3.3 (no declaration: must be UTF-8); RFC 3629' },
    { label: 'overlong UTF-8 sequence (C0 AF)', body: Buffer.concat([b(svg('<title>a')).subarray(0, -6), Buffer.from([0xc0, 0xaf]), b('</title>' + rect + '</svg>')]), code: 'file_not_text', ref: 'RFC 3629 §3: C0 and C1 never appear in UTF-8' },
    { label: 'UTF-16LE SVG', body: Buffer.concat([Buffer.from([0xff, 0xfe]), b(svg(rect), 'utf16le')]), code: /file_(not_text|binary)/, ref: 'Unicode BOM (RFC 2781 §3.2)' },
  ];
  return cases;
}

function useChain(n: number): string {
  let out = `<defs><rect id="u0" x="1" y="1" width="5" height="5"/>`;
  for (let i = 1; i <= n; i++) out += `<g id="u${i}"><use href="#u${i - 1}"/></g>`;
  return `${out}</defs><use href="#u${n}"/>`;
}

/** A valid drawing, for the cases where the file is fine and something else is wrong. */
export const goodDxf = () => Buffer.from(good);
export const goodSvg = () => Buffer.from(svg(rect));

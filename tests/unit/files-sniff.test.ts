// Upload sniffing: the kind of file is decided by its bytes alone.
import { describe, expect, it } from 'vitest';
import { importDxf } from '../../files/dxf/import';
import { FileRejected } from '../../files/errors';
import { sniffUpload, uploadText } from '../../files/sniff';
import { importSvg } from '../../files/svg/import';

const DXF = ['999', 'made by a test', '0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES', '0', 'LINE', '8', '0', '10', '0', '20', '0', '11', '10', '21', '0', '0', 'ENDSEC', '0', 'EOF', ''].join('\r\n');
const SVG = '<?xml version="1.0"?>\n<!-- a jig -->\n<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm" viewBox="0 0 10 10"><rect width="5" height="5"/></svg>';

function rejection(buf: Buffer): FileRejected {
  try {
    sniffUpload(buf);
  } catch (e) {
    if (e instanceof FileRejected) return e;
    throw e;
  }
  throw new Error('expected a FileRejected error');
}

describe('sniffUpload', () => {
  it('recognises ASCII DXF by its group-code structure (code lines, then 0/SECTION)', () => {
    expect(sniffUpload(Buffer.from(DXF))).toBe('dxf');
    expect(sniffUpload(Buffer.from('  0\nSECTION\n  2\nHEADER\n'))).toBe('dxf');
  });

  it('recognises SVG by its root element, after the XML declaration, comments and a byte-order mark', () => {
    expect(sniffUpload(Buffer.from(SVG))).toBe('svg');
    expect(sniffUpload(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(SVG)]))).toBe('svg');
    expect(sniffUpload(Buffer.from('<svg:svg xmlns:svg="http://www.w3.org/2000/svg"/>'))).toBe('svg');
  });

  it('refuses an empty file', () => {
    expect(rejection(Buffer.alloc(0)).code).toBe('empty');
    expect(rejection(Buffer.from(' \r\n\t\n')).message).toBe('The file is empty.');
  });

  it('refuses binary DXF by its sentinel (Autodesk DXF Reference, binary DXF)', () => {
    const bin = Buffer.concat([Buffer.from('AutoCAD Binary DXF\r\n\x1a', 'latin1'), Buffer.from([0, 0, 1, 2, 3])]);
    const e = rejection(bin);
    expect(e.code).toBe('binary_dxf');
    expect(e.message).toMatch(/binary DXF file, which is not supported; save it as ASCII DXF/);
  });

  it('refuses binary files (NUL bytes) and names common formats', () => {
    expect(rejection(Buffer.from([0x30, 0x0a, 0x00, 0x53])).code).toBe('binary');
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect(rejection(png).message).toMatch(/PNG image/);
    expect(rejection(Buffer.from('%PDF-1.7\n')).message).toMatch(/PDF/);
  });

  it('refuses text that is not UTF-8 or Latin-1 (UTF-16, control characters)', () => {
    expect(rejection(Buffer.from('\ufeff<svg/>', 'utf16le')).code).toBe('not_text');
    expect(rejection(Buffer.from('0\nSECTION\x07\n')).code).toBe('not_text');
  });

  it('reads Latin-1 text (older DXF files) without mangling it', () => {
    const latin1 = Buffer.from(DXF.replace("'made by a test'", '').replace('made by a test', 'angle 90\xb0'), 'latin1');
    expect(sniffUpload(latin1)).toBe('dxf');
    expect(uploadText(latin1)).toContain('angle 90°');
  });

  it('reads an SVG as UTF-8 unless it declares Latin-1 (W3C XML 1.0 §4.3.3: no declaration means UTF-8)', () => {
    const body = (decl: string) => Buffer.concat([Buffer.from(`${decl}<svg xmlns="http://www.w3.org/2000/svg"><title>K`), Buffer.from([0xe4]), Buffer.from('stchen</title></svg>')]);
    const e = rejection(body(''));
    expect(e.code).toBe('not_text');
    expect(e.message).toMatch(/not valid UTF-8/);
    expect(uploadText(body('<?xml version="1.0" encoding="ISO-8859-1"?>'))).toContain('Kästchen');
    expect(rejection(Buffer.from([0x3c, 0x73, 0x76, 0x67, 0x3e, 0xc0, 0xaf, 0x3c, 0x2f, 0x73, 0x76, 0x67, 0x3e])).code).toBe('not_text'); // overlong "/" (RFC 3629 §3)
  });

  it('refuses a JSON file and HTML, saying what they look like', () => {
    const json = rejection(Buffer.from('{"paths": []}'));
    expect(json.code).toBe('unknown_format');
    expect(json.message).toMatch(/neither an ASCII DXF nor an SVG.*JSON/);
    expect(rejection(Buffer.from('<!doctype html><html><svg></svg></html>')).message).toMatch(/without an <svg> root/);
    expect(rejection(Buffer.from('hello\nworld\n')).code).toBe('unknown_format');
  });

  it('passes truncated files on to the importers, which refuse them', () => {
    const dxfHalf = Buffer.from(DXF.slice(0, 80));
    expect(sniffUpload(dxfHalf)).toBe('dxf');
    expect(() => importDxf(uploadText(dxfHalf))).toThrow(/incomplete/);
    const svgHalf = Buffer.from(SVG.slice(0, SVG.length - 12));
    expect(sniffUpload(svgHalf)).toBe('svg');
    expect(() => importSvg(uploadText(svgHalf))).toThrow(/not well-formed XML/);
  });

  it('decides by content only: a DXF and an SVG are told apart whatever they would be called', () => {
    const kinds = [Buffer.from(DXF), Buffer.from(SVG)].map(sniffUpload);
    expect(kinds).toEqual(['dxf', 'svg']);
    expect(importDxf(uploadText(Buffer.from(DXF))).entityCounts).toEqual({ LINE: 1 });
  });
});

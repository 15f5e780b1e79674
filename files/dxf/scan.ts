// One cheap pass over an ASCII DXF before dxf-parser sees it: checks the group-code structure
// (sections, tables, blocks, POLYLINE…SEQEND, the closing EOF) and counts entities, so damaged,
// truncated or oversized files are refused with a line number instead of a parser crash (or a
// parser loop: dxf-parser 1.1.2 spins forever on a LAYER table that ends without ENDTAB). It also
// reads the few header variables the importer needs. Structure per the Autodesk DXF Reference
// ("DXF Format", group codes and sections).
import { FileRejected } from '../errors';

export interface DxfScan {
  /** Text with line ends normalised to \n when the file used bare CR. */
  text: string;
  /** Every entity name in ENTITIES and BLOCKS (VERTEX, SEQEND… included). */
  entityNames: Set<string>;
  /** Entities counted against the limit (sub-entities VERTEX, SEQEND, ATTRIB excluded). */
  entityCount: number;
  header: { insunits?: number; measurement?: number; acadver?: string };
}

const SUB_ENTITIES = new Set(['VERTEX', 'SEQEND', 'ATTRIB']);
/** The tables dxf-parser reads record by record; its loops need every record to be of the table's type. */
const STRICT_TABLES = new Set(['LAYER', 'LTYPE', 'VPORT']);
const ENTITY_NAME = /^[A-Za-z0-9_]{1,64}$/;

/**
 * Group-code ranges the DXF Reference defines (its "Group Code Value Types" table, from memory;
 * they are also exactly the ranges dxf-parser types). A code outside them means the file is not
 * DXF, and dxf-parser would print a warning per group.
 */
function isDefinedCode(c: number): boolean {
  return (
    (c >= 0 && c <= 149) ||
    (c >= 160 && c <= 179) ||
    (c >= 210 && c <= 239) ||
    (c >= 270 && c <= 481) ||
    c === 999 ||
    (c >= 1000 && c <= 1071)
  );
}

const damaged = (line: number, why: string) =>
  new FileRejected('damaged_dxf', `The DXF file is damaged at line ${line}: ${why}. Export it again as an ASCII DXF.`);

const truncated = (why: string) =>
  new FileRejected('truncated', `The DXF file is incomplete (${why}); it may have been cut off during upload or export. Send the whole file.`);

type State = 'top' | 'section-name' | 'section' | 'table-name' | 'table';

export function scanDxf(source: string, maxEntities: number): DxfScan {
  // A file keeps one line-end style: its first CR tells (old Mac files end lines with a bare CR).
  const firstCr = source.indexOf('\r');
  const text = firstCr >= 0 && source.charCodeAt(firstCr + 1) !== 10 ? source.replace(/\r\n?/g, '\n') : source;
  const entityNames = new Set<string>();
  const header: DxfScan['header'] = {};
  let entityCount = 0;

  let state: State = 'top';
  let section = '';
  let table = '';
  let inBlock = false;
  let polylineLine = 0; // line of the open POLYLINE awaiting SEQEND, 0 when none
  let headerVar = '';
  let sawEof = false;

  let pos = 0;
  let line = 0;
  const len = text.length;
  while (pos < len) {
    // code line
    let end = text.indexOf('\n', pos);
    if (end < 0) end = len;
    line++;
    const codeLine = line;
    const code = parseCode(text, pos, end);
    if (code === null) {
      if (text.slice(pos).trim() === '') break; // only blank lines left, and no EOF: reported below
      throw damaged(codeLine, `expected a group code (a whole number) but found "${snippet(text.slice(pos, end))}"`);
    }
    if (!isDefinedCode(code)) throw damaged(codeLine, `${code} is not a DXF group code`);
    pos = end + 1;
    if (pos >= len) throw truncated(`group code ${code} on the last line has no value`);
    // value line
    end = text.indexOf('\n', pos);
    if (end < 0) end = len;
    line++;
    const valueStart = pos;
    const valueEnd = end;
    pos = end + 1;

    if (code === 999) continue; // comment
    const value = code === 0 || code === 2 || code === 9 || (state === 'section' && section === 'HEADER') ? text.slice(valueStart, valueEnd).trim() : '';

    switch (state) {
      case 'top':
        if (code !== 0) throw damaged(codeLine, `found group ${code} outside any section`);
        if (value === 'EOF') sawEof = true;
        else if (value === 'SECTION') state = 'section-name';
        else throw damaged(codeLine, `expected SECTION or EOF but found ${snippet(value)}`);
        break;
      case 'section-name':
        if (code !== 2) throw damaged(codeLine, 'SECTION is not followed by its name');
        section = value;
        state = 'section';
        break;
      case 'table-name':
        if (code !== 2) throw damaged(codeLine, 'TABLE is not followed by its name');
        table = value;
        state = 'table';
        break;
      case 'table':
        if (code !== 0) break;
        if (value === 'ENDTAB') state = 'section';
        else if (value === 'ENDSEC' || value === 'EOF' || value === 'TABLE') throw damaged(codeLine, `table ${snippet(table)} has no ENDTAB`);
        else if (STRICT_TABLES.has(table) && value !== table) throw damaged(codeLine, `table ${table} contains a ${snippet(value)} record`);
        break;
      case 'section':
        if (section === 'HEADER') {
          if (code === 0) {
            if (value !== 'ENDSEC') throw damaged(codeLine, `unexpected ${snippet(value)} in the HEADER section`);
            state = 'top';
          } else if (code === 9) headerVar = value;
          else if (headerVar === '$INSUNITS' && code === 70) header.insunits = Number(value);
          else if (headerVar === '$MEASUREMENT' && code === 70) header.measurement = Number(value);
          else if (headerVar === '$ACADVER' && code === 1) header.acadver = value;
          break;
        }
        if (code !== 0) break;
        if (value === 'EOF') throw truncated(`section ${snippet(section)} has no ENDSEC`);
        if (value === 'ENDSEC') {
          if (polylineLine) throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
          if (inBlock) throw damaged(codeLine, 'a BLOCK has no ENDBLK');
          state = 'top';
          break;
        }
        if (section === 'TABLES') {
          if (value === 'TABLE') state = 'table-name';
          else throw damaged(codeLine, `expected TABLE but found ${snippet(value)}`);
          break;
        }
        if (section !== 'ENTITIES' && section !== 'BLOCKS') break; // CLASSES, OBJECTS…: not read
        if (section === 'BLOCKS') {
          if (value === 'BLOCK') {
            if (inBlock) throw damaged(codeLine, 'a BLOCK starts inside another BLOCK');
            inBlock = true;
            break;
          }
          if (value === 'ENDBLK') {
            if (polylineLine) throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
            if (!inBlock) throw damaged(codeLine, 'ENDBLK without BLOCK');
            inBlock = false;
            break;
          }
          if (!inBlock) throw damaged(codeLine, `${snippet(value)} outside any BLOCK`);
        }
        if (!ENTITY_NAME.test(value) || value in Object.prototype) throw damaged(codeLine, `"${snippet(value)}" is not an entity name`);
        if (polylineLine) {
          if (value === 'SEQEND') polylineLine = 0;
          else if (value !== 'VERTEX') throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
        } else if (value === 'POLYLINE') polylineLine = codeLine;
        entityNames.add(value);
        if (!SUB_ENTITIES.has(value) && ++entityCount > maxEntities) {
          throw new FileRejected(
            'too_many_entities',
            `The DXF file has more than ${maxEntities.toLocaleString('en-US')} entities, more than Jigwright reads in one file. Split it or simplify it.`,
          );
        }
        break;
    }
    if (sawEof) break;
  }
  if (!sawEof) {
    if (state === 'top') throw truncated('it does not end with EOF');
    throw truncated(`it ends inside the ${snippet(section)} section`);
  }
  return { text, entityNames, entityCount, header };
}

/** The integer on text[start, end) (spaces and a trailing CR allowed), or null. */
function parseCode(text: string, start: number, end: number): number | null {
  let i = start;
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
  let neg = false;
  if (text.charCodeAt(i) === 45) {
    neg = true;
    i++;
  }
  let n = 0;
  let digits = 0;
  while (i < end) {
    const c = text.charCodeAt(i);
    if (c < 48 || c > 57) break;
    n = n * 10 + (c - 48);
    digits++;
    i++;
  }
  while (i < end) {
    const c = text.charCodeAt(i);
    if (c !== 32 && c !== 9 && c !== 13) return null;
    i++;
  }
  if (digits === 0 || digits > 6) return null;
  return neg ? -n : n;
}

function snippet(s: string): string {
  const t = s.replace(/[\u0000-\u001f]/g, ' ').trim();
  return t.length > 40 ? t.slice(0, 40) + '…' : t;
}

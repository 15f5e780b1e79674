// Reads an ASCII DXF in one pass over the text: group-code structure (sections, tables, blocks,
// POLYLINE…SEQEND, the closing EOF), the header variables we need, and every entity as its list
// of groups. Format: Autodesk DXF Reference, "DXF Format" (a group is a code line, then a value
// line) and "Group Code Value Types".
//
// Why not dxf-parser here: it splits the whole text into a line array (a 10 MB file costs about
// 270 MB of memory before any geometry exists), spins forever on some damaged tables (a LAYER table
// without ENDTAB), and we replaced all its entity readers anyway to read them to the reference
// (OCS, weights, bulges). It stays the independent reader our tests check exports with.
import { FileRejected } from '../errors';

/** One entity: its type and its groups as a flat [code, value, code, value, …] list, in file order. */
export interface RawEntity {
  type: string;
  /** 1-based line of the entity's 0 group, for messages. */
  line: number;
  groups: (number | string)[];
}

export interface RawBlock {
  name: string;
  baseX: number;
  baseY: number;
  entities: RawEntity[];
}

export interface DxfDocument {
  header: { insunits?: number; measurement?: number; acadver?: string };
  blocks: Map<string, RawBlock>;
  /** The ENTITIES section, in order (VERTEX and SEQEND included, as in the file). */
  entities: RawEntity[];
}

const SUB_ENTITIES = new Set(['VERTEX', 'SEQEND', 'ATTRIB']);
/** Tables whose every record must be of the table's own type (DXF Reference, TABLES section). */
const STRICT_TABLES = new Set(['LAYER', 'LTYPE', 'VPORT']);
const ENTITY_NAME = /^[A-Za-z0-9_]{1,64}$/;

/**
 * The group codes entities are read by (import.ts); all others are skipped on the way in, which
 * keeps memory near the size of the geometry. Strings: 2 name, 5 handle, 8 layer.
 */
const KEPT = new Uint8Array(1072);
for (const c of [2, 5, 8, 10, 11, 20, 21, 30, 31, 38, 40, 41, 42, 44, 45, 50, 51, 60, 66, 67, 70, 71, 90, 210, 220, 230]) KEPT[c] = 1;
const STRING_CODE = (c: number) => c <= 9;

/**
 * Group-code ranges the DXF Reference defines ("Group Code Value Types", from memory). A code
 * outside them means the file is not a DXF.
 */
function isDefinedCode(c: number): boolean {
  return (c >= 0 && c <= 149) || (c >= 160 && c <= 179) || (c >= 210 && c <= 239) || (c >= 270 && c <= 481) || c === 999 || (c >= 1000 && c <= 1071);
}

const damaged = (line: number, why: string) =>
  new FileRejected('damaged_dxf', `The DXF file is damaged at line ${line}: ${why}. Export it again as an ASCII DXF.`);

export const truncated = (why: string) =>
  new FileRejected('truncated', `The DXF file is incomplete (${why}); it may have been cut off during upload or export. Send the whole file.`);

export function readDxf(source: string, maxEntities: number): DxfDocument {
  try {
    return read(source, maxEntities);
  } catch (e) {
    // A file that does not end with 0/EOF was most likely cut off: say that rather than where it broke.
    if (e instanceof FileRejected && e.code === 'damaged_dxf' && !/(^|\n)[ \t]*0[ \t]*\r?\n[ \t]*EOF\s*$/.test(source.slice(-64))) {
      throw truncated('it does not end with EOF');
    }
    throw e;
  }
}

type State = 'top' | 'section-name' | 'section' | 'table-name' | 'table' | 'block-header' | 'entity';

function read(source: string, maxEntities: number): DxfDocument {
  // A file keeps one line-end style: its first CR tells (old Mac files end lines with a bare CR).
  const firstCr = source.indexOf('\r');
  const text = firstCr >= 0 && source.charCodeAt(firstCr + 1) !== 10 ? source.replace(/\r\n?/g, '\n') : source;
  const doc: DxfDocument = { header: {}, blocks: new Map(), entities: [] };
  const knownNames = new Set<string>();
  let entityCount = 0;

  let state: State = 'top';
  let section = '';
  let table = '';
  let block: RawBlock | null = null;
  let entity: RawEntity | null = null;
  let polylineLine = 0; // line of the open POLYLINE awaiting SEQEND, 0 when none
  let headerVar = '';
  let sawEof = false;

  let pos = 0;
  let line = 0;
  const len = text.length;
  while (pos < len) {
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
    end = text.indexOf('\n', pos);
    if (end < 0) end = len;
    line++;
    const valueStart = pos;
    const valueEnd = end;
    pos = end + 1;

    if (code === 999) continue; // comment

    if (code !== 0) {
      // the groups of an entity, a block header or a header variable
      if (state === 'entity') {
        if (KEPT[code]) entity!.groups.push(code, STRING_CODE(code) ? text.slice(valueStart, valueEnd).trim() : number(text, valueStart, valueEnd));
        continue;
      }
      if (state === 'block-header') {
        if (code === 2) block!.name = text.slice(valueStart, valueEnd).trim();
        else if (code === 10) block!.baseX = number(text, valueStart, valueEnd);
        else if (code === 20) block!.baseY = number(text, valueStart, valueEnd);
        continue;
      }
      if (state === 'section-name' || state === 'table-name') {
        if (code !== 2) throw damaged(codeLine, `${state === 'section-name' ? 'SECTION' : 'TABLE'} is not followed by its name`);
        const name = text.slice(valueStart, valueEnd).trim();
        if (state === 'section-name') {
          section = name;
          state = 'section';
        } else {
          table = name;
          state = 'table';
        }
        continue;
      }
      if (state === 'top') throw damaged(codeLine, `found group ${code} outside any section`);
      if (state === 'section' && section === 'HEADER') {
        const value = text.slice(valueStart, valueEnd).trim();
        if (code === 9) headerVar = value;
        else if (headerVar === '$INSUNITS' && code === 70) doc.header.insunits = Number(value);
        else if (headerVar === '$MEASUREMENT' && code === 70) doc.header.measurement = Number(value);
        else if (headerVar === '$ACADVER' && code === 1) doc.header.acadver = value;
      }
      continue; // table records, other sections: not read
    }

    // a 0 group: something starts or ends
    const value = text.slice(valueStart, valueEnd).trim();
    if (state === 'section-name' || state === 'table-name') throw damaged(codeLine, `${state === 'section-name' ? 'SECTION' : 'TABLE'} is not followed by its name`);
    if (state === 'top') {
      if (value === 'EOF') {
        sawEof = true;
        break;
      }
      if (value !== 'SECTION') throw damaged(codeLine, `expected SECTION or EOF but found ${snippet(value)}`);
      state = 'section-name';
      continue;
    }
    if (state === 'table') {
      if (value === 'ENDTAB') state = 'section';
      else if (value === 'ENDSEC' || value === 'EOF' || value === 'TABLE') throw damaged(codeLine, `table ${snippet(table)} has no ENDTAB`);
      else if (STRICT_TABLES.has(table) && value !== table) throw damaged(codeLine, `table ${table} contains a ${snippet(value)} record`);
      continue;
    }
    // state is section, block-header or entity: the previous entity (if any) ends here
    entity = null;
    if (value === 'EOF') throw truncated(`section ${snippet(section)} has no ENDSEC`);
    if (value === 'ENDSEC') {
      if (polylineLine) throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
      if (block) throw damaged(codeLine, `block "${snippet(block.name)}" has no ENDBLK`);
      state = 'top';
      continue;
    }
    if (section === 'HEADER') throw damaged(codeLine, `unexpected ${snippet(value)} in the HEADER section`);
    if (section === 'TABLES') {
      if (value !== 'TABLE') throw damaged(codeLine, `expected TABLE but found ${snippet(value)}`);
      state = 'table-name';
      continue;
    }
    if (section !== 'ENTITIES' && section !== 'BLOCKS') {
      state = 'section'; // CLASSES, OBJECTS…: not read
      continue;
    }
    if (section === 'BLOCKS') {
      if (value === 'BLOCK') {
        if (block) throw damaged(codeLine, 'a BLOCK starts inside another BLOCK');
        block = { name: '', baseX: 0, baseY: 0, entities: [] };
        state = 'block-header';
        continue;
      }
      if (value === 'ENDBLK') {
        if (polylineLine) throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
        if (!block) throw damaged(codeLine, 'ENDBLK without BLOCK');
        if (!block.name) throw damaged(codeLine, 'a BLOCK has no name');
        if (!doc.blocks.has(block.name)) doc.blocks.set(block.name, block);
        block = null;
        state = 'section';
        continue;
      }
      if (!block) throw damaged(codeLine, `${snippet(value)} outside any BLOCK`);
    }
    if (!knownNames.has(value)) {
      if (!ENTITY_NAME.test(value) || value in Object.prototype) throw damaged(codeLine, `"${snippet(value)}" is not an entity name`);
      knownNames.add(value);
    }
    if (polylineLine) {
      if (value === 'SEQEND') polylineLine = 0;
      else if (value !== 'VERTEX') throw damaged(polylineLine, 'a POLYLINE is not closed by SEQEND');
    } else if (value === 'POLYLINE') polylineLine = codeLine;
    if (!SUB_ENTITIES.has(value) && ++entityCount > maxEntities) {
      throw new FileRejected('too_many_entities', `The DXF file has more than ${maxEntities.toLocaleString('en-US')} entities, more than Jigwright reads in one file. Split it or simplify it.`);
    }
    entity = { type: value, line: codeLine, groups: [] };
    (block ? block.entities : doc.entities).push(entity);
    state = 'entity';
  }
  if (!sawEof) {
    if (state === 'top') throw truncated('it does not end with EOF');
    throw truncated(`it ends inside the ${snippet(section)} section`);
  }
  return doc;
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/**
 * A numeric group value; NaN when it is not a number (the importer reports it with the entity).
 * Plain decimals of up to 15 digits are read directly: an exact integer mantissa divided by an
 * exact power of ten is one correctly rounded operation, the same double Number() gives. Anything
 * else (exponents, longer mantissas) goes through Number().
 */
function number(text: string, start: number, end: number): number {
  let i = start;
  while (i < end && text.charCodeAt(i) === 32) i++;
  let neg = false;
  let c = text.charCodeAt(i);
  if (c === 45 || c === 43) {
    neg = c === 45;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  while (i < end && (c = text.charCodeAt(i)) >= 48 && c <= 57) {
    mantissa = mantissa * 10 + (c - 48);
    digits++;
    i++;
  }
  if (i < end && text.charCodeAt(i) === 46) {
    i++;
    while (i < end && (c = text.charCodeAt(i)) >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      fraction++;
      i++;
    }
  }
  while (i < end && ((c = text.charCodeAt(i)) === 32 || c === 13 || c === 9)) i++;
  if (i === end && digits > 0 && digits <= 15) {
    const v = fraction ? mantissa / POW10[fraction] : mantissa;
    return neg ? -v : v;
  }
  const s = text.slice(start, end).trim();
  return s === '' ? NaN : Number(s);
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

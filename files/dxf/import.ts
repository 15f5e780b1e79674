// ASCII DXF → the internal geometry (a flat makerjs model in millimetres). reader.ts checks the
// structure and hands over every entity as its group list; here each is read as the Autodesk DXF
// Reference describes it, including OCS mirroring, bulges, rational splines and block inserts.
import makerjs from 'makerjs';
import type { LayerName } from '../../shared/schemas/geometry';
import { MM_PER_INCH, type LengthUnit } from '../../shared/units';
import { FileRejected, UnitsNeeded } from '../errors';
import { FALLBACK_LAYER, matchLayer } from '../layers';
import { type Affine, compose, rotationDeg, scaling, translation } from '../model/affine';
import { type CollectorLimits, DEFAULT_LIMITS, PathCollector } from '../model/collector';
import type { ImportResult, SourceUnits } from '../types';
import { type RawBlock, type RawEntity, readDxf } from './reader';
import { type SplineData, splineBreaks, splinePoint, splineProblem } from './spline';

export interface DxfImportOptions {
  /** The user's answer when the file does not say its units (see UnitsNeeded). */
  units?: LengthUnit;
  /** Most entities read from one file (default 200 000). */
  maxEntities?: number;
  limits?: Partial<CollectorLimits>;
}

export const DEFAULT_MAX_ENTITIES = 200_000;
/** Blocks inside blocks deeper than this are refused. */
export const MAX_BLOCK_NESTING = 8;
/** Most copies one INSERT may place (columns × rows). */
const MAX_ARRAY_COPIES = 10_000;

/** $INSUNITS (HEADER, group 70): Autodesk DXF Reference. Factors: 1 in = 25.4 mm exactly (16 CFR 500.19). */
const INSUNITS: Record<number, { units: SourceUnits; mm: number; name: string }> = {
  1: { units: 'in', mm: MM_PER_INCH, name: 'inches' },
  2: { units: 'ft', mm: 12 * MM_PER_INCH, name: 'feet' },
  4: { units: 'mm', mm: 1, name: 'millimetres' },
  5: { units: 'cm', mm: 10, name: 'centimetres' },
  6: { units: 'm', mm: 1000, name: 'metres' },
};
const USER_UNITS: Record<LengthUnit, { units: SourceUnits; mm: number; name: string }> = { mm: INSUNITS[4], in: INSUNITS[1] };

const ANNOTATION = new Set(['TEXT', 'MTEXT', 'DIMENSION', 'HATCH', 'ATTDEF', 'ATTRIB', 'LEADER', 'MLEADER', 'MULTILEADER', 'TOLERANCE']);
const SUB_ENTITIES = new Set(['VERTEX', 'SEQEND', 'ATTRIB']);
const MIRROR_X: Affine = [-1, 0, 0, 1, 0, 0];

type GroupValue = string | number;

export function importDxf(text: string, opts: DxfImportOptions = {}): ImportResult {
  if (opts.units !== undefined && !(opts.units in USER_UNITS)) throw new TypeError(`importDxf: units must be 'mm' or 'in', not ${String(opts.units)}`);
  const maxEntities = opts.maxEntities ?? DEFAULT_MAX_ENTITIES;
  const doc = readDxf(text, maxEntities);
  const warnings: string[] = [];

  let unit: { units: SourceUnits; mm: number; name: string } | undefined;
  let unitsFrom: ImportResult['unitsFrom'] = 'header';
  const code = doc.header.insunits;
  if (code !== undefined && code !== 0) {
    unit = INSUNITS[code];
    if (!unit) {
      throw new FileRejected(
        'unsupported_units',
        `The DXF file's drawing units ($INSUNITS = ${code}) are not ones Jigwright reads. Save it in millimetres or inches (or centimetres, metres, feet).`,
      );
    }
    if (opts.units && USER_UNITS[opts.units].units !== unit.units) {
      warnings.push(`The file says it is drawn in ${unit.name}; that was used instead of the ${USER_UNITS[opts.units].name} you chose.`);
    }
  } else if (opts.units) {
    unit = USER_UNITS[opts.units];
    unitsFrom = 'user';
  }

  // Without units we still read everything (so other problems surface first), in file units.
  const drawer = new EntityDrawer(doc.blocks, { ...DEFAULT_LIMITS, ...opts.limits });
  const entities = doc.entities;
  drawer.drawList(entities, scaling(unit ? unit.mm : 1), undefined, 0, []);
  const model = drawer.finish();

  if (!unit) {
    const ext = makerjs.measure.modelExtents(model);
    const extents = ext ? { width: ext.high[0] - ext.low[0], height: ext.high[1] - ext.low[1] } : undefined;
    const suggested = doc.header.measurement === 1 ? 'mm' : doc.header.measurement === 0 ? 'in' : undefined;
    const size = extents ? ` The drawing measures ${fmt(extents.width)} × ${fmt(extents.height)} in its own units.` : '';
    throw new UnitsNeeded(`This DXF file does not say which units it is drawn in ($INSUNITS is ${code === 0 ? '0, unitless' : 'missing'}). Choose millimetres or inches.${size}`, extents, suggested);
  }

  const entityCounts: Record<string, number> = {};
  for (const e of entities) if (!SUB_ENTITIES.has(e.type)) entityCounts[e.type] = (entityCounts[e.type] ?? 0) + 1;
  return { model, sourceUnits: unit.units, unitsFrom, entityCounts, warnings: [...warnings, ...drawer.warnings()] };
}

/** Names the entity being read, for messages: the LINE at line 120 (handle 2A) in block "JIG". */
class EntityRef {
  type = '';
  line = 0;
  handle: GroupValue | undefined;
  block: string | undefined;
  toString(): string {
    const handle = this.handle !== undefined ? ` (handle ${String(this.handle)})` : '';
    const block = this.block ? ` in block "${this.block}"` : '';
    return `The ${this.type} at line ${this.line}${handle}${block}`;
  }
}

class EntityDrawer {
  private readonly out: PathCollector;
  private readonly ref = new EntityRef();
  private drawable = 0;
  private readonly ignored = new Map<string, number>();
  private readonly unknown = new Map<string, number>();
  private readonly foreignLayers = new Set<string>();
  private readonly layerCache = new Map<string, LayerName | null>();
  private paperSpace = 0;
  private invisible = 0;
  private meshes = 0;
  private points = 0;
  private sawZ = false;

  constructor(
    private readonly blocks: Map<string, RawBlock>,
    limits: CollectorLimits,
  ) {
    this.out = new PathCollector(limits);
    this.out.where = this.ref;
  }

  drawList(list: RawEntity[], m: Affine, inheritedLayer: LayerName | undefined, depth: number, stack: string[]): void {
    const block = stack.length ? stack[stack.length - 1] : undefined;
    for (let i = 0; i < list.length; i++) {
      const e = list[i];
      const ref = this.ref;
      ref.type = e.type;
      ref.line = e.line;
      ref.block = block;
      ref.handle = value(e, 5);
      if (e.type === 'SEQEND' || e.type === 'VERTEX') continue; // consumed by POLYLINE, or the end of an INSERT's attributes
      const hidden = value(e, 67) === 1 ? 'paper' : value(e, 60) === 1 ? 'invisible' : null;
      if (hidden) {
        if (hidden === 'paper') this.paperSpace++;
        else this.invisible++;
        if (e.type === 'POLYLINE') i = endOfVertices(list, i);
        continue;
      }
      switch (e.type) {
        case 'LINE':
          this.drawable++;
          this.line(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'CIRCLE':
          this.drawable++;
          this.circle(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'ARC':
          this.drawable++;
          this.arc(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'LWPOLYLINE':
          this.drawable++;
          this.lwpolyline(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'POLYLINE': {
          const end = endOfVertices(list, i);
          this.polyline(e, list.slice(i + 1, end + 1).filter((v) => v.type === 'VERTEX'), m, this.layerOf(e, inheritedLayer));
          i = end;
          break;
        }
        case 'ELLIPSE':
          this.drawable++;
          this.ellipse(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'SPLINE':
          this.drawable++;
          this.spline(e, m, this.layerOf(e, inheritedLayer));
          break;
        case 'INSERT':
          this.insert(e, m, this.layerOf(e, inheritedLayer), depth, stack);
          break;
        case 'POINT':
          this.points++;
          break;
        default:
          if (ANNOTATION.has(e.type)) this.ignored.set(e.type, (this.ignored.get(e.type) ?? 0) + 1);
          else this.unknown.set(e.type, (this.unknown.get(e.type) ?? 0) + 1);
      }
    }
  }

  finish(): makerjs.IModel {
    if (this.out.count === 0) {
      if (this.drawable > 0) {
        throw new FileRejected('zero_length', 'Every line, arc and curve in the DXF file has zero length, so there is nothing to cut.');
      }
      const found = [...this.ignored, ...this.unknown].map(([t, n]) => `${t} ×${n}`).join(', ');
      throw new FileRejected(
        'no_geometry',
        `The DXF file has no lines, arcs, circles, polylines, ellipses or splines to cut${found ? ` (it has only ${found})` : ''}${this.paperSpace ? `; ${this.paperSpace} entities are in paper space, which is not read` : ''}.`,
      );
    }
    return this.out.model();
  }

  warnings(): string[] {
    const w: string[] = [];
    const list = (m: Map<string, number>) => [...m].map(([t, n]) => `${t} ×${n}`).join(', ');
    if (this.ignored.size) w.push(`Text, dimensions and hatching are not cut and were left out: ${list(this.ignored)}.`);
    if (this.unknown.size) w.push(`Entity types Jigwright does not read were left out: ${list(this.unknown)}.`);
    if (this.points) w.push(`${this.points} POINT entit${this.points === 1 ? 'y was' : 'ies were'} left out (a point is not a path).`);
    if (this.meshes) w.push(`${this.meshes} mesh POLYLINE${this.meshes === 1 ? ' was' : 's were'} left out (3D surfaces are not cut).`);
    if (this.paperSpace) w.push(`${this.paperSpace} entit${this.paperSpace === 1 ? 'y' : 'ies'} in paper space (layout sheets) were left out.`);
    if (this.invisible) w.push(`${this.invisible} invisible entit${this.invisible === 1 ? 'y was' : 'ies were'} left out.`);
    if (this.out.zeroLength) w.push(`${this.out.zeroLength} zero-length path${this.out.zeroLength === 1 ? ' was' : 's were'} dropped.`);
    if (this.out.approximated) {
      w.push(`${this.out.approximated} ellipse${this.out.approximated === 1 ? '' : 's'}, spline${this.out.approximated === 1 ? '' : 's'} or stretched arc${this.out.approximated === 1 ? '' : 's'} became straight segments within ${this.out.limits.chordToleranceMm} mm.`);
    }
    if (this.sawZ) w.push('Some coordinates have a Z value; the drawing was read flat onto the XY plane.');
    if (this.foreignLayers.size) {
      const names = [...this.foreignLayers].slice(0, 10).map((n) => `"${n}"`).join(', ');
      w.push(`Layers Jigwright does not use were put on "${FALLBACK_LAYER}": ${names}${this.foreignLayers.size > 10 ? ` and ${this.foreignLayers.size - 10} more` : ''}.`);
    }
    return w;
  }

  /** Entities on layer 0 inside a block take the INSERT's layer (DXF block convention, from memory). */
  private layerOf(e: RawEntity, inherited: LayerName | undefined): LayerName {
    const raw = value(e, 8);
    const name = raw === undefined ? '0' : String(raw);
    if (name === '0' && inherited) return inherited;
    let layer = this.layerCache.get(name);
    if (layer === undefined) {
      layer = matchLayer(name) ?? null;
      this.layerCache.set(name, layer);
      if (!layer && name !== '0') this.foreignLayers.add(name);
    }
    return layer ?? FALLBACK_LAYER;
  }

  /** The entity's object coordinate system as a transform: identity, or x mirrored for extrusion (0,0,−1). */
  private ocs(e: RawEntity, m: Affine): Affine {
    // Arbitrary axis algorithm (DXF Reference, "Object Coordinate Systems"): for N = (0, 0, −1) the OCS x axis is −X.
    return this.extrusionSign(e) < 0 ? compose(m, MIRROR_X) : m;
  }

  /** +1 for the usual extrusion (0, 0, 1), −1 for (0, 0, −1); anything tilted is refused. */
  private extrusionSign(e: RawEntity): 1 | -1 {
    let nx = 0;
    let ny = 0;
    let nz = 1;
    const g = e.groups;
    for (let i = 0; i < g.length; i += 2) {
      const c = g[i];
      if (c === 210) nx = g[i + 1] as number;
      else if (c === 220) ny = g[i + 1] as number;
      else if (c === 230) nz = g[i + 1] as number;
    }
    if (nx === 0 && ny === 0 && nz === 1) return 1;
    const len = Math.hypot(nx, ny, nz);
    if (!(len > 0) || Math.hypot(nx, ny) > 1e-9 * len) {
      throw new FileRejected('not_flat', `${String(this.ref)} is not drawn in the XY plane (its extrusion direction is ${fmt(nx)}, ${fmt(ny)}, ${fmt(nz)}). Flatten the drawing before exporting it.`);
    }
    return nz < 0 ? -1 : 1;
  }

  private required(e: RawEntity, code: number, what: string): number {
    const v = value(e, code);
    if (v === undefined) throw new FileRejected('damaged_dxf', `${String(this.ref)} has no ${what} (group ${code}). Export the file again.`);
    return Number(v);
  }

  private z(v: GroupValue | undefined): void {
    if (v !== undefined && v !== 0) this.sawZ = true;
  }

  private line(e: RawEntity, m: Affine, layer: LayerName): void {
    let x1: number | undefined, y1: number | undefined, x2: number | undefined, y2: number | undefined;
    const g = e.groups;
    for (let i = 0; i < g.length; i += 2) {
      switch (g[i]) {
        case 10: x1 = g[i + 1] as number; break;
        case 20: y1 = g[i + 1] as number; break;
        case 11: x2 = g[i + 1] as number; break;
        case 21: y2 = g[i + 1] as number; break;
        case 30: case 31: this.z(g[i + 1]); break;
      }
    }
    if (x1 === undefined || y1 === undefined) throw this.missing('start point', 10);
    if (x2 === undefined || y2 === undefined) throw this.missing('end point', 11);
    this.out.line(m, layer, x1, y1, x2, y2);
  }

  private missing(what: string, code: number): FileRejected {
    return new FileRejected('damaged_dxf', `${String(this.ref)} has no ${what} (group ${code}). Export the file again.`);
  }

  private radius(e: RawEntity): number {
    const r = this.required(e, 40, 'radius');
    if (r < 0) throw new FileRejected('degenerate_entity', `${String(this.ref)} has a negative radius (${fmt(r)}).`);
    return r;
  }

  private circle(e: RawEntity, m: Affine, layer: LayerName): void {
    this.z(value(e, 30));
    this.out.circle(this.ocs(e, m), layer, this.required(e, 10, 'centre'), this.required(e, 20, 'centre'), this.radius(e));
  }

  /** ARC: centre 10/20, radius 40, start/end angle 50/51 in degrees, counter-clockwise in its OCS. */
  private arc(e: RawEntity, m: Affine, layer: LayerName): void {
    this.z(value(e, 30));
    this.out.arc(this.ocs(e, m), layer, this.required(e, 10, 'centre'), this.required(e, 20, 'centre'), this.radius(e), this.required(e, 50, 'start angle'), this.required(e, 51, 'end angle'));
  }

  /** LWPOLYLINE: 70 flags (1 = closed), 10/20 vertices, 42 bulge of the segment that starts there. */
  private lwpolyline(e: RawEntity, m: Affine, layer: LayerName): void {
    const xs: number[] = [];
    const ys: number[] = [];
    const bulges: number[] = [];
    let flags = 0;
    const g = e.groups;
    for (let i = 0; i < g.length; i += 2) {
      const v = g[i + 1];
      switch (g[i]) {
        case 10: xs.push(v as number); ys.push(NaN); bulges.push(0); break;
        case 20:
          if (!xs.length) throw this.missing('vertex x before its y', 10);
          ys[ys.length - 1] = v as number;
          break;
        case 42: if (bulges.length) bulges[bulges.length - 1] = v as number; break;
        case 70: flags = v as number; break;
        case 38: this.z(v); break;
      }
    }
    this.vertices(this.ocs(e, m), layer, xs, ys, bulges, (flags & 1) === 1);
  }

  private vertices(m: Affine, layer: LayerName, xs: number[], ys: number[], bulges: number[], closed: boolean): void {
    const n = xs.length;
    if (n < 2) {
      this.out.zeroLength++;
      return;
    }
    for (let i = 0; i + 1 < n; i++) this.out.bulgeSegment(m, layer, xs[i], ys[i], xs[i + 1], ys[i + 1], bulges[i]);
    if (closed) this.out.bulgeSegment(m, layer, xs[n - 1], ys[n - 1], xs[0], ys[0], bulges[n - 1]);
  }

  /** POLYLINE + VERTEX… + SEQEND. 70 flags: 1 closed, 8 3D polyline, 16 / 64 meshes (skipped). */
  private polyline(e: RawEntity, vertices: RawEntity[], m: Affine, layer: LayerName): void {
    const flags = Number(value(e, 70) ?? 0);
    if (flags & (16 | 64)) {
      this.meshes++;
      return;
    }
    this.drawable++;
    const is3d = (flags & 8) !== 0;
    const xs: number[] = [];
    const ys: number[] = [];
    const bulges: number[] = [];
    for (const v of vertices) {
      if (Number(value(v, 70) ?? 0) & 16) continue; // spline frame control point: not on the curve (from memory)
      const x = value(v, 10);
      const y = value(v, 20);
      if (x === undefined || y === undefined) throw this.missing('vertex position', 10);
      xs.push(Number(x));
      ys.push(Number(y));
      bulges.push(is3d ? 0 : Number(value(v, 42) ?? 0));
      this.z(value(v, 30));
    }
    this.vertices(is3d ? m : this.ocs(e, m), layer, xs, ys, bulges, (flags & 1) === 1);
  }

  /**
   * ELLIPSE: centre 10/20, major axis end 11/21 relative to the centre, 40 minor/major ratio,
   * 41/42 start/end parameter in radians (0 and 2π for a full ellipse). Centre and axis are in
   * world coordinates; the extrusion only decides which way the minor axis points.
   */
  private ellipse(e: RawEntity, m: Affine, layer: LayerName): void {
    const cx = this.required(e, 10, 'centre');
    const cy = this.required(e, 20, 'centre');
    const mx = this.required(e, 11, 'major axis');
    const my = this.required(e, 21, 'major axis');
    const ratio = this.required(e, 40, 'axis ratio');
    let t0 = Number(value(e, 41) ?? 0);
    let t1 = Number(value(e, 42) ?? 2 * Math.PI);
    this.z(value(e, 30));
    const major = Math.hypot(mx, my);
    const problem = !Number.isFinite(major) || major === 0 ? 'its major axis has no length'
      : !(ratio > 0 && ratio <= 1 + 1e-9) ? `its axis ratio (${fmt(ratio)}) is not between 0 and 1`
      : !(Number.isFinite(t0) && Number.isFinite(t1)) ? 'its start or end parameter is not a number'
      : null;
    if (problem) throw new FileRejected('degenerate_entity', `${String(this.ref)} cannot be drawn: ${problem}.`);
    const flipped = this.extrusionSign(e) < 0; // extrusion (0,0,−1): parameters run clockwise
    let span = t1 - t0;
    while (span <= 0) span += 2 * Math.PI;
    const full = span >= 2 * Math.PI - 1e-9;
    if (full) span = 2 * Math.PI;
    t1 = t0 + span;
    // minor axis = ratio · (N × major)
    const nx = flipped ? ratio * my : -ratio * my;
    const ny = flipped ? -ratio * mx : ratio * mx;
    if (Math.abs(ratio - 1) < 1e-12) {
      if (full) return this.out.circle(m, layer, cx, cy, major);
      const rot = (Math.atan2(my, mx) * 180) / Math.PI;
      const [s, en] = [(t0 * 180) / Math.PI, (t1 * 180) / Math.PI];
      return flipped ? this.out.arc(m, layer, cx, cy, major, rot - en, rot - s) : this.out.arc(m, layer, cx, cy, major, rot + s, rot + en);
    }
    const f = (t: number): [number, number] => {
      const x = cx + mx * Math.cos(t) + nx * Math.sin(t);
      const y = cy + my * Math.cos(t) + ny * Math.sin(t);
      return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
    };
    this.out.curve(layer, f, [t0, t1], full);
  }

  /** SPLINE: 71 degree, 40 knots, 41 weights, 10/20 control points, 11/21 fit points, 70 flags. */
  private spline(e: RawEntity, m: Affine, layer: LayerName): void {
    const s: SplineData = { degree: 0, knots: [], control: [], weights: [] };
    let fitPoints = 0;
    let pendingX: number | undefined;
    const g = e.groups;
    for (let i = 0; i < g.length; i += 2) {
      const v = g[i + 1] as number;
      switch (g[i]) {
        case 71: s.degree = v; break;
        case 40: s.knots.push(v); break;
        case 41: s.weights.push(v); break;
        case 10: pendingX = v; break;
        case 20:
          if (pendingX === undefined) throw this.missing('control point x before its y', 10);
          s.control.push(pendingX, v);
          pendingX = undefined;
          break;
        case 30: case 31: this.z(v); break;
        case 11: fitPoints++; break;
      }
    }
    if (s.control.length === 0) {
      throw new FileRejected(
        'unsupported_entity',
        fitPoints
          ? `${String(this.ref)} is given only by fit points, without control points. Export splines with control points, or as polylines.`
          : `${String(this.ref)} has no control points.`,
      );
    }
    // A rational spline (70 & 4) without 41 groups has every weight 1: the reference writes them only when not all are 1.
    const problem = splineProblem(s);
    if (problem) throw new FileRejected('degenerate_entity', `${String(this.ref)} cannot be drawn: ${problem}.`);
    if (s.degree === 1 && s.weights.length === 0) {
      // straight between its control points: no need to sample
      const flat: number[] = [];
      for (let i = 0; i < s.control.length; i += 2) {
        const x = s.control[i];
        const y = s.control[i + 1];
        flat.push(m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]);
      }
      return this.out.polyline(layer, flat, false);
    }
    const f = (t: number): [number, number] => {
      const [x, y] = splinePoint(s, t);
      return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
    };
    this.out.curve(layer, f, splineBreaks(s), false, 4);
  }

  /**
   * INSERT: block 2, insertion point 10/20, scale 41/42, rotation 50 (degrees), 70/71 columns and
   * rows with spacing 44/45 (MINSERT arrays). Block geometry is placed relative to the block's base
   * point (BLOCK group 10): world = OCS · T(insert) · R(rotation) · T(array offset) · S(scale) · T(−base)
   * (array offsets are along the rotated axes, unscaled: from memory).
   */
  private insert(e: RawEntity, m: Affine, layer: LayerName, depth: number, stack: string[]): void {
    const name = value(e, 2);
    if (name === undefined) throw this.missing('block name', 2);
    const blockName = String(name);
    const block = this.blocks.get(blockName);
    if (!block) throw new FileRejected('missing_block', `${String(this.ref)} places block "${blockName}", which the file does not define.`);
    if (stack.includes(blockName)) throw new FileRejected('nesting_too_deep', `Block "${blockName}" contains itself (through INSERT), so it would never end.`);
    if (depth + 1 > MAX_BLOCK_NESTING) {
      throw new FileRejected('nesting_too_deep', `Blocks are nested more than ${MAX_BLOCK_NESTING} deep (at block "${blockName}"). Explode the inner blocks before exporting.`);
    }
    const px = Number(value(e, 10) ?? 0);
    const py = Number(value(e, 20) ?? 0);
    const sx = Number(value(e, 41) ?? 1);
    const sy = Number(value(e, 42) ?? 1);
    const rot = Number(value(e, 50) ?? 0);
    const cols = Number(value(e, 70) ?? 1) || 1;
    const rows = Number(value(e, 71) ?? 1) || 1;
    const dx = Number(value(e, 44) ?? 0);
    const dy = Number(value(e, 45) ?? 0);
    for (const [what, v] of [['insertion point', px], ['insertion point', py], ['scale', sx], ['scale', sy], ['rotation', rot], ['spacing', dx], ['spacing', dy]] as const) {
      if (!Number.isFinite(v)) throw new FileRejected('bad_coordinate', `${String(this.ref)} has a ${what} that is not a finite number.`);
    }
    if (sx === 0 || sy === 0) throw new FileRejected('degenerate_entity', `${String(this.ref)} scales block "${blockName}" by zero.`);
    if (!Number.isInteger(cols) || !Number.isInteger(rows) || cols < 1 || rows < 1 || cols * rows > MAX_ARRAY_COPIES) {
      throw new FileRejected('too_complex', `${String(this.ref)} places block "${blockName}" in a ${cols} × ${rows} array; Jigwright takes at most ${MAX_ARRAY_COPIES.toLocaleString('en-US')} copies per insert.`);
    }
    const bx = block.baseX;
    const by = block.baseY;
    this.z(value(e, 30));
    const base = compose(this.ocs(e, m), compose(translation(px, py), rotationDeg(rot)));
    const local = compose(scaling(sx, sy), translation(-bx, -by));
    const saved = { type: this.ref.type, line: this.ref.line, handle: this.ref.handle, block: this.ref.block };
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const placed = compose(base, compose(translation(c * dx, r * dy), local));
        this.drawList(block.entities, placed, layer, depth + 1, [...stack, blockName]);
      }
    }
    Object.assign(this.ref, saved);
  }
}

/** First value of a group code, or undefined. */
function value(e: RawEntity, code: number): GroupValue | undefined {
  const g = e.groups;
  for (let i = 0; i < g.length; i += 2) if (g[i] === code) return g[i + 1];
  return undefined;
}

/** Index of the last entity that belongs to the POLYLINE at `i`: its SEQEND (scan.ts checks there is one). */
function endOfVertices(list: RawEntity[], i: number): number {
  let j = i + 1;
  while (j < list.length && list[j].type === 'VERTEX') j++;
  return j < list.length && list[j].type === 'SEQEND' ? j : j - 1;
}

function fmt(v: number): string {
  return Number.isFinite(v) ? String(Math.round(v * 1000) / 1000) : String(v);
}

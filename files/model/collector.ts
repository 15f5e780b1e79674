// Builds the imported drawing as one flat makerjs path map in millimetres, with generated ids, so an
// import is a single linear pass: no model re-walks per entity. Every point is checked on the way
// in (finite, within the coordinate limit) and the path count is bounded, so a hostile file fails
// with a clear message before it can exhaust memory.
import makerjs from 'makerjs';
import type { LayerName } from '../../shared/schemas/geometry';
import { FileRejected } from '../errors';
import { type Affine, asSimilarity, type Similarity } from './affine';

export interface CollectorLimits {
  /** Largest |x| or |y| accepted, mm. */
  maxCoordinateMm: number;
  /** Most paths the drawing may expand to (block inserts and curve approximation included). */
  maxPaths: number;
  /** Largest distance between a curve and the straight segments that replace it, mm. */
  chordToleranceMm: number;
}

export const DEFAULT_LIMITS: CollectorLimits = {
  maxCoordinateMm: 1e6,
  maxPaths: 500_000,
  // A router cuts to about ±0.05 mm at best (from memory): 0.01 mm keeps approximation far below it.
  chordToleranceMm: 0.01,
};

/** Shorter than this (mm) is noise from rounding: such paths are dropped and counted. */
const ZERO_LENGTH_MM = 1e-6;
const FULL_TURN_EPS_DEG = 1e-9;

/** Samples a parametric curve given in output coordinates (mm). */
export type CurveFn = (t: number) => readonly [number, number];

export class PathCollector {
  readonly paths: makerjs.IPathMap = {};
  count = 0;
  zeroLength = 0;
  approximated = 0;
  /** Describes the entity or element being read, for error messages; set by the importer. */
  where: { toString(): string } = 'the drawing';

  private lastMatrix: Affine | null = null;
  private lastSimilarity: Similarity | null = null;

  constructor(readonly limits: CollectorLimits = DEFAULT_LIMITS) {}

  /** Most paths share their entity list's matrix: remember the last one's similarity. */
  private similarity(m: Affine): Similarity | null {
    if (m !== this.lastMatrix) {
      this.lastMatrix = m;
      this.lastSimilarity = asSimilarity(m);
    }
    return this.lastSimilarity;
  }

  private add(path: makerjs.IPath, layer: LayerName): void {
    if (this.count >= this.limits.maxPaths) {
      throw new FileRejected(
        'too_complex',
        `The drawing expands to more than ${this.limits.maxPaths.toLocaleString('en-US')} paths (counting block copies and curve segments). Simplify it or split it into several files.`,
      );
    }
    path.layer = layer;
    // ids 0, 1, 2…: integer keys keep a map of 200 000 paths in V8's fast element storage
    this.paths[this.count++] = path;
  }

  private check(v: number, what: string): void {
    if (!Number.isFinite(v)) {
      throw new FileRejected('bad_coordinate', `${String(this.where)} has a ${what} that is not a finite number.`);
    }
    if (Math.abs(v) > this.limits.maxCoordinateMm) {
      throw new FileRejected(
        'bad_coordinate',
        `${String(this.where)} has a ${what} of ${formatMm(v)} mm; Jigwright accepts coordinates within ±${this.limits.maxCoordinateMm.toLocaleString('en-US')} mm. Check the file's units.`,
      );
    }
  }

  private point(m: Affine, x: number, y: number): [number, number] {
    const px = m[0] * x + m[2] * y + m[4];
    const py = m[1] * x + m[3] * y + m[5];
    this.check(px, 'coordinate');
    this.check(py, 'coordinate');
    return [px, py];
  }

  line(m: Affine, layer: LayerName, x1: number, y1: number, x2: number, y2: number): void {
    const a = this.point(m, x1, y1);
    const b = this.point(m, x2, y2);
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    if (dx * dx + dy * dy < ZERO_LENGTH_MM * ZERO_LENGTH_MM) {
      this.zeroLength++;
      return;
    }
    this.add({ type: makerjs.pathType.Line, origin: a, end: b } as makerjs.IPathLine, layer);
  }

  /** A full circle in local coordinates. */
  circle(m: Affine, layer: LayerName, cx: number, cy: number, r: number): void {
    this.check(r, 'radius');
    const sim = this.similarity(m);
    if (sim) {
      const c = this.point(m, cx, cy);
      const radius = Math.abs(r) * sim.scale;
      this.check(radius, 'radius');
      if (radius < ZERO_LENGTH_MM) {
        this.zeroLength++;
        return;
      }
      this.add({ type: makerjs.pathType.Circle, origin: c, radius } as makerjs.IPathCircle, layer);
      return;
    }
    this.curve(layer, transformedCircle(m, cx, cy, r), [0, 2 * Math.PI], true);
  }

  /** An arc in local coordinates, counter-clockwise from startDeg to endDeg. */
  arc(m: Affine, layer: LayerName, cx: number, cy: number, r: number, startDeg: number, endDeg: number): void {
    this.check(r, 'radius');
    this.check(startDeg, 'start angle');
    this.check(endDeg, 'end angle');
    let span = (endDeg - startDeg) % 360;
    if (span < 0) span += 360;
    if (span < FULL_TURN_EPS_DEG) {
      // equal angles: a DXF arc from 0 to 360 written as two equal angles is still a full turn
      if (endDeg !== startDeg) return this.circle(m, layer, cx, cy, r);
      this.zeroLength++;
      return;
    }
    const sim = this.similarity(m);
    if (sim) {
      const c = this.point(m, cx, cy);
      const radius = Math.abs(r) * sim.scale;
      this.check(radius, 'radius');
      if (radius < ZERO_LENGTH_MM) {
        this.zeroLength++;
        return;
      }
      let start = sim.mirrored ? sim.rotationDeg - (startDeg + span) : startDeg + sim.rotationDeg;
      start = ((start % 360) + 360) % 360;
      this.add({ type: makerjs.pathType.Arc, origin: c, radius, startAngle: start, endAngle: start + span } as makerjs.IPathArc, layer);
      return;
    }
    const t0 = (startDeg * Math.PI) / 180;
    this.curve(layer, transformedCircle(m, cx, cy, r), [t0, t0 + (span * Math.PI) / 180], false);
  }

  /**
   * An arc from p1 to p2 given by a DXF bulge (tan of a quarter of the included angle, negative
   * for clockwise; Autodesk DXF Reference, LWPOLYLINE group 42). Bulge 0 is a straight segment.
   */
  bulgeSegment(m: Affine, layer: LayerName, x1: number, y1: number, x2: number, y2: number, bulge: number): void {
    this.check(bulge, 'bulge');
    const dx = x2 - x1;
    const dy = y2 - y1;
    if (bulge === 0 || Math.hypot(dx, dy) === 0) return this.line(m, layer, x1, y1, x2, y2);
    // centre = chord midpoint + the chord's left normal scaled by (1 − b²)/(4b)
    const k = (1 - bulge * bulge) / (4 * bulge);
    const cx = (x1 + x2) / 2 - dy * k;
    const cy = (y1 + y2) / 2 + dx * k;
    const r = Math.hypot(x1 - cx, y1 - cy);
    const a1 = (Math.atan2(y1 - cy, x1 - cx) * 180) / Math.PI;
    const a2 = (Math.atan2(y2 - cy, x2 - cx) * 180) / Math.PI;
    if (bulge > 0) this.arc(m, layer, cx, cy, r, a1, a2);
    else this.arc(m, layer, cx, cy, r, a2, a1);
  }

  /** Straight segments through points already in output coordinates (flat x, y list). */
  polyline(layer: LayerName, flat: number[], closed: boolean): void {
    const n = flat.length / 2;
    for (let i = 0; i < flat.length; i++) this.check(flat[i], 'coordinate');
    for (let i = 0; i + 1 < n; i++) this.outputLine(layer, flat[2 * i], flat[2 * i + 1], flat[2 * i + 2], flat[2 * i + 3]);
    if (closed && n > 2) this.outputLine(layer, flat[2 * n - 2], flat[2 * n - 1], flat[0], flat[1]);
  }

  private outputLine(layer: LayerName, x1: number, y1: number, x2: number, y2: number): void {
    const dx = x2 - x1;
    const dy = y2 - y1;
    if (dx * dx + dy * dy < ZERO_LENGTH_MM * ZERO_LENGTH_MM) {
      this.zeroLength++;
      return;
    }
    this.add({ type: makerjs.pathType.Line, origin: [x1, y1], end: [x2, y2] } as makerjs.IPathLine, layer);
  }

  /**
   * A smooth curve (output coordinates) replaced by straight segments no further than the chord
   * tolerance from it: each piece between consecutive `breaks` (parameter values) is halved until
   * its midpoint lies within tolerance of the chord.
   */
  curve(layer: LayerName, f: CurveFn, breaks: readonly number[], closed: boolean, minSegmentsPerPiece = 16): void {
    const flat: number[] = [];
    for (let i = 0; i + 1 < breaks.length; i++) {
      const piece = sampleCurve(f, breaks[i], breaks[i + 1], this.limits.chordToleranceMm, minSegmentsPerPiece, this.limits.maxPaths - this.count - flat.length / 2);
      if (piece === null) {
        throw new FileRejected('too_complex', `${String(this.where)} needs more than ${this.limits.maxPaths.toLocaleString('en-US')} segments to draw. Simplify it.`);
      }
      for (let j = flat.length === 0 ? 0 : 2; j < piece.length; j++) flat.push(piece[j]); // pieces share their end points
    }
    this.approximated++;
    if (closed) flat.length -= 2; // the last sample repeats the first; polyline() closes the loop itself
    this.polyline(layer, flat, closed);
  }

  model(): makerjs.IModel {
    return { units: makerjs.unitType.Millimeter, paths: this.paths };
  }
}

function transformedCircle(m: Affine, cx: number, cy: number, r: number): CurveFn {
  return (t) => {
    const x = cx + r * Math.cos(t);
    const y = cy + r * Math.sin(t);
    return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
  };
}

const MAX_HALVINGS = 12;

/**
 * Points (flat x, y) along f from t0 to t1, both ends included. Starts from `minSegments` even
 * pieces (so a wave is not mistaken for its chord) and halves each until its midpoint is within
 * `tol` of the chord. Returns null if more than `budget` segments would be needed.
 */
export function sampleCurve(f: CurveFn, t0: number, t1: number, tol: number, minSegments: number, budget: number): number[] | null {
  const out: number[] = [];
  const first = f(t0);
  out.push(first[0], first[1]);
  let segments = 0;
  const refine = (ta: number, pa: readonly [number, number], tb: number, pb: readonly [number, number], depth: number): boolean => {
    const tm = (ta + tb) / 2;
    const pm = f(tm);
    if (depth < MAX_HALVINGS && distanceToChord(pm, pa, pb) > tol) {
      return refine(ta, pa, tm, pm, depth + 1) && refine(tm, pm, tb, pb, depth + 1);
    }
    if (++segments > budget) return false;
    out.push(pb[0], pb[1]);
    return true;
  };
  let ta = t0;
  let pa = first;
  for (let i = 1; i <= minSegments; i++) {
    const tb = i === minSegments ? t1 : t0 + ((t1 - t0) * i) / minSegments;
    const pb = f(tb);
    if (!refine(ta, pa, tb, pb, 0)) return null;
    ta = tb;
    pa = pb;
  }
  return out;
}

function distanceToChord(p: readonly [number, number], a: readonly [number, number], b: readonly [number, number]): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy);
  if (len === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  return Math.abs((p[0] - a[0]) * dy - (p[1] - a[1]) * dx) / len;
}

function formatMm(v: number): string {
  return Math.abs(v) >= 1e9 ? v.toExponential(2) : v.toLocaleString('en-US', { maximumFractionDigits: 3 });
}

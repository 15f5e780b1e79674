// Checks SVG path data against the grammar of SVG 1.1 §8.3 (W3C) and rewrites it in a plain form
// that makerjs.importer.fromSVGPathData reads correctly: absolute M, L, circular A and Z only.
// makerjs skips unknown letters silently, reads a missing number as null, and misreads compact arc
// flags ("a5 5 0 1110 10"); it also needs the out-of-range arc radii corrections of SVG 1.1
// Appendix F.6.2 and F.6.6 (a zero radius draws a straight line, negative radii count as positive,
// radii too small to reach the end point are scaled up until they just do). Bézier curves and
// elliptical arcs are replaced here by straight segments within the given tolerance: makerjs fits
// arcs to Béziers at about 4 ms and 40 arcs per small curve at 0.01 mm, too slow for real files.
import { sampleCurve } from '../model/collector';

export class PathDataError extends Error {}

export interface NormalizedPath {
  d: string;
  /** Curves (Béziers, elliptical arcs) that became straight segments. */
  flattened: number;
}

/** Most straight segments one path's curves may become. */
const MAX_SEGMENTS = 500_000;

const ARG_COUNT: Record<string, number> = { M: 2, L: 2, T: 2, H: 1, V: 1, C: 6, S: 4, Q: 4, A: 7, Z: 0 };
const NUMBER = /[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/y;

/**
 * Normalised path data, or throws PathDataError saying what is wrong and where. `tolerance` is the
 * largest distance, in the path's own units, between a curve and the segments that replace it.
 */
export function normalizePathData(d: string, tolerance: number): NormalizedPath {
  const out: string[] = [];
  let flattened = 0;
  let segments = 0;
  // the last control point of a cubic (for S) or quadratic (for T), when the previous command was one
  let cubicX = NaN;
  let cubicY = NaN;
  let quadX = NaN;
  let quadY = NaN;
  const flatten = (f: (t: number) => readonly [number, number], t0: number, t1: number) => {
    const flat = sampleCurve(f, t0, t1, tolerance, 4, MAX_SEGMENTS - segments);
    if (!flat) throw new PathDataError(`its curves need more than ${MAX_SEGMENTS.toLocaleString('en-US')} segments`);
    for (let k = 2; k < flat.length; k += 2) out.push(`L ${flat[k]} ${flat[k + 1]}`);
    segments += flat.length / 2 - 1;
    flattened++;
  };
  let i = 0;
  const n = d.length;
  let cx = 0;
  let cy = 0; // current point, absolute
  let sx = 0;
  let sy = 0; // start of the current subpath
  let first = true;

  const skipSeparators = (allowComma: boolean) => {
    let comma = false;
    while (i < n) {
      const c = d[i];
      if (c === ' ' || c === '\t' || c === '\n' || c === '\r' || c === '\f') i++;
      else if (c === ',' && allowComma && !comma) {
        comma = true;
        i++;
      } else break;
    }
  };
  const readNumber = (): number => {
    NUMBER.lastIndex = i;
    const m = NUMBER.exec(d);
    if (!m) throw new PathDataError(`expected a number at character ${i + 1}`);
    i = NUMBER.lastIndex;
    const v = Number(m[0]);
    if (!Number.isFinite(v)) throw new PathDataError(`the number at character ${i + 1} is out of range`);
    return v;
  };
  const readFlag = (): number => {
    const c = d[i];
    if (c !== '0' && c !== '1') throw new PathDataError(`expected an arc flag (0 or 1) at character ${i + 1}`);
    i++;
    return c === '1' ? 1 : 0;
  };
  const startsNumber = () => i < n && /[0-9.+-]/.test(d[i]);

  skipSeparators(false);
  while (i < n) {
    const letter = d[i];
    const upper = letter.toUpperCase();
    if (!(upper in ARG_COUNT)) throw new PathDataError(`"${letter}" at character ${i + 1} is not a path command`);
    if (first && upper !== 'M') throw new PathDataError('path data must start with a move (M)');
    const rel = letter !== upper;
    i++;
    skipSeparators(false);
    if (upper === 'Z') {
      out.push('Z');
      cx = sx;
      cy = sy;
      first = false;
      cubicX = quadX = NaN;
      continue;
    }
    let groups = 0;
    do {
      const args: number[] = [];
      for (let k = 0; k < ARG_COUNT[upper]; k++) {
        if (k > 0) skipSeparators(true);
        args.push(upper === 'A' && (k === 3 || k === 4) ? readFlag() : readNumber());
      }
      skipSeparators(true);
      groups++;
      // the command a repeated coordinate group stands for: extra pairs after M are line-tos
      const cmd = upper === 'M' && groups > 1 ? 'L' : upper;
      const ox = rel ? cx : 0;
      const oy = rel ? cy : 0;
      const x0 = cx;
      const y0 = cy;
      let nextCubicX = NaN;
      let nextCubicY = NaN;
      let nextQuadX = NaN;
      let nextQuadY = NaN;
      switch (cmd) {
        case 'M':
          cx = args[0] + ox;
          cy = args[1] + oy;
          sx = cx;
          sy = cy;
          out.push(`M ${cx} ${cy}`);
          break;
        case 'L':
          cx = args[0] + ox;
          cy = args[1] + oy;
          out.push(`L ${cx} ${cy}`);
          break;
        case 'H':
          cx = args[0] + ox;
          out.push(`L ${cx} ${cy}`);
          break;
        case 'V':
          cy = args[0] + oy;
          out.push(`L ${cx} ${cy}`);
          break;
        case 'C':
        case 'S': {
          // S reflects the previous cubic's second control point about the current point (SVG 1.1 §8.3.6)
          const [x1, y1] = cmd === 'C' ? [args[0] + ox, args[1] + oy] : Number.isNaN(cubicX) ? [x0, y0] : [2 * x0 - cubicX, 2 * y0 - cubicY];
          const k = cmd === 'C' ? 2 : 0;
          const x2 = args[k] + ox;
          const y2 = args[k + 1] + oy;
          cx = args[k + 2] + ox;
          cy = args[k + 3] + oy;
          const [x3, y3] = [cx, cy];
          flatten((t) => {
            const u = 1 - t;
            const a = u * u * u;
            const b = 3 * u * u * t;
            const c = 3 * u * t * t;
            const e = t * t * t;
            return [a * x0 + b * x1 + c * x2 + e * x3, a * y0 + b * y1 + c * y2 + e * y3];
          }, 0, 1);
          nextCubicX = x2;
          nextCubicY = y2;
          break;
        }
        case 'Q':
        case 'T': {
          const [x1, y1] = cmd === 'Q' ? [args[0] + ox, args[1] + oy] : Number.isNaN(quadX) ? [x0, y0] : [2 * x0 - quadX, 2 * y0 - quadY];
          const k = cmd === 'Q' ? 2 : 0;
          cx = args[k] + ox;
          cy = args[k + 1] + oy;
          const [x2, y2] = [cx, cy];
          flatten((t) => {
            const u = 1 - t;
            return [u * u * x0 + 2 * u * t * x1 + t * t * x2, u * u * y0 + 2 * u * t * y1 + t * t * y2];
          }, 0, 1);
          nextQuadX = x1;
          nextQuadY = y1;
          break;
        }
        case 'A': {
          const x = args[5] + ox;
          const y = args[6] + oy;
          const arc = arcTo(x0, y0, Math.abs(args[0]), Math.abs(args[1]), args[2], args[3], args[4], x, y);
          if (typeof arc === 'string') out.push(arc);
          else flatten(arc.point, arc.theta1, arc.theta1 + arc.delta);
          cx = x;
          cy = y;
          break;
        }
      }
      cubicX = nextCubicX;
      cubicY = nextCubicY;
      quadX = nextQuadX;
      quadY = nextQuadY;
      first = false;
    } while (startsNumber());
  }
  return { d: out.join(' '), flattened };
}

interface EllipticArc {
  point: (theta: number) => readonly [number, number];
  theta1: number;
  delta: number;
}

/**
 * One absolute arc, corrected per SVG 1.1 F.6.2 and F.6.6: a circular arc as an A command (makerjs
 * draws it exactly), a line, nothing, or an elliptical arc in centre form (F.6.5) to be flattened.
 */
function arcTo(x1: number, y1: number, rx: number, ry: number, rotation: number, large: number, sweep: number, x2: number, y2: number): string | EllipticArc {
  if (x1 === x2 && y1 === y2) return ''; // F.6.2: identical end points omit the arc
  if (rx === 0 || ry === 0) return `L ${x2} ${y2}`;
  const phi = (rotation * Math.PI) / 180;
  const cos = Math.cos(phi);
  const sin = Math.sin(phi);
  const hx = (x1 - x2) / 2;
  const hy = (y1 - y2) / 2;
  const x1p = cos * hx + sin * hy;
  const y1p = -sin * hx + cos * hy;
  const lambda = (x1p * x1p) / (rx * rx) + (y1p * y1p) / (ry * ry);
  // F.6.6: radii too small are scaled up until the arc just reaches. Within rounding of that (a
  // half turn written with rounded numbers) snap to it too: the centre's square root in F.6.5
  // would turn a 1e-15 rounding into a 1e-7 shift. makerjs snaps circular arcs the same way.
  const reaches = lambda > 1 - 1e-10;
  if (reaches) {
    const k = Math.sqrt(lambda);
    rx *= k;
    ry *= k;
  }
  if (Math.abs(rx - ry) <= 1e-12 * Math.max(rx, ry)) return `A ${rx} ${ry} 0 ${large} ${sweep} ${x2} ${y2}`;
  // F.6.5: centre of the ellipse, start angle and sweep
  const rx2 = rx * rx;
  const ry2 = ry * ry;
  const num = rx2 * ry2 - rx2 * y1p * y1p - ry2 * x1p * x1p;
  const den = rx2 * y1p * y1p + ry2 * x1p * x1p;
  const coef = reaches ? 0 : (large !== sweep ? 1 : -1) * Math.sqrt(Math.max(0, num / den));
  const cxp = (coef * rx * y1p) / ry;
  const cyp = (-coef * ry * x1p) / rx;
  const ecx = cos * cxp - sin * cyp + (x1 + x2) / 2;
  const ecy = sin * cxp + cos * cyp + (y1 + y2) / 2;
  const ux = (x1p - cxp) / rx;
  const uy = (y1p - cyp) / ry;
  const vx = (-x1p - cxp) / rx;
  const vy = (-y1p - cyp) / ry;
  const theta1 = Math.atan2(uy, ux);
  let delta = Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  if (sweep === 0 && delta > 0) delta -= 2 * Math.PI;
  if (sweep === 1 && delta < 0) delta += 2 * Math.PI;
  return {
    point: (t) => [ecx + rx * cos * Math.cos(t) - ry * sin * Math.sin(t), ecy + rx * sin * Math.cos(t) + ry * cos * Math.sin(t)],
    theta1,
    delta,
  };
}

// Checks SVG path data against the grammar of SVG 1.1 §8.3 (W3C) and rewrites it in a plain form
// that makerjs.importer.fromSVGPathData reads correctly. makerjs skips unknown letters silently,
// reads a missing number as null, and misreads compact arc flags ("a5 5 0 1110 10"); it also needs
// the out-of-range arc radii corrections that SVG 1.1 Appendix F.6.2 and F.6.6 prescribe:
// a zero radius draws a straight line, negative radii count as positive, and radii too small to
// reach the end point are scaled up until they just do.

export class PathDataError extends Error {}

const ARG_COUNT: Record<string, number> = { M: 2, L: 2, T: 2, H: 1, V: 1, C: 6, S: 4, Q: 4, A: 7, Z: 0 };
const NUMBER = /[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/y;

/** Normalised path data, or throws PathDataError saying what is wrong and where. */
export function normalizePathData(d: string): string {
  const out: string[] = [];
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
      switch (cmd) {
        case 'M':
          cx = args[0] + ox;
          cy = args[1] + oy;
          sx = cx;
          sy = cy;
          out.push(`M ${cx} ${cy}`);
          break;
        case 'L':
        case 'T':
          cx = args[0] + ox;
          cy = args[1] + oy;
          out.push(`${cmd} ${cx} ${cy}`);
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
          out.push(`C ${args[0] + ox} ${args[1] + oy} ${args[2] + ox} ${args[3] + oy} ${args[4] + ox} ${args[5] + oy}`);
          cx = args[4] + ox;
          cy = args[5] + oy;
          break;
        case 'S':
        case 'Q':
          out.push(`${cmd} ${args[0] + ox} ${args[1] + oy} ${args[2] + ox} ${args[3] + oy}`);
          cx = args[2] + ox;
          cy = args[3] + oy;
          break;
        case 'A': {
          const x = args[5] + ox;
          const y = args[6] + oy;
          out.push(arcTo(cx, cy, Math.abs(args[0]), Math.abs(args[1]), args[2], args[3], args[4], x, y));
          cx = x;
          cy = y;
          break;
        }
      }
      first = false;
    } while (startsNumber());
  }
  return out.join(' ');
}

/** One absolute arc command, corrected per SVG 1.1 F.6.2 and F.6.6 (or a line, or nothing). */
function arcTo(x1: number, y1: number, rx: number, ry: number, rotation: number, large: number, sweep: number, x2: number, y2: number): string {
  if (x1 === x2 && y1 === y2) return ''; // F.6.2: identical end points omit the arc
  if (rx === 0 || ry === 0) return `L ${x2} ${y2}`;
  const phi = (rotation * Math.PI) / 180;
  const hx = (x1 - x2) / 2;
  const hy = (y1 - y2) / 2;
  const x1p = Math.cos(phi) * hx + Math.sin(phi) * hy;
  const y1p = -Math.sin(phi) * hx + Math.cos(phi) * hy;
  const lambda = (x1p * x1p) / (rx * rx) + (y1p * y1p) / (ry * ry);
  if (lambda > 1 - 1e-9) {
    // just reaching: a hair larger keeps makerjs' centre computation off a negative square root
    const k = Math.sqrt(lambda) * (1 + 1e-9);
    rx *= k;
    ry *= k;
  }
  return `A ${rx} ${ry} ${rotation} ${large} ${sweep} ${x2} ${y2}`;
}

// Classifies two revisions' drawings segment by segment for the compare overlay: a segment is
// "unchanged" when the same segment (same layer, end points and arc shape, rounded to 0.01 mm,
// either direction) is in both; otherwise it is only in A or only in B. Pure: no React, no DOM.
import type { LayerPath } from '../../shared/geometry/paths';

export type SegmentClass = 'onlyA' | 'onlyB' | 'both';

export interface Classified {
  /** One SVG path data string per class, so the overlay draws three elements, not thousands. */
  d: Record<SegmentClass, string>;
  counts: Record<SegmentClass, number>;
}

interface Seg {
  key: string;
  d: string;
}

const r2 = (v: number) => (Math.round(v * 100) / 100).toFixed(2).replace(/^-0\.00$/, '0.00');

/** Splits path data (absolute M, L, H, V, A, C, Q, Z as makerjs writes it) into keyed segments. */
export function segmentsOf(layer: string, d: string): Seg[] {
  const tokens = d.match(/[A-Za-z]|[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g) ?? [];
  const out: Seg[] = [];
  let i = 0;
  let cmd = '';
  let x = 0;
  let y = 0;
  let sx = 0;
  let sy = 0;
  const num = () => Number(tokens[i++]);
  const isNum = (t: string | undefined) => t !== undefined && !/^[A-Za-z]$/.test(t);
  const line = (x1: number, y1: number) => {
    if (r2(x) === r2(x1) && r2(y) === r2(y1)) return;
    const p = [r2(x), r2(y)];
    const q = [r2(x1), r2(y1)];
    const [s, e] = p[0] < q[0] || (p[0] === q[0] && p[1] <= q[1]) ? [p, q] : [q, p];
    out.push({ key: `${layer}|L|${s.join(',')}|${e.join(',')}`, d: `M${x} ${y}L${x1} ${y1}` });
  };
  while (i < tokens.length) {
    if (!isNum(tokens[i])) cmd = tokens[i++];
    switch (cmd) {
      case 'M':
        x = sx = num();
        y = sy = num();
        cmd = 'L'; // further pairs after M are lines
        break;
      case 'L': {
        const x1 = num();
        const y1 = num();
        line(x1, y1);
        x = x1;
        y = y1;
        break;
      }
      case 'H': {
        const x1 = num();
        line(x1, y);
        x = x1;
        break;
      }
      case 'V': {
        const y1 = num();
        line(x, y1);
        y = y1;
        break;
      }
      case 'A': {
        const [rx, ry, rot, large, sweep, x1, y1] = [num(), num(), num(), num(), num(), num(), num()];
        const p = [r2(x), r2(y)];
        const q = [r2(x1), r2(y1)];
        const forward = p[0] < q[0] || (p[0] === q[0] && p[1] <= q[1]);
        const [s, e, sw] = forward ? [p, q, sweep] : [q, p, sweep ? 0 : 1];
        out.push({ key: `${layer}|A|${r2(rx)},${r2(ry)},${r2(rot)},${large ? 1 : 0},${sw ? 1 : 0}|${s.join(',')}|${e.join(',')}`, d: `M${x} ${y}A${rx} ${ry} ${rot} ${large} ${sweep} ${x1} ${y1}` });
        x = x1;
        y = y1;
        break;
      }
      case 'C':
      case 'Q': {
        const n = cmd === 'C' ? 6 : 4;
        const vals = Array.from({ length: n }, num);
        const x1 = vals[n - 2];
        const y1 = vals[n - 1];
        out.push({ key: `${layer}|${cmd}|${r2(x)},${r2(y)}|${vals.map(r2).join(',')}`, d: `M${x} ${y}${cmd}${vals.join(' ')}` });
        x = x1;
        y = y1;
        break;
      }
      case 'Z':
      case 'z':
        line(sx, sy);
        x = sx;
        y = sy;
        cmd = '';
        break;
      default:
        // A command this reader does not know: skip its token rather than loop forever.
        i++;
    }
  }
  return out;
}

/**
 * Which segments are only in A, only in B, or in both. Built once from a Map keyed by the rounded
 * segment (memoize the call on the two path lists); each class comes back as one path string.
 */
export function classifySegments(a: LayerPath[], b: LayerPath[]): Classified {
  const seen = new Map<string, { d: string; mask: number }>();
  const add = (paths: LayerPath[], bit: number) => {
    for (const p of paths) {
      for (const s of segmentsOf(p.layer, p.d)) {
        const hit = seen.get(s.key);
        if (hit) hit.mask |= bit;
        else seen.set(s.key, { d: s.d, mask: bit });
      }
    }
  };
  add(a, 1);
  add(b, 2);
  const parts: Record<SegmentClass, string[]> = { onlyA: [], onlyB: [], both: [] };
  for (const { d, mask } of seen.values()) parts[mask === 3 ? 'both' : mask === 1 ? 'onlyA' : 'onlyB'].push(d);
  return {
    d: { onlyA: parts.onlyA.join(''), onlyB: parts.onlyB.join(''), both: parts.both.join('') },
    counts: { onlyA: parts.onlyA.length, onlyB: parts.onlyB.length, both: parts.both.length },
  };
}

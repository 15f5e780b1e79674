// 2D affine transforms for the importers: DXF block inserts and OCS mirroring, SVG transform lists,
// unit scaling and the SVG y-flip all compose into one matrix per path.

/** [a, b, c, d, e, f]: x' = a·x + c·y + e, y' = b·x + d·y + f (the SVG matrix() order). */
export type Affine = readonly [number, number, number, number, number, number];

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0];

/** The transform that applies `inner` first, then `outer`. */
export function compose(outer: Affine, inner: Affine): Affine {
  const [a1, b1, c1, d1, e1, f1] = outer;
  const [a2, b2, c2, d2, e2, f2] = inner;
  return [
    a1 * a2 + c1 * b2,
    b1 * a2 + d1 * b2,
    a1 * c2 + c1 * d2,
    b1 * c2 + d1 * d2,
    a1 * e2 + c1 * f2 + e1,
    b1 * e2 + d1 * f2 + f1,
  ];
}

export const translation = (tx: number, ty: number): Affine => [1, 0, 0, 1, tx, ty];
export const scaling = (sx: number, sy: number = sx): Affine => [sx, 0, 0, sy, 0, 0];

export function rotationDeg(deg: number): Affine {
  const r = (deg * Math.PI) / 180;
  const cos = Math.cos(r);
  const sin = Math.sin(r);
  return [cos, sin, -sin, cos, 0, 0];
}

/** Uniform scale, rotation and whether the transform mirrors, when it keeps circles circular. */
export interface Similarity {
  scale: number;
  /** Angle of the image of the x axis, degrees. */
  rotationDeg: number;
  mirrored: boolean;
}

/** The transform as a similarity (circles stay circles), or null when it stretches or skews. */
export function asSimilarity(m: Affine): Similarity | null {
  const [a, b, c, d] = m;
  const lenX = Math.hypot(a, b);
  const lenY = Math.hypot(c, d);
  if (lenX === 0 || lenY === 0) return null;
  const rel = 1e-9 * Math.max(lenX, lenY);
  if (Math.abs(lenX - lenY) > rel) return null;
  if (Math.abs(a * c + b * d) > rel * Math.max(lenX, lenY)) return null; // columns must stay perpendicular
  const det = a * d - b * c;
  return { scale: lenX, rotationDeg: (Math.atan2(b, a) * 180) / Math.PI, mirrored: det < 0 };
}

/** The largest factor by which the transform stretches any length (its largest singular value). */
export function maxStretch(m: Affine): number {
  const [a, b, c, d] = m;
  const s = a * a + b * b + c * c + d * d;
  const det = a * d - b * c;
  return Math.sqrt((s + Math.sqrt(Math.max(0, s * s - 4 * det * det))) / 2);
}

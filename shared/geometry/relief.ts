// Corner reliefs for square inside corners, bit radius r (pure geometry; REFERENCES.md):
// - Dogbone: a relief circle of radius r through the corner point, centre on the corner's bisector
//   at r from the corner, i.e. r/√2 from each wall; it overcuts each wall by r(1 − 1/√2) ≈ 0.2929 r.
// - T-bone: centre at r from the corner along one wall (perpendicular to the other); it overcuts
//   that other wall by r and leaves the first wall untouched.
import makerjs from 'makerjs';

export type CornerStyle = 'radius' | 'dogbone' | 'tbone';

/** Dogbone: distance of the relief centre from each wall. 1/4 in bit → 2.2451 mm, 6 mm → 2.1213 mm. */
export const dogboneCentreOffset = (r: number) => r / Math.SQRT2;
/** Dogbone: how far the relief cuts into each wall. */
export const dogboneOvercut = (r: number) => r * (1 - 1 / Math.SQRT2);

export interface Circle {
  c: [number, number];
  r: number;
}

/**
 * Relief circles at the four inside corners of the rectangle (x, y, w, h).
 * T-bone `into` names the walls that take the overcut: 'ends' = the horizontal walls (y = y and
 * y = y + h), 'sides' = the vertical ones.
 */
export function reliefCircles(x: number, y: number, w: number, h: number, r: number, style: 'dogbone' | 'tbone', into: 'ends' | 'sides' = 'ends'): Circle[] {
  const corners: [number, number, number, number][] = [
    [x, y, 1, 1],
    [x + w, y, -1, 1],
    [x + w, y + h, -1, -1],
    [x, y + h, 1, -1],
  ];
  return corners.map(([cx, cy, sx, sy]) => {
    if (style === 'dogbone') {
      const o = dogboneCentreOffset(r);
      return { c: [cx + sx * o, cy + sy * o] as [number, number], r };
    }
    // T-bone: the centre lies on the wall that is overcut, r from the corner along it.
    return into === 'ends' ? { c: [cx + sx * r, cy] as [number, number], r } : { c: [cx, cy + sy * r] as [number, number], r };
  });
}

export function circlesModel(circles: Circle[]): makerjs.IModel {
  const paths: makerjs.IPathMap = {};
  circles.forEach((k, i) => (paths[`r${i}`] = new makerjs.paths.Circle(k.c, k.r)));
  return { paths };
}

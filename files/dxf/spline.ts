// B-spline (optionally rational) evaluation for DXF SPLINE entities: de Boor's algorithm on the
// control points, knot vector and weights the entity stores (Autodesk DXF Reference, SPLINE:
// 71 degree, 40 knots, 41 weights, 10/20 control points). Definition of the curve: Piegl & Tiller,
// The NURBS Book, 2nd ed., eq. 4.2 and algorithm A2.1 (from memory).

export interface SplineData {
  degree: number;
  knots: number[];
  /** Control points as a flat x, y list. */
  control: number[];
  /** One per control point, or empty for a non-rational spline (all weights 1). */
  weights: number[];
}

/** Why the spline cannot be drawn, or null when it is well formed. */
export function splineProblem(s: SplineData): string | null {
  const n = s.control.length / 2;
  const p = s.degree;
  if (!Number.isInteger(p) || p < 1 || p > 25) return `its degree (${p}) is not between 1 and 25`;
  if (n < p + 1) return `it has ${n} control point${n === 1 ? '' : 's'}, fewer than degree + 1 = ${p + 1}`;
  if (s.knots.length !== n + p + 1) return `it has ${s.knots.length} knots where ${n} control points of degree ${p} need ${n + p + 1}`;
  for (let i = 0; i < s.knots.length; i++) {
    if (!Number.isFinite(s.knots[i])) return 'a knot value is not a finite number';
    if (i > 0 && s.knots[i] < s.knots[i - 1]) return 'its knot values decrease';
  }
  if (!(s.knots[p] < s.knots[n])) return 'its knot vector spans no length';
  if (s.weights.length !== 0 && s.weights.length !== n) return `it has ${s.weights.length} weights for ${n} control points`;
  for (const w of s.weights) if (!(Number.isFinite(w) && w > 0)) return 'a weight is not a positive number';
  for (const v of s.control) if (!Number.isFinite(v)) return 'a control point is not a finite number';
  return null;
}

/** Parameter breakpoints: the distinct knots across the domain [knots[p], knots[n]]. */
export function splineBreaks(s: SplineData): number[] {
  const n = s.control.length / 2;
  const out: number[] = [];
  for (let i = s.degree; i <= n; i++) {
    const k = s.knots[i];
    if (out.length === 0 || k > out[out.length - 1]) out.push(k);
  }
  return out;
}

/** The point at parameter t (clamped to the domain). */
export function splinePoint(s: SplineData, t: number): [number, number] {
  const p = s.degree;
  const n = s.control.length / 2;
  const U = s.knots;
  if (t < U[p]) t = U[p];
  if (t > U[n]) t = U[n];
  // span k with U[k] <= t < U[k+1]; at the end of the domain, the last non-empty span
  let k = p;
  while (k < n - 1 && U[k + 1] <= t) k++;
  const dx = new Array<number>(p + 1);
  const dy = new Array<number>(p + 1);
  const dw = new Array<number>(p + 1);
  for (let j = 0; j <= p; j++) {
    const i = j + k - p;
    const w = s.weights.length ? s.weights[i] : 1;
    dx[j] = s.control[2 * i] * w;
    dy[j] = s.control[2 * i + 1] * w;
    dw[j] = w;
  }
  for (let r = 1; r <= p; r++) {
    for (let j = p; j >= r; j--) {
      const lo = U[j + k - p];
      const hi = U[j + 1 + k - r];
      const a = hi === lo ? 0 : (t - lo) / (hi - lo);
      dx[j] = (1 - a) * dx[j - 1] + a * dx[j];
      dy[j] = (1 - a) * dy[j - 1] + a * dy[j];
      dw[j] = (1 - a) * dw[j - 1] + a * dw[j];
    }
  }
  return [dx[p] / dw[p], dy[p] / dw[p]];
}

// What a drawing measures: extents, total path length, closed/open contours, the area of the part
// and path counts per layer. makerjs has no area function, so the area is integrated exactly from
// the chains: the shoelace sum over each link's chord plus, for each arc, its circular segment
// r²(θ − sin θ)/2 (added when the arc runs counter-clockwise along the chain, subtracted when
// clockwise); a full circle is πr². Outermost closed chains count positive, holes negative.
//
// Contours are found by a light chain finder of our own (endpoints matched on a 1e-6 mm grid)
// when every joint joins at most two paths, which is all a generator draws; anything else
// (branching joints, curves other than lines, arcs and circles) goes to makerjs.model.findChains.
import makerjs from 'makerjs';
import type { GeometrySummary } from '../schemas/geometry';

type Features = NonNullable<GeometrySummary['features']>;
type Pt = [number, number];

/** A closed contour: its enclosed area (unsigned), a point on it, and its outline as points. */
interface Loop {
  area: number;
  sample: Pt;
  points: () => Pt[];
}

/** Chord term plus circular segment of one path run from `s` to `e` (arcs: forward = CCW). */
function pathAreaTerm(path: makerjs.IPath, s: Pt, e: Pt, reversed: boolean): number {
  let a = (s[0] * e[1] - e[0] * s[1]) / 2;
  if (path.type === makerjs.pathType.Arc) {
    const arc = path as makerjs.IPathArc;
    const theta = (makerjs.angle.ofArcSpan(arc) * Math.PI) / 180;
    const segment = (arc.radius * arc.radius * (theta - Math.sin(theta))) / 2;
    a += reversed ? -segment : segment;
  }
  return a;
}

function circleLoop(c: makerjs.IPathCircle, offset: makerjs.IPoint): Loop {
  const cx = c.origin[0] + offset[0];
  const cy = c.origin[1] + offset[1];
  return {
    area: Math.PI * c.radius * c.radius,
    sample: [cx + c.radius, cy],
    points: () => makerjs.path.toKeyPoints(c, 0.5).map((q) => [q[0] + offset[0], q[1] + offset[1]] as Pt),
  };
}

/** Signed area enclosed by a makerjs chain (counter-clockwise positive), mm². */
export function chainSignedArea(chain: makerjs.IChain): number {
  let area = 0;
  for (const link of chain.links) {
    const path = link.walkedPath.pathContext;
    if (path.type === makerjs.pathType.Circle) {
      const r = (path as makerjs.IPathCircle).radius;
      area += Math.PI * r * r;
      continue;
    }
    const [a, b] = link.endPoints;
    const s: Pt = link.reversed ? [b[0], b[1]] : [a[0], a[1]];
    const e: Pt = link.reversed ? [a[0], a[1]] : [b[0], b[1]];
    area += pathAreaTerm(path, s, e, link.reversed);
  }
  return area;
}

function insidePolygon(p: Pt, poly: Pt[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i];
    const [xj, yj] = poly[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Outermost loops minus the holes inside them (alternating by nesting depth), mm². */
function areaOfLoops(loops: Loop[]): number {
  if (loops.length === 0) return 0;
  if (loops.length === 1) return loops[0].area;
  const polys = loops.map((l) => l.points());
  let total = 0;
  for (let i = 0; i < loops.length; i++) {
    let depth = 0;
    for (let j = 0; j < loops.length; j++) {
      if (j !== i && loops[j].area > loops[i].area && insidePolygon(loops[i].sample, polys[j])) depth++;
    }
    total += depth % 2 === 0 ? loops[i].area : -loops[i].area;
  }
  return total;
}

/** Outermost closed chains minus the holes inside them, for chains makerjs found. */
export function areaOfChains(chains: makerjs.IChain[]): number {
  return areaOfLoops(
    chains
      .filter((c) => c.endless)
      .map((c) => {
        const first = c.links[0];
        const path = first.walkedPath.pathContext;
        if (path.type === makerjs.pathType.Circle) return circleLoop(path as makerjs.IPathCircle, first.walkedPath.offset);
        return {
          area: Math.abs(chainSignedArea(c)),
          sample: [first.endPoints[0][0], first.endPoints[0][1]] as Pt,
          points: () => makerjs.chain.toKeyPoints(c, 0.5).map((q) => [q[0], q[1]] as Pt),
        };
      }),
  );
}

interface Seg {
  path: makerjs.IPath;
  offset: makerjs.IPoint;
  a: Pt;
  b: Pt;
  na: number;
  nb: number;
}

const GRID = 1e6; // endpoints within about 1e-6 mm are the same joint

/** Our chain finder for one layer; null when the layer needs makerjs (branching, other curves). */
function contoursOfLayer(paths: { path: makerjs.IPath; offset: makerjs.IPoint }[], wantLoops: boolean): { closed: number; open: number; loops: Loop[] } | null {
  let closed = 0;
  let open = 0;
  const loops: Loop[] = [];
  const segs: Seg[] = [];
  const cells = new Map<string, number>();
  const nodePos: Pt[] = [];
  const nodeOf = (p: Pt): number => {
    const fx = p[0] * GRID;
    const fy = p[1] * GRID;
    const ix = Math.round(fx);
    const iy = Math.round(fy);
    const key = `${ix},${iy}`;
    const hit = cells.get(key);
    if (hit !== undefined) return hit;
    // A joint less than half a grid step away that rounded into a neighbouring cell lies on the
    // side this point's fraction points to: only those three neighbours need looking at.
    const sx = fx >= ix ? 1 : -1;
    const sy = fy >= iy ? 1 : -1;
    const near = cells.get(`${ix + sx},${iy}`) ?? cells.get(`${ix},${iy + sy}`) ?? cells.get(`${ix + sx},${iy + sy}`);
    if (near !== undefined) return near;
    const id = nodePos.length;
    nodePos.push(p);
    cells.set(key, id);
    return id;
  };
  for (const { path, offset } of paths) {
    if (path.type === makerjs.pathType.Circle) {
      closed++;
      if (wantLoops) loops.push(circleLoop(path as makerjs.IPathCircle, offset));
      continue;
    }
    let a: Pt;
    let b: Pt;
    if (path.type === makerjs.pathType.Line) {
      const l = path as makerjs.IPathLine;
      a = [l.origin[0] + offset[0], l.origin[1] + offset[1]];
      b = [l.end[0] + offset[0], l.end[1] + offset[1]];
    } else if (path.type === makerjs.pathType.Arc) {
      const [s, e] = makerjs.point.fromArc(path as makerjs.IPathArc);
      a = [s[0] + offset[0], s[1] + offset[1]];
      b = [e[0] + offset[0], e[1] + offset[1]];
    } else return null;
    const na = nodeOf(a);
    const nb = nodeOf(b);
    if (na === nb) return null; // zero-length or a full-turn arc: leave it to makerjs
    segs.push({ path, offset, a, b, na, nb });
  }
  const at: number[][] = nodePos.map(() => []);
  for (let i = 0; i < segs.length; i++) {
    at[segs[i].na].push(i);
    at[segs[i].nb].push(i);
  }
  if (at.some((list) => list.length > 2)) return null;

  const seen = new Uint8Array(segs.length);
  for (let start = 0; start < segs.length; start++) {
    if (seen[start]) continue;
    // Walk forward from the start's b end; a loop returns to it, an open run meets a dead end.
    let area = 0;
    const order: { seg: number; reversed: boolean }[] = [];
    let cur = start;
    let reversed = false;
    let isLoop = false;
    for (;;) {
      seen[cur] = 1;
      order.push({ seg: cur, reversed });
      const s = segs[cur];
      area += pathAreaTerm(s.path, reversed ? s.b : s.a, reversed ? s.a : s.b, reversed);
      const node: number = reversed ? s.na : s.nb;
      const next: number | undefined = at[node].find((i) => i !== cur);
      if (next === undefined) break;
      if (next === start) {
        isLoop = true;
        break;
      }
      if (seen[next]) break;
      reversed = segs[next].nb === node;
      cur = next;
    }
    if (!isLoop) {
      // Also walk backwards from the start's a end, so the whole run is marked as one contour.
      let node = segs[start].na;
      let prev = start;
      for (;;) {
        const next = at[node].find((i) => i !== prev);
        if (next === undefined || seen[next]) break;
        seen[next] = 1;
        node = segs[next].na === node ? segs[next].nb : segs[next].na;
        prev = next;
      }
      open++;
      continue;
    }
    closed++;
    if (wantLoops) {
      const first = segs[start];
      loops.push({
        area: Math.abs(area),
        sample: first.a,
        points: () => {
          const pts: Pt[] = [];
          for (const { seg, reversed: r } of order) {
            const s = segs[seg];
            const k = makerjs.path.toKeyPoints(s.path, 0.5).map((q) => [q[0] + s.offset[0], q[1] + s.offset[1]] as Pt);
            pts.push(...(r ? k.reverse() : k));
          }
          return pts;
        },
      });
    }
  }
  return { closed, open, loops };
}

/** Contours and part area by makerjs.model.findChains: the general route, and the reference for tests. */
export function contoursByFindChains(model: makerjs.IModel, partLayer: string | null): { closed: number; open: number; area: number } {
  let closed = 0;
  let open = 0;
  let area = 0;
  makerjs.model.findChains(
    model,
    (chains, loose, layer) => {
      for (const c of chains) {
        if (c.endless) closed++;
        else open++;
      }
      open += loose.length;
      if ((layer || '0') === partLayer) area = areaOfChains(chains);
    },
    { byLayers: true },
  );
  return { closed, open, area };
}

/**
 * Visits every path with its absolute offset and layer, inheriting layers the way makerjs does
 * (a path's own layer, else the nearest model's). Lighter than makerjs.model.walk, which builds a
 * route key per path; the summary runs on every generation.
 */
function eachPath(model: makerjs.IModel, offset: makerjs.IPoint, layer: string, cb: (p: makerjs.IPath, offset: makerjs.IPoint, layer: string) => void) {
  const o: makerjs.IPoint = model.origin ? [offset[0] + model.origin[0], offset[1] + model.origin[1]] : offset;
  if (model.paths) {
    for (const id in model.paths) {
      const p = model.paths[id];
      if (p) cb(p, o, p.layer ?? layer);
    }
  }
  if (model.models) {
    for (const id in model.models) {
      const child = model.models[id];
      if (child) eachPath(child, o, child.layer ?? layer, cb);
    }
  }
}

/** Which layer is the part: `outline`, or everything when the drawing has no layers at all. */
export function partLayerOf(layers: Record<string, number>): string | null {
  if (layers.outline) return 'outline';
  return Object.keys(layers).every((l) => l === '0') ? '0' : null;
}

/** The summary every saved revision records (shared/schemas/geometry.ts), in millimetres. */
export function summarizeModel(model: makerjs.IModel, features?: Features): GeometrySummary {
  const layers: Record<string, number> = {};
  const byLayer: Record<string, { path: makerjs.IPath; offset: makerjs.IPoint }[]> = {};
  let perimeter = 0;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  eachPath(model, [0, 0], model.layer ?? '', (path, offset, layer) => {
    const l = layer || '0';
    layers[l] = (layers[l] ?? 0) + 1;
    (byLayer[l] ??= []).push({ path, offset });
    perimeter += makerjs.measure.pathLength(path);
    const e = makerjs.measure.pathExtents(path, offset);
    if (e.low[0] < minX) minX = e.low[0];
    if (e.low[1] < minY) minY = e.low[1];
    if (e.high[0] > maxX) maxX = e.high[0];
    if (e.high[1] > maxY) maxY = e.high[1];
  });

  const partLayer = partLayerOf(layers);
  let closedContours = 0;
  let openContours = 0;
  let area = 0;
  let general = false;
  for (const l in byLayer) {
    const c = contoursOfLayer(byLayer[l], l === partLayer);
    if (!c) {
      general = true;
      break;
    }
    closedContours += c.closed;
    openContours += c.open;
    if (l === partLayer) area = areaOfLoops(c.loops);
  }
  if (general) ({ closed: closedContours, open: openContours, area } = contoursByFindChains(model, partLayer));

  const extents = Number.isFinite(minX)
    ? { minX, minY, maxX, maxY, width: maxX - minX, height: maxY - minY }
    : { minX: 0, minY: 0, maxX: 0, maxY: 0, width: 0, height: 0 };
  const summary: GeometrySummary = { units: 'mm', extents, area, perimeter, closedContours, openContours, layers };
  if (features) summary.features = features;
  return summary;
}

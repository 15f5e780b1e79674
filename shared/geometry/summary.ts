// What a drawing measures: extents, total path length, closed/open contours, the area of the part
// and path counts per layer. makerjs has no area function, so the area is integrated exactly from
// the chains: the shoelace sum over each link's chord plus, for each arc, its circular segment
// r²(θ − sin θ)/2 (added when the arc runs counter-clockwise along the chain, subtracted when
// clockwise); a full circle is πr². Outermost closed chains count positive, holes negative.
import makerjs from 'makerjs';
import type { GeometrySummary } from '../schemas/geometry';

type Features = NonNullable<GeometrySummary['features']>;
type Pt = [number, number];

const pt = (p: makerjs.IPoint): Pt => [p[0], p[1]];

/** Signed area enclosed by a closed chain (counter-clockwise positive), mm². */
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
    const [s, e] = link.reversed ? [pt(b), pt(a)] : [pt(a), pt(b)];
    area += (s[0] * e[1] - e[0] * s[1]) / 2;
    if (path.type === makerjs.pathType.Arc) {
      const arc = path as makerjs.IPathArc;
      const theta = (makerjs.angle.ofArcSpan(arc) * Math.PI) / 180;
      const segment = (arc.radius * arc.radius * (theta - Math.sin(theta))) / 2;
      area += link.reversed ? -segment : segment;
    }
  }
  return area;
}

function insidePolygon(p: Pt, poly: makerjs.IPoint[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = [poly[i][0], poly[i][1]];
    const [xj, yj] = [poly[j][0], poly[j][1]];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

function samplePoint(chain: makerjs.IChain): Pt {
  const link = chain.links[0];
  const path = link.walkedPath.pathContext;
  if (path.type === makerjs.pathType.Circle) {
    const c = makerjs.point.add(path.origin, link.walkedPath.offset);
    return [c[0] + (path as makerjs.IPathCircle).radius, c[1]];
  }
  return pt(link.endPoints[0]);
}

/** Outermost closed chains minus the holes inside them (alternating by nesting depth), mm². */
export function areaOfChains(chains: makerjs.IChain[]): number {
  const closed = chains.filter((c) => c.endless);
  if (closed.length === 0) return 0;
  const areas = closed.map((c) => Math.abs(chainSignedArea(c)));
  if (closed.length === 1) return areas[0];
  const polys = closed.map((c) => makerjs.chain.toKeyPoints(c, 0.5));
  let total = 0;
  for (let i = 0; i < closed.length; i++) {
    const p = samplePoint(closed[i]);
    let depth = 0;
    for (let j = 0; j < closed.length; j++) {
      if (j !== i && areas[j] > areas[i] && insidePolygon(p, polys[j])) depth++;
    }
    total += depth % 2 === 0 ? areas[i] : -areas[i];
  }
  return total;
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

/** The summary every saved revision records (shared/schemas/geometry.ts), in millimetres. */
export function summarizeModel(model: makerjs.IModel, features?: Features): GeometrySummary {
  const layers: Record<string, number> = {};
  let perimeter = 0;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  eachPath(model, [0, 0], model.layer ?? '', (path, offset, layer) => {
    const l = layer || '0';
    layers[l] = (layers[l] ?? 0) + 1;
    perimeter += makerjs.measure.pathLength(path);
    const e = makerjs.measure.pathExtents(path, offset);
    if (e.low[0] < minX) minX = e.low[0];
    if (e.low[1] < minY) minY = e.low[1];
    if (e.high[0] > maxX) maxX = e.high[0];
    if (e.high[1] > maxY) maxY = e.high[1];
  });

  let closedContours = 0;
  let openContours = 0;
  const chainsByLayer: Record<string, makerjs.IChain[]> = {};
  makerjs.model.findChains(
    model,
    (chains, loose, layer) => {
      chainsByLayer[layer || '0'] = chains;
      for (const c of chains) {
        if (c.endless) closedContours++;
        else openContours++;
      }
      openContours += loose.length;
    },
    { byLayers: true },
  );

  // The part is what is on the `outline` layer; a drawing with no layers at all is all outline.
  const partChains = chainsByLayer.outline ?? (Object.keys(layers).every((l) => l === '0') ? chainsByLayer['0'] ?? [] : []);
  const extents = Number.isFinite(minX)
    ? { minX, minY, maxX, maxY, width: maxX - minX, height: maxY - minY }
    : { minX: 0, minY: 0, maxX: 0, maxY: 0, width: 0, height: 0 };

  const summary: GeometrySummary = {
    units: 'mm',
    extents,
    area: areaOfChains(partChains),
    perimeter,
    closedContours,
    openContours,
    layers,
  };
  if (features) summary.features = features;
  return summary;
}

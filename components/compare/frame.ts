// Both revisions drawn in one frame (the union of their extents), so an unchanged segment lands
// on the same screen coordinates in A and in B.
import makerjs from 'makerjs';
import { LAYERS } from '../../shared/schemas/geometry';
import type { LayerPath } from '../../shared/geometry/paths';

export interface Frame {
  low: [number, number];
  high: [number, number];
  width: number;
  height: number;
}

export function unionFrame(models: makerjs.IModel[]): Frame | null {
  let low: [number, number] | null = null;
  let high: [number, number] | null = null;
  for (const m of models) {
    const e = makerjs.measure.modelExtents(m);
    if (!e) continue;
    low = low ? [Math.min(low[0], e.low[0]), Math.min(low[1], e.low[1])] : [e.low[0], e.low[1]];
    high = high ? [Math.max(high[0], e.high[0]), Math.max(high[1], e.high[1])] : [e.high[0], e.high[1]];
  }
  if (!low || !high) return null;
  return { low, high, width: high[0] - low[0], height: high[1] - low[1] };
}

const f = (n: number) => String(Math.round(n * 1e4) / 1e4);

/**
 * Path data per layer, y flipped, with the frame's top-left corner at (0, 0). Each line, arc and
 * circle is written as its own sub-path (no chain finding: the overlay compares segments anyway,
 * and it keeps 5,000-segment drawings fast). Other path kinds fall back to makerjs's writer.
 */
export function pathsInFrame(model: makerjs.IModel, frame: Frame): LayerPath[] {
  const parts = new Map<string, string[]>();
  const X = (x: number) => f(x - frame.low[0]);
  const Y = (y: number) => f(frame.high[1] - y);
  let unknown = false;
  makerjs.model.walk(model, {
    onPath(w) {
      if (unknown) return;
      const p = w.pathContext;
      const o = w.offset;
      const list = parts.get(w.layer || '0') ?? [];
      parts.set(w.layer || '0', list);
      if (p.type === makerjs.pathType.Line) {
        const l = p as makerjs.IPathLine;
        list.push(`M${X(l.origin[0] + o[0])} ${Y(l.origin[1] + o[1])}L${X(l.end[0] + o[0])} ${Y(l.end[1] + o[1])}`);
      } else if (p.type === makerjs.pathType.Circle) {
        const c = p as makerjs.IPathCircle;
        const cx = c.origin[0] + o[0];
        const cy = c.origin[1] + o[1];
        const r = f(c.radius);
        list.push(`M${X(cx + c.radius)} ${Y(cy)}A${r} ${r} 0 0 0 ${X(cx - c.radius)} ${Y(cy)}A${r} ${r} 0 0 0 ${X(cx + c.radius)} ${Y(cy)}`);
      } else if (p.type === makerjs.pathType.Arc) {
        const a = p as makerjs.IPathArc;
        const [s, e] = makerjs.point.fromArc(a);
        let span = a.endAngle - a.startAngle;
        while (span <= 0) span += 360;
        const r = f(a.radius);
        // makerjs arcs run counter-clockwise with y up; after the y flip that is SVG sweep 0.
        list.push(`M${X(s[0] + o[0])} ${Y(s[1] + o[1])}A${r} ${r} 0 ${span > 180 ? 1 : 0} 0 ${X(e[0] + o[0])} ${Y(e[1] + o[1])}`);
      } else unknown = true;
    },
  });
  if (!unknown) {
    const known = LAYERS.filter((l) => parts.get(l)?.length).map((layer) => ({ layer, d: parts.get(layer)!.join('') }));
    const others = [...parts.keys()].filter((l) => !(LAYERS as readonly string[]).includes(l) && parts.get(l)!.length).map((layer) => ({ layer, d: parts.get(layer)!.join('') }));
    return [...known, ...others];
  }
  // makerjs adds origin[0] to x and subtracts y from origin[1] (see components/designs/modelPaths.ts).
  const byLayer = makerjs.exporter.toSVGPathData(model, { byLayers: true, origin: [-frame.low[0], frame.high[1]] }) as makerjs.exporter.IPathDataByLayerMap;
  const known = LAYERS.filter((l) => byLayer[l]).map((layer) => ({ layer, d: byLayer[layer] as string }));
  const others = Object.keys(byLayer)
    .filter((l) => !(LAYERS as readonly string[]).includes(l) && byLayer[l])
    .map((layer) => ({ layer, d: byLayer[layer] as string }));
  return [...known, ...others];
}

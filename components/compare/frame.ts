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

/** Path data per layer, y flipped, with the frame's top-left corner at (0, 0). */
export function pathsInFrame(model: makerjs.IModel, frame: Frame): LayerPath[] {
  // makerjs adds origin[0] to x and subtracts y from origin[1] (see components/designs/modelPaths.ts).
  const byLayer = makerjs.exporter.toSVGPathData(model, { byLayers: true, origin: [-frame.low[0], frame.high[1]] }) as makerjs.exporter.IPathDataByLayerMap;
  const known = LAYERS.filter((l) => byLayer[l]).map((layer) => ({ layer, d: byLayer[layer] as string }));
  const others = Object.keys(byLayer)
    .filter((l) => !(LAYERS as readonly string[]).includes(l) && byLayer[l])
    .map((layer) => ({ layer, d: byLayer[layer] as string }));
  return [...known, ...others];
}

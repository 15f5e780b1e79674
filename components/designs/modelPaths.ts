import makerjs from 'makerjs';
import { LAYERS } from '../../shared/schemas/geometry';
import type { LayerPath } from '../drawing/Drawing';

/**
 * A stored model as the Drawing component wants it: path data per layer, y flipped for the
 * screen, with the drawing's top-left corner at (0, 0). makerjs adds `origin` to x and subtracts y
 * from it, so the origin is (−minX, maxY). Layers come in LAYERS order, then any others.
 */
export function modelLayerPaths(model: makerjs.IModel): LayerPath[] {
  const ext = makerjs.measure.modelExtents(model);
  if (!ext) return [];
  const byLayer = makerjs.exporter.toSVGPathData(model, { byLayers: true, origin: [-ext.low[0], ext.high[1]] }) as makerjs.exporter.IPathDataByLayerMap;
  const known = LAYERS.filter((l) => byLayer[l]).map((layer) => ({ layer, d: byLayer[layer] as string }));
  const others = Object.keys(byLayer)
    .filter((l) => !(LAYERS as readonly string[]).includes(l) && byLayer[l])
    .map((layer) => ({ layer, d: byLayer[layer] as string }));
  return [...known, ...others];
}

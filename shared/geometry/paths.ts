// SVG path data per layer for the client preview (react-native-svg draws each layer in its own
// style from shared/geometry/layers.ts), and the mirror used for underside operations.
import makerjs from 'makerjs';
import { LAYERS } from '../schemas/geometry';

export interface LayerPath {
  layer: string;
  d: string;
}

export interface PreviewFrame {
  /** Drawing extents in mm; path data from modelToLayerPaths starts at the top-left (0, 0). */
  width: number;
  height: number;
  viewBox: string;
}

export function previewFrame(model: makerjs.IModel): PreviewFrame {
  const ext = makerjs.measure.modelExtents(model);
  const width = ext ? ext.high[0] - ext.low[0] : 0;
  const height = ext ? ext.high[1] - ext.low[1] : 0;
  return { width, height, viewBox: `0 0 ${width} ${height}` };
}

/**
 * SVG path data for each layer, y flipped for the screen: the drawing's top-left corner maps to
 * (0, 0), so the paths fit `previewFrame(model).viewBox`. Layers come in LAYERS order (the order
 * they are drawn, outline first), then any others.
 */
export function modelToLayerPaths(model: makerjs.IModel): LayerPath[] {
  const ext = makerjs.measure.modelExtents(model);
  if (!ext) return [];
  // makerjs adds origin[0] to x and maps y to origin[1] − y: (−minX, maxY) puts the top-left at (0, 0).
  const byLayer = makerjs.exporter.toSVGPathData(model, { byLayers: true, fillRule: 'nonzero', origin: [-ext.low[0], ext.high[1]] }) as makerjs.exporter.IPathDataByLayerMap;
  const known = LAYERS.filter((l) => byLayer[l]).map((layer) => ({ layer, d: byLayer[layer] as string }));
  const others = Object.keys(byLayer)
    .filter((l) => !(LAYERS as readonly string[]).includes(l) && byLayer[l])
    .map((layer) => ({ layer, d: byLayer[layer] }));
  return [...known, ...others];
}

/**
 * The model as it must be cut from the other face, after the part is turned over about its long
 * axis. `part` is the part's own rectangle (origin bottom-left, width along x, length along y):
 * when it is longer in y the flip maps x → width − x, otherwise y → length − y. Points on the long
 * centre line do not move, which is why the alignment marks sit on it.
 */
export function mirrorForUnderside(model: makerjs.IModel, part: { width: number; length: number }): makerjs.IModel {
  const flipX = part.length >= part.width;
  const mirrored = makerjs.model.mirror(model, flipX, !flipX);
  mirrored.origin = flipX ? [part.width, 0] : [0, part.length];
  return { models: { underside: mirrored }, units: makerjs.unitType.Millimeter };
}

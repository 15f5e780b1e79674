import { LAYERS, type LayerName } from '../shared/schemas/geometry';

const BY_LOWER = new Map<string, LayerName>(LAYERS.map((l) => [l, l]));

/** The Jigwright layer a layer name in an uploaded file stands for (case and spaces ignored), if any. */
export function matchLayer(name: string | undefined | null): LayerName | undefined {
  if (!name) return undefined;
  return BY_LOWER.get(name.trim().toLowerCase());
}

/** Where paths on a layer Jigwright does not know are put. */
export const FALLBACK_LAYER: LayerName = 'outline';

// The underside view: the operations cut from the other face (recess, cord channel, reliefs,
// alignment marks) mirrored about the part's long axis, as they are cut after the plate is turned
// over, with the through-cut outline for reference. Top-face pockets are left out.
import makerjs from 'makerjs';
import { mirrorForUnderside } from '../../shared/geometry/paths';

export const UNDERSIDE_LAYERS = ['recess', 'channel', 'relief', 'marks'] as const;

/** Only the paths whose layer (their own, else inherited from the models above) is in `keep`. */
export function layerSubset(model: makerjs.IModel, keep: readonly string[], inherited?: string): makerjs.IModel | null {
  const layer = model.layer ?? inherited;
  const out: makerjs.IModel = { origin: model.origin, layer: model.layer, units: model.units };
  let any = false;
  for (const [id, p] of Object.entries(model.paths ?? {})) {
    if (keep.includes(p.layer ?? layer ?? '')) {
      (out.paths ??= {})[id] = p;
      any = true;
    }
  }
  for (const [id, m] of Object.entries(model.models ?? {})) {
    const sub = layerSubset(m, keep, layer);
    if (sub) {
      (out.models ??= {})[id] = sub;
      any = true;
    }
  }
  return any ? out : null;
}

/**
 * The model as seen from the underside. `part` is the part's own rectangle (from the summary's
 * extents); the outline is mirrored too, so everything keeps its place relative to the outline.
 */
export function undersideModel(model: makerjs.IModel, part: { width: number; length: number }): makerjs.IModel | null {
  const subset = layerSubset(model, ['outline', ...UNDERSIDE_LAYERS]);
  if (!subset) return null;
  // Move the part's lower-left corner to (0, 0) first: mirrorForUnderside flips about that rectangle.
  const ext = makerjs.measure.modelExtents(model);
  const placed: makerjs.IModel = { models: { part: subset }, origin: ext ? [-ext.low[0], -ext.low[1]] : [0, 0] };
  return mirrorForUnderside(placed, part);
}

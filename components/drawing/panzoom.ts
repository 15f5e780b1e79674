// Pure pan/zoom arithmetic on a viewBox (screen mm, y down). The viewBox keeps its aspect, so a
// point on the canvas maps linearly to the drawing.
import type { ViewBox } from './fit';

export const MIN_ZOOM = 0.5;
export const MAX_ZOOM = 40;

/** The zoom factor of `vb` against the fitted `home` view (1 = fitted, 2 = twice as big). */
export const zoomOf = (vb: ViewBox, home: ViewBox) => home.width / vb.width;

/**
 * Zooms by `factor` (>1 closer) keeping the drawing point under (fx, fy) still; fx, fy are
 * fractions 0–1 of the canvas from its top-left. The result stays within MIN_ZOOM–MAX_ZOOM of home.
 */
export function zoomAbout(vb: ViewBox, home: ViewBox, factor: number, fx = 0.5, fy = 0.5): ViewBox {
  if (!(factor > 0) || !Number.isFinite(factor)) return vb;
  const target = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, zoomOf(vb, home) * factor));
  const w = home.width / target;
  const h = home.height / target;
  const mx = vb.x + fx * vb.width;
  const my = vb.y + fy * vb.height;
  return { x: mx - fx * w, y: my - fy * h, width: w, height: h };
}

/** Moves the view by (dxPx, dyPx) screen pixels of a canvas `widthPx` wide: drag right shows what lies left. */
export function panBy(vb: ViewBox, dxPx: number, dyPx: number, widthPx: number): ViewBox {
  if (!(widthPx > 0)) return vb;
  const mmPerPx = vb.width / widthPx;
  return { ...vb, x: vb.x - dxPx * mmPerPx, y: vb.y - dyPx * mmPerPx };
}

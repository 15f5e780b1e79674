// Pure fitting arithmetic for the drawing, kept apart from the component so pan/zoom can reuse it.

/**
 * The drawing's overall size in millimetres. The geometry summary's `extents` and
 * `previewFrame(model)` both fit.
 */
export interface DrawingExtents {
  width: number;
  height: number;
}

/** A rectangle in screen coordinates (millimetres, y down), as an SVG viewBox. */
export interface ViewBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Pad {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

/**
 * Where the model lands in screen coordinates: modelToLayerPaths flips y and moves the drawing's
 * top-left corner to (0, 0), so the part spans (0, 0) – (width, height).
 */
export function screenBoxOf(e: DrawingExtents): ViewBox {
  return { x: 0, y: 0, width: e.width, height: e.height };
}

/**
 * The viewBox and pixel height that fit `box` into `widthPx`, leaving `pad` pixels around it,
 * no taller than `maxHeight`. With an explicit `viewBox` (pan/zoom) that box is shown instead.
 * One viewBox unit is always one millimetre; `pxPerMm` converts.
 */
export function fitViewBox(
  box: ViewBox,
  widthPx: number,
  { pad, maxHeight = Infinity, viewBox }: { pad: Pad; maxHeight?: number; viewBox?: ViewBox },
): { viewBox: ViewBox; heightPx: number; pxPerMm: number } {
  if (viewBox) {
    const heightPx = Math.min(maxHeight, (viewBox.height * widthPx) / viewBox.width);
    const pxPerMm = Math.min(widthPx / viewBox.width, heightPx / viewBox.height);
    // Grow the box to the canvas's aspect so `meet` leaves no unexplained bands.
    const w = widthPx / pxPerMm;
    const h = heightPx / pxPerMm;
    return { viewBox: { x: viewBox.x - (w - viewBox.width) / 2, y: viewBox.y - (h - viewBox.height) / 2, width: w, height: h }, heightPx, pxPerMm };
  }
  const byWidth = (widthPx - pad.left - pad.right) / box.width;
  const byHeight = (maxHeight - pad.top - pad.bottom) / box.height;
  const pxPerMm = Math.max(1e-6, Math.min(byWidth, byHeight));
  const heightPx = Math.ceil(box.height * pxPerMm + pad.top + pad.bottom);
  const w = widthPx / pxPerMm;
  const used = box.width + (pad.left + pad.right) / pxPerMm;
  return {
    viewBox: { x: box.x - pad.left / pxPerMm - (w - used) / 2, y: box.y - pad.top / pxPerMm, width: w, height: heightPx / pxPerMm },
    heightPx,
    pxPerMm,
  };
}

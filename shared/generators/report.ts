// Small helpers to build reports and models without repeating makerjs boilerplate.
import makerjs from 'makerjs';
import type { ParamUnit } from '../params';
import type { LayerName } from '../schemas/geometry';
import type { LengthText } from '../units';
import type { ReportValue, Warning } from './types';

/** Values in reports are rounded for people: 3 decimals for lengths, 2 for angles. */
export function round(value: number, digits = 3): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

export function rv(key: string, label: string, value: number | string, unit?: ParamUnit | 'mm2', digits?: number): ReportValue {
  const v = typeof value === 'number' ? round(value, digits ?? (unit === 'deg' ? 2 : unit === 'mm2' ? 1 : 3)) : value;
  return unit ? { key, label, value: v, unit } : { key, label, value: v };
}

/** `message` is plain text, or a `lengthText` sentence whose lengths follow the reader's units. */
export function warn(code: string, severity: Warning['severity'], message: string | LengthText, fields: string[]): Warning {
  return typeof message === 'string' ? { code, severity, message, fields } : { code, severity, ...message, fields };
}

/** A model on one layer, optionally moved to `origin`. */
export function onLayer(layer: LayerName, model: makerjs.IModel, origin?: [number, number]): makerjs.IModel {
  model.layer = layer;
  if (origin) model.origin = origin;
  return model;
}

/** A rectangle from (x, y) with width w and height h, square corners, as a model of 4 lines. */
export function rect(x: number, y: number, w: number, h: number): makerjs.IModel {
  return {
    paths: {
      bottom: new makerjs.paths.Line([x, y], [x + w, y]),
      right: new makerjs.paths.Line([x + w, y], [x + w, y + h]),
      top: new makerjs.paths.Line([x + w, y + h], [x, y + h]),
      left: new makerjs.paths.Line([x, y + h], [x, y]),
    },
  };
}

/** A rectangle with corner radius r (square when r ≤ 0), bottom-left at (x, y). */
export function roundRect(x: number, y: number, w: number, h: number, r: number): makerjs.IModel {
  if (r <= 1e-9) return rect(x, y, w, h);
  const m = new makerjs.models.RoundRectangle(w, h, Math.min(r, w / 2, h / 2));
  m.origin = [x, y];
  return m;
}

/** A closed polygon through the points, in order. */
export function polygon(points: [number, number][]): makerjs.IModel {
  const paths: makerjs.IPathMap = {};
  for (let i = 0; i < points.length; i++) paths[`e${i}`] = new makerjs.paths.Line(points[i], points[(i + 1) % points.length]);
  return { paths };
}

export const deg = (rad: number) => (rad * 180) / Math.PI;
export const rad = (deg: number) => (deg * Math.PI) / 180;

// The SVG `transform` attribute (SVG 1.1 §7.6, W3C): a list of matrix, translate, scale, rotate,
// skewX and skewY, applied right to left to the element's coordinates.
import { type Affine, compose, IDENTITY, rotationDeg, scaling, translation } from '../model/affine';

export class TransformError extends Error {}

const ITEM = /\s*(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)\s*,?/y;
const ARGS: Record<string, number[]> = { matrix: [6], translate: [1, 2], scale: [1, 2], rotate: [1, 3], skewX: [1], skewY: [1] };

export function parseTransform(text: string): Affine {
  let m: Affine = IDENTITY;
  let i = 0;
  while (i < text.length) {
    if (/^[\s,]*$/.test(text.slice(i))) break;
    ITEM.lastIndex = i;
    const found = ITEM.exec(text);
    if (!found) throw new TransformError(`cannot read "${text.slice(i, i + 30).trim()}"`);
    i = ITEM.lastIndex;
    const name = found[1];
    const args = found[2].trim() === '' ? [] : found[2].trim().split(/[\s,]+/).map(Number);
    if (!ARGS[name].includes(args.length) || !args.every(Number.isFinite)) {
      throw new TransformError(`${name}() takes ${ARGS[name].join(' or ')} numbers, not "${found[2].trim()}"`);
    }
    m = compose(m, item(name, args));
  }
  return m;
}

function item(name: string, a: number[]): Affine {
  switch (name) {
    case 'matrix':
      return [a[0], a[1], a[2], a[3], a[4], a[5]];
    case 'translate':
      return translation(a[0], a[1] ?? 0);
    case 'scale':
      return scaling(a[0], a[1] ?? a[0]);
    case 'rotate':
      if (a.length === 3) return compose(translation(a[1], a[2]), compose(rotationDeg(a[0]), translation(-a[1], -a[2])));
      return rotationDeg(a[0]);
    case 'skewX':
      return [1, 0, Math.tan((a[0] * Math.PI) / 180), 1, 0, 0];
    default:
      return [1, Math.tan((a[0] * Math.PI) / 180), 0, 1, 0, 0];
  }
}

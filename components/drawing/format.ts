import { formatLength, type LengthUnit } from '../../shared/units';

export type DimensionUnits = LengthUnit;

/** An overall dimension as figured on the drawing: "182 mm" or `7.165"`. */
export function formatDimension(mm: number, units: DimensionUnits): string {
  return formatLength(mm, units, { digits: units === 'in' ? 3 : 1 });
}

/** "82 × 160 mm, 12 deep" or `3.228 × 6.299", 0.472" deep`. */
export function formatFeatureSize(f: { width: number; height: number; depth?: number }, units: DimensionUnits): string {
  const digits = units === 'in' ? 3 : 2;
  const bare = (mm: number) => formatLength(mm, units, { digits }).replace(/ mm$|"$/, '');
  const unitText = units === 'in' ? '"' : ' mm';
  const size = `${bare(f.width)} × ${bare(f.height)}${unitText}`;
  return f.depth !== undefined ? `${size}, ${formatLength(f.depth, units, { digits })} deep` : size;
}

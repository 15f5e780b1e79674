import { MM_PER_INCH, formatLength } from '../../shared/units';
import type { DisplayUnits } from '../forms/useDisplayUnits';

/**
 * A report or calculator value with its unit, lengths and areas in the display unit. The shared
 * code has already rounded each value for people; only converted lengths are rounded again here.
 */
export function formatReportValue(value: number | string, unit: string | undefined, units: DisplayUnits): string {
  if (typeof value !== 'number') return value;
  switch (unit) {
    case 'mm':
      return formatLength(value, units, { digits: 4 });
    case 'mm2':
      return units === 'in' ? `${+(value / (MM_PER_INCH * MM_PER_INCH)).toFixed(3)} in²` : `${value} mm²`;
    case 'deg':
      return `${value}°`;
    case 'percent':
      return `${value} %`;
    default:
      return String(value);
  }
}

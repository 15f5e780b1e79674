import { z } from 'zod';

const mm = (label: string, max: number) =>
  z.number({ error: `${label} must be a number (mm)` }).positive(`${label} must be more than 0 mm`).max(max, `${label} must be at most ${max} mm`);

/** A device a shop builds for: its bare size and the extra a case adds per side. */
export const DeviceInput = z.strictObject({
  name: z.string().trim().min(1, 'Name the device').max(120),
  widthMm: mm('Width', 600),
  lengthMm: mm('Length', 600),
  thicknessMm: mm('Thickness', 100),
  caseAllowanceMm: z.number().min(0, 'Case allowance cannot be negative').max(20, 'Case allowance must be at most 20 mm').default(0),
});
export type DeviceInput = z.infer<typeof DeviceInput>;

/** A charger pad: round (width = diameter) or rectangular, and the charging distance its maker rates. */
export const ChargerInput = z
  .strictObject({
    name: z.string().trim().min(1, 'Name the charger pad').max(120),
    shape: z.enum(['round', 'rect']),
    widthMm: mm('Width or diameter', 400),
    lengthMm: mm('Length', 400).optional(),
    thicknessMm: mm('Thickness', 60),
    rangeMinMm: z.number().min(0).max(30).optional(),
    rangeMaxMm: z.number().min(0).max(30).optional(),
  })
  .refine((c) => c.rangeMinMm === undefined || c.rangeMaxMm === undefined || c.rangeMinMm <= c.rangeMaxMm, {
    message: 'The rated range must run from low to high',
    path: ['rangeMaxMm'],
  });
export type ChargerInput = z.infer<typeof ChargerInput>;

export interface Device extends Required<DeviceInput> {
  id: string;
}
export interface Charger {
  id: string;
  name: string;
  shape: 'round' | 'rect';
  widthMm: number;
  lengthMm: number;
  thicknessMm: number;
  rangeMinMm: number | null;
  rangeMaxMm: number | null;
}

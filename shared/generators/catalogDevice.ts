// A device from a shop's catalog onto a generator's device parameters, matched by the parameters'
// names: case allowance first, then width, length and thickness. The regenerate route and the
// workbench's "fill from a saved device" use this one mapping, so both fill the same fields.
import type { Device } from '../schemas/catalog';

export type CatalogDeviceSize = Pick<Device, 'widthMm' | 'lengthMm' | 'thicknessMm' | 'caseAllowanceMm'>;

/** The values (mm) a catalog device gives the named device parameters; names that match nothing are left out. */
export function deviceParamValues(keys: readonly string[], d: CatalogDeviceSize): Record<string, number> {
  const out: Record<string, number> = {};
  for (const k of keys) {
    if (/case/i.test(k)) out[k] = d.caseAllowanceMm;
    else if (/width/i.test(k)) out[k] = d.widthMm;
    else if (/length/i.test(k)) out[k] = d.lengthMm;
    else if (/thick/i.test(k)) out[k] = d.thicknessMm;
  }
  return out;
}

/** What fit notes call a catalog device whose filled sizes were then typed over. */
export const EDITED_SUFFIX = ' (edited)';
/** FitNotes.device.name holds at most this many characters (shared/schemas/library.ts). */
export const DEVICE_NAME_MAX = 120;

/** The name a saved revision's fit notes give a chosen device: as in the catalog, or marked edited. */
export function fitNotesDeviceName(d: { name: string; edited: boolean }): string {
  if (!d.edited) return d.name;
  return d.name.slice(0, DEVICE_NAME_MAX - EDITED_SUFFIX.length) + EDITED_SUFFIX;
}

import type makerjs from 'makerjs';

/** The units the uploaded file's coordinates were in, before conversion to millimetres. */
export type SourceUnits = 'mm' | 'cm' | 'm' | 'in' | 'ft' | 'px' | 'pt' | 'pc';

/**
 * Where the units came from: the DXF header ($INSUNITS), the user's choice, the SVG root's
 * width/height in absolute units, or CSS reference pixels (96 px per inch) when the SVG gives none.
 */
export type UnitsFrom = 'header' | 'user' | 'svg-size' | 'svg-px';

/** What an importer hands back: the drawing as a makerjs model in millimetres, and what it read. */
export interface ImportResult {
  /** Flat map of paths in mm, y up; every path has a `layer` from shared/schemas/geometry LAYERS. */
  model: makerjs.IModel;
  sourceUnits: SourceUnits;
  unitsFrom: UnitsFrom;
  /** Elements or entities read from the file by type (top level of a DXF's ENTITIES section). */
  entityCounts: Record<string, number>;
  warnings: string[];
}

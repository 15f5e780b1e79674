import type makerjs from 'makerjs';
import type { ParamDecl, ParamUnit, ParamValues } from '../params';
import type { GeometrySummary } from '../schemas/geometry';

export interface ReportValue {
  key: string;
  label: string;
  value: number | string;
  unit?: ParamUnit | 'mm2';
}

export interface Warning {
  /** Stable code, e.g. "skin_too_thick": tests and the client key on it. */
  code: string;
  severity: 'info' | 'caution' | 'danger';
  /** In millimetres. */
  message: string;
  /** When the message holds lengths: the same sentence to show in inches (`textInUnits`). */
  template?: string;
  lengthsMm?: number[];
  /** The parameters to change to clear it. */
  fields: string[];
}

export interface FitReport {
  values: ReportValue[];
  warnings: Warning[];
}

export interface GeneratorResult {
  /** Everything as seen from the top, in mm, origin at the part's bottom-left corner. */
  model: makerjs.IModel;
  report: FitReport;
  summary: GeometrySummary;
  /**
   * Underside operations mirrored for cutting after the part is turned over about its long axis
   * (with the alignment marks, which sit on that axis). Only generators with underside work set it.
   */
  underside?: makerjs.IModel;
}

export interface FieldMessage {
  field: string;
  /** In millimetres. */
  message: string;
  /** When the message holds lengths: the same sentence to show in inches (`textInUnits`). */
  template?: string;
  lengthsMm?: number[];
}

export interface GeneratorDef {
  id: string;
  title: string;
  kind: 'insert' | 'jig' | 'template';
  description: string;
  params: ParamDecl[];
  /** The params a "regenerate for another device" may change. */
  deviceParams?: string[];
  /**
   * The clearance param the shop's fit history (test cuts per device and material) suggests a
   * value for: the one fit notes record as `clearancePerSide` (shared/generators/fitNotes.ts).
   */
  suggestedClearanceParam?: string;
  /** Inconsistent combinations → field-level messages (runGenerator refuses them). */
  check?(p: ParamValues): FieldMessage[];
  generate(p: ParamValues): GeneratorResult;
}


// Errors the file importers throw. Each carries a stable `code` and a message written for the person
// who uploaded the file; server/revisions/routes.ts turns them into 4xx answers by `name` and `code`,
// so both names stay exactly 'FileRejected' and 'UnitsNeeded'.
import type { LengthUnit } from '../shared/units';

export type RejectionCode =
  | 'empty'
  | 'binary'
  | 'binary_dxf'
  | 'not_text'
  | 'unknown_format'
  | 'damaged_dxf'
  | 'truncated'
  | 'unsupported_units'
  | 'no_geometry'
  | 'zero_length'
  | 'bad_coordinate'
  | 'too_many_entities'
  | 'too_complex'
  | 'degenerate_entity'
  | 'unsupported_entity'
  | 'not_flat'
  | 'missing_block'
  | 'nesting_too_deep'
  | 'invalid_svg'
  | 'unsafe_svg'
  | 'unsupported_svg';

/** The file cannot be used as sent; the message says why and, where it can, what to do. */
export class FileRejected extends Error {
  override readonly name = 'FileRejected';
  constructor(
    readonly code: RejectionCode,
    message: string,
  ) {
    super(message);
  }
}

/** Size of the drawing in the file's own (unknown) units, to help the user choose. */
export interface RawExtents {
  width: number;
  height: number;
}

/**
 * The file does not say which units its coordinates are in: the UI asks the user and sends the
 * file again with `units`. `suggested` is only a hint (e.g. the DXF $MEASUREMENT setting).
 */
export class UnitsNeeded extends Error {
  override readonly name = 'UnitsNeeded';
  readonly code = 'units_needed';
  readonly options: readonly LengthUnit[] = ['mm', 'in'];
  constructor(
    message: string,
    readonly extents?: RawExtents,
    readonly suggested?: LengthUnit,
  ) {
    super(message);
  }
}

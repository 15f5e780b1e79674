// Dimensional change coefficients per 1 % change in moisture content, from the USDA Forest
// Products Laboratory *Wood Handbook*, FPL-GTR-190 (2010), Table 13-5. C_R is radial (use it for
// the width of quartersawn stock), C_T tangential (the width of flatsawn stock).
// Rows whose source says "from memory" were not checked against the published table: treat them
// as approximate.

export interface Species {
  id: string;
  name: string;
  /** Radial coefficient per 1 % MC. */
  cR: number;
  /** Tangential coefficient per 1 % MC. */
  cT: number;
  source: 'FPL-GTR-190 Table 13-5' | 'from memory (FPL-GTR-190 Table 13-5, unconfirmed)';
}

export const SPECIES: Species[] = [
  { id: 'white-oak', name: 'White oak', cR: 0.0018, cT: 0.00365, source: 'FPL-GTR-190 Table 13-5' },
  { id: 'red-oak', name: 'Red oak', cR: 0.00158, cT: 0.00369, source: 'FPL-GTR-190 Table 13-5' },
  { id: 'hard-maple', name: 'Hard (sugar) maple', cR: 0.00165, cT: 0.00353, source: 'FPL-GTR-190 Table 13-5' },
  { id: 'black-cherry', name: 'Black cherry', cR: 0.00126, cT: 0.00248, source: 'FPL-GTR-190 Table 13-5' },
  { id: 'black-walnut', name: 'Black walnut', cR: 0.0019, cT: 0.00274, source: 'FPL-GTR-190 Table 13-5' },
  // From memory, not confirmed against the table:
  { id: 'white-ash', name: 'White ash (approx.)', cR: 0.00169, cT: 0.00274, source: 'from memory (FPL-GTR-190 Table 13-5, unconfirmed)' },
  { id: 'yellow-poplar', name: 'Yellow-poplar (approx.)', cR: 0.00158, cT: 0.00289, source: 'from memory (FPL-GTR-190 Table 13-5, unconfirmed)' },
  { id: 'eastern-white-pine', name: 'Eastern white pine (approx.)', cR: 0.00071, cT: 0.00212, source: 'from memory (FPL-GTR-190 Table 13-5, unconfirmed)' },
];

/**
 * Plywood, in the plane of the panel: about 1–2 × 10⁻⁴ per 1 % MC (panel-industry technical data;
 * a published lab test gave 0.18 % along / 0.27 % across the face grain for 7 → 20 % MC). We use
 * the middle of that range.
 */
export const PLYWOOD_COEFFICIENT = 1.5e-4;

export function getSpecies(id: string): Species | undefined {
  return SPECIES.find((s) => s.id === id);
}

export const SPECIES_CHOICES = SPECIES.map((s) => ({ value: s.id, label: s.name }));

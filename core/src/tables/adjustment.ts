/**
 * Adjustment factors for more than three current-carrying conductors in one
 * raceway or cable: NFPA 70-2023 and NFPA 70-2020 Table 310.15(C)(1) (the
 * percentages of the Table 310.16 values, ambient correction applied first).
 *
 * Source: from memory, checked against public reproductions.
 * Independent check: test/core/tables/adjustment.test.ts checks every band
 * edge and that the factor never rises with the count; the values also appear
 * in published worked examples (six conductors → 80 %).
 */
export interface AdjustmentBand {
  /** Fewest current-carrying conductors in the band. */
  minCount: number;
  /** Most current-carrying conductors in the band; Infinity for the last band. */
  maxCount: number;
  factor: number;
}

export const ADJUSTMENT_SOURCE =
  'NFPA 70-2023 / 2020 Table 310.15(C)(1), from memory, checked against public reproductions';

export const ADJUSTMENT_BANDS: readonly AdjustmentBand[] = [
  { minCount: 1, maxCount: 3, factor: 1.0 },
  { minCount: 4, maxCount: 6, factor: 0.8 },
  { minCount: 7, maxCount: 9, factor: 0.7 },
  { minCount: 10, maxCount: 20, factor: 0.5 },
  { minCount: 21, maxCount: 30, factor: 0.45 },
  { minCount: 31, maxCount: 40, factor: 0.4 },
  { minCount: 41, maxCount: Number.POSITIVE_INFINITY, factor: 0.35 },
];

/** Factor for a count of current-carrying conductors (1.0 for three or fewer). */
export function adjustmentFactor(currentCarryingCount: number): number {
  for (const band of ADJUSTMENT_BANDS) if (currentCarryingCount <= band.maxCount) return band.factor;
  return ADJUSTMENT_BANDS[ADJUSTMENT_BANDS.length - 1]!.factor;
}

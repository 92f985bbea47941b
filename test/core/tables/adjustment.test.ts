import { describe, expect, it } from 'vitest';
import { ADJUSTMENT_BANDS, adjustmentFactor } from '../../../core/src/tables/adjustment';

describe('Table 310.15(C)(1) (NFPA 70-2023 / 2020, from memory), more than three current-carrying conductors', () => {
  it('band edges: 3 → 1.00, 4–6 → 0.80, 7–9 → 0.70, 10–20 → 0.50, 21–30 → 0.45, 31–40 → 0.40, 41+ → 0.35', () => {
    const cases: Array<[number, number]> = [
      [1, 1], [3, 1], [4, 0.8], [6, 0.8], [7, 0.7], [9, 0.7], [10, 0.5], [20, 0.5],
      [21, 0.45], [30, 0.45], [31, 0.4], [40, 0.4], [41, 0.35], [200, 0.35],
    ];
    for (const [n, f] of cases) expect(adjustmentFactor(n), `${n} conductors`).toBe(f);
  });

  it('never rises as conductors are added (more heat in the same raceway)', () => {
    for (let n = 2; n <= 100; n++) expect(adjustmentFactor(n)).toBeLessThanOrEqual(adjustmentFactor(n - 1));
  });

  it('bands are contiguous from 1 upward', () => {
    expect(ADJUSTMENT_BANDS[0]!.minCount).toBe(1);
    for (let i = 1; i < ADJUSTMENT_BANDS.length; i++)
      expect(ADJUSTMENT_BANDS[i]!.minCount).toBe(ADJUSTMENT_BANDS[i - 1]!.maxCount + 1);
  });
});

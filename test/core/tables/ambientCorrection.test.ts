import { describe, expect, it } from 'vitest';
import {
  AMBIENT_CORRECTION_BANDS,
  ambientCorrectionByFormula,
  ambientCorrectionFactor,
} from '../../../core/src/tables/ambientCorrection';
import type { TempColumnC } from '../../../core/src/tables/ampacity310_16';

const COLUMNS: readonly TempColumnC[] = [60, 75, 90];

describe('Table 310.15(B)(1)(1) (NFPA 70-2023; 310.15(B)(1) in 2020), ambient correction', () => {
  it('every entry equals Equation 310.15(B)(1) at the band upper temperature, rounded to 2 places', () => {
    let checked = 0;
    for (const band of AMBIENT_CORRECTION_BANDS)
      COLUMNS.forEach((tc, c) => {
        const byFormula = ambientCorrectionByFormula(tc, band.upperC);
        const tabulated = band.factors[c];
        if (tabulated === null || tabulated === undefined) {
          // A dash: the band reaches the insulation rating, where the formula gives nothing either.
          expect(byFormula, `${tc} °C at ${band.upperC} °C`).toBeNull();
        } else {
          expect(Math.round(byFormula! * 100) / 100, `${tc} °C at ${band.upperC} °C`).toBe(tabulated);
          checked++;
        }
      });
    // 60 °C: 10 rows with a value, 75 °C: 13, 90 °C: 16.
    expect(checked).toBe(10 + 13 + 16);
  });

  it('worked values: 90 °C at 40 °C → 0.91; 75 °C at 35 °C → 0.94; 60 °C at 50 °C → 0.58', () => {
    expect(ambientCorrectionFactor(90, 40)).toBe(0.91);
    expect(ambientCorrectionFactor(75, 35)).toBe(0.94);
    expect(ambientCorrectionFactor(60, 50)).toBe(0.58);
  });

  it('bands are inclusive at both ends: 31 °C and 35 °C read the 31–35 °C row; 36 °C the next', () => {
    expect(ambientCorrectionFactor(90, 31)).toBe(0.96);
    expect(ambientCorrectionFactor(90, 35)).toBe(0.96);
    expect(ambientCorrectionFactor(90, 36)).toBe(0.91);
    expect(ambientCorrectionFactor(75, 30)).toBe(1.0);
    expect(ambientCorrectionFactor(75, 26)).toBe(1.0);
    expect(ambientCorrectionFactor(75, 25)).toBe(1.05);
  });

  it('a fractional ambient takes the warmer band (conservative): 30.5 °C reads 31–35 °C', () => {
    expect(ambientCorrectionFactor(90, 30.5)).toBe(0.96);
    expect(ambientCorrectionFactor(60, 55.5)).toBeNull();
  });

  it('below 10 °C the ≤10 °C row applies', () => {
    expect(ambientCorrectionFactor(90, -20)).toBe(1.15);
    expect(ambientCorrectionFactor(60, 0)).toBe(1.29);
  });

  it('dashes: 60 °C insulation above 55 °C, 75 °C above 70 °C, everything above 85 °C', () => {
    expect(ambientCorrectionFactor(60, 56)).toBeNull();
    expect(ambientCorrectionFactor(60, 55)).toBe(0.41);
    expect(ambientCorrectionFactor(75, 71)).toBeNull();
    expect(ambientCorrectionFactor(75, 70)).toBe(0.33);
    expect(ambientCorrectionFactor(90, 85)).toBe(0.29);
    expect(ambientCorrectionFactor(90, 86)).toBeNull();
    expect(ambientCorrectionFactor(90, Number.NaN)).toBeNull();
  });

  it('Equation 310.15(B)(1): 1.00 at the 30 °C basis, null at or above the insulation rating', () => {
    expect(ambientCorrectionByFormula(90, 30)).toBe(1);
    expect(ambientCorrectionByFormula(75, 75)).toBeNull();
    expect(ambientCorrectionByFormula(60, 70)).toBeNull();
    expect(ambientCorrectionByFormula(90, 45)).toBeCloseTo(Math.sqrt(45 / 60), 12);
  });

  it('bands are contiguous integer ranges (table layout)', () => {
    for (let i = 1; i < AMBIENT_CORRECTION_BANDS.length; i++)
      expect(AMBIENT_CORRECTION_BANDS[i]!.lowC).toBe(AMBIENT_CORRECTION_BANDS[i - 1]!.upperC + 1);
  });
});

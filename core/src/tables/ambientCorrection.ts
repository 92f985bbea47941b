import type { TempColumnC } from './ampacity310_16';

/**
 * Ambient temperature correction factors for Table 310.16 (30 °C basis):
 * NFPA 70-2023 Table 310.15(B)(1)(1); the same table is Table 310.15(B)(1)
 * in NFPA 70-2020.
 *
 * Source: from memory, checked against public reproductions.
 * Independent check: Equation 310.15(B)(1), I' = I·sqrt((Tc − Ta')/(Tc − Ta)),
 * reproduces every entry at the upper temperature of its band, rounded to two
 * places (test/core/tables/ambientCorrection.test.ts).
 *
 * A band covers the integer temperatures lowC..upperC. A fractional ambient is
 * put in the band whose upper temperature is at or above it (30.5 °C reads the
 * 31–35 °C row): the conservative side. Below 10 °C the ≤10 °C row applies.
 * A null entry is a dash in the table: the insulation may not be used there.
 */
export interface AmbientBand {
  /** Lowest integer temperature of the band, °C; -Infinity for the first band. */
  lowC: number;
  /** Highest temperature of the band, °C. */
  upperC: number;
  /** Factors for the 60, 75 and 90 °C columns; null is a dash. */
  factors: readonly [number | null, number | null, number | null];
}

export const AMBIENT_CORRECTION_SOURCE =
  'NFPA 70-2023 Table 310.15(B)(1)(1) (NFPA 70-2020 Table 310.15(B)(1)), from memory, checked against public reproductions';

export const AMBIENT_CORRECTION_BANDS: readonly AmbientBand[] = [
  { lowC: Number.NEGATIVE_INFINITY, upperC: 10, factors: [1.29, 1.2, 1.15] },
  { lowC: 11, upperC: 15, factors: [1.22, 1.15, 1.12] },
  { lowC: 16, upperC: 20, factors: [1.15, 1.11, 1.08] },
  { lowC: 21, upperC: 25, factors: [1.08, 1.05, 1.04] },
  { lowC: 26, upperC: 30, factors: [1.0, 1.0, 1.0] },
  { lowC: 31, upperC: 35, factors: [0.91, 0.94, 0.96] },
  { lowC: 36, upperC: 40, factors: [0.82, 0.88, 0.91] },
  { lowC: 41, upperC: 45, factors: [0.71, 0.82, 0.87] },
  { lowC: 46, upperC: 50, factors: [0.58, 0.75, 0.82] },
  { lowC: 51, upperC: 55, factors: [0.41, 0.67, 0.76] },
  { lowC: 56, upperC: 60, factors: [null, 0.58, 0.71] },
  { lowC: 61, upperC: 65, factors: [null, 0.47, 0.65] },
  { lowC: 66, upperC: 70, factors: [null, 0.33, 0.58] },
  { lowC: 71, upperC: 75, factors: [null, null, 0.5] },
  { lowC: 76, upperC: 80, factors: [null, null, 0.41] },
  { lowC: 81, upperC: 85, factors: [null, null, 0.29] },
];

/** Table 310.16 ampacities assume this ambient, °C. */
export const TABLE_BASIS_AMBIENT_C = 30;
/** Highest ambient the table covers, °C; above it every column is a dash. */
export const MAX_TABULATED_AMBIENT_C = 85;

/**
 * Precomputed factors for integer ambients −40…90 °C, three columns each, so
 * the common (integer) case is one array read. NaN stands for a dash.
 */
const INT_MIN_C = -40;
const INT_MAX_C = 90;
const BY_INTEGER: Float64Array = (() => {
  const a = new Float64Array((INT_MAX_C - INT_MIN_C + 1) * 3).fill(Number.NaN);
  for (let t = INT_MIN_C; t <= INT_MAX_C; t++) {
    const f = bandFactors(t);
    if (!f) continue;
    for (let c = 0; c < 3; c++) {
      const v = f[c];
      if (v !== null && v !== undefined) a[(t - INT_MIN_C) * 3 + c] = v;
    }
  }
  return a;
})();

function bandFactors(ambientC: number): AmbientBand['factors'] | null {
  for (const band of AMBIENT_CORRECTION_BANDS) if (ambientC <= band.upperC) return band.factors;
  return null;
}

function column(tempC: TempColumnC): number {
  return tempC === 60 ? 0 : tempC === 75 ? 1 : 2;
}

/**
 * Table 310.15(B)(1)(1) factor for an insulation rating and ambient, or null
 * where the table has a dash (the conductor may not be used at that ambient).
 */
export function ambientCorrectionFactor(insulationTempC: TempColumnC, ambientC: number): number | null {
  if (Number.isNaN(ambientC)) return null;
  if (Number.isInteger(ambientC) && ambientC >= INT_MIN_C && ambientC <= INT_MAX_C) {
    const v = BY_INTEGER[(ambientC - INT_MIN_C) * 3 + column(insulationTempC)]!;
    return Number.isNaN(v) ? null : v;
  }
  const f = bandFactors(ambientC);
  return f ? (f[column(insulationTempC)] ?? null) : null;
}

/**
 * Equation 310.15(B)(1): sqrt((Tc − Ta') / (Tc − 30)), unrounded; null when
 * the ambient is at or above the insulation rating (no ampacity left).
 */
export function ambientCorrectionByFormula(insulationTempC: number, ambientC: number): number | null {
  if (!(ambientC < insulationTempC)) return null;
  return Math.sqrt((insulationTempC - ambientC) / (insulationTempC - TABLE_BASIS_AMBIENT_C));
}

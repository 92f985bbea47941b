/**
 * Maximum fill of a raceway's internal area by the number of conductors or
 * cables in it: NFPA 70-2023 / 2020 Chapter 9 Table 1.
 *
 * Source: from memory, checked against public reproductions (unchanged for
 * many editions). Notes applied by the takeoff: EGCs count at their actual
 * size (Note 3); mixed sizes sum their Table 5 areas (Note 6); a nipple of
 * 24 in or less may be filled to 60 % (Note 4, not applied: the drawing does
 * not show nipples).
 * Independent check (test/core/tables/chapter9.test.ts): Table 4's 40 %
 * column is 0.40 × its 100 % column, and Annex C's same-size counts come out
 * of this percentage, Table 4 and Table 5 with Note 7's rounding.
 */
export const CHAPTER9_TABLE1_SOURCE = 'NFPA 70-2023 / 2020 Chapter 9 Table 1, from memory, checked against public reproductions';

/** Table 1: the fraction of a raceway's internal area that `count` conductors may fill. */
export function maxFillFraction(count: number): number {
  if (count <= 1) return 0.53;
  if (count === 2) return 0.31;
  return 0.4;
}

/**
 * Chapter 9 Note 7: how many identical conductors fit, from the allowed area
 * and one conductor's area. A quotient whose decimal part is 0.8 or more
 * rounds up; otherwise it rounds down.
 */
export function sameSizeCount(allowedAreaIn2: number, conductorAreaIn2: number): number {
  const q = allowedAreaIn2 / conductorAreaIn2;
  const whole = Math.floor(q);
  // Compare in thousandths so 0.8 itself is not lost to binary rounding.
  return Math.round((q - whole) * 1000) >= 800 ? whole + 1 : whole;
}

import type { CodeEdition } from '../model/schema';

/**
 * Standard ampere ratings of fuses and inverse-time circuit breakers,
 * NFPA 70 240.6(A), per edition.
 *
 * Source: NFPA 70-2023 and NFPA 70-2020 240.6(A), from memory, checked
 * against public reproductions. 2023 starts the list at 10 A; 2020 starts it
 * at 15 A and lists 10 A among the extra fuse ratings. Both add 1, 3, 6 and
 * 601 A for fuses.
 * Independent check: test/core/tables/standardRatings.test.ts (list per edition,
 * strictly rising, next-size-up worked values from 240.4(B) practice).
 */
export type OcpdDevice = 'breaker' | 'fuse';

export const STANDARD_RATINGS_SOURCE = 'NFPA 70-2023 / 2020 240.6(A), from memory, checked against public reproductions';

const COMMON_FROM_15 = [
  15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
  600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
] as const;

function sorted(extra: readonly number[], base: readonly number[]): readonly number[] {
  return Object.freeze([...new Set([...extra, ...base])].sort((a, b) => a - b));
}

const LISTS: Readonly<Record<CodeEdition, Readonly<Record<OcpdDevice, readonly number[]>>>> = {
  2023: {
    breaker: sorted([10], COMMON_FROM_15),
    fuse: sorted([1, 3, 6, 10, 601], COMMON_FROM_15),
  },
  2020: {
    breaker: sorted([], COMMON_FROM_15),
    fuse: sorted([1, 3, 6, 10, 601], COMMON_FROM_15),
  },
};

/** 240.6(A) standard ratings (A), smallest first. */
export function standardRatingsA(edition: CodeEdition, device: OcpdDevice): readonly number[] {
  return LISTS[edition][device];
}

/** True when `a` is a 240.6(A) standard rating for the device and edition. */
export function isStandardRating(a: number, edition: CodeEdition, device: OcpdDevice): boolean {
  return LISTS[edition][device].includes(a);
}

/** Smallest standard rating strictly above `a`, or null above the largest (6000 A). */
export function nextStandardRatingAbove(a: number, edition: CodeEdition, device: OcpdDevice): number | null {
  const list = LISTS[edition][device];
  // Index loops: this runs for every conductor, and an iterator costs an allocation per step until the caller is optimized.
  for (let i = 0; i < list.length; i++) if (list[i]! > a) return list[i]!;
  return null;
}

/** Largest standard rating at or below `a`, or null below the smallest. */
export function largestStandardRatingAtMost(a: number, edition: CodeEdition, device: OcpdDevice): number | null {
  const list = LISTS[edition][device];
  let best: number | null = null;
  for (let i = 0; i < list.length && list[i]! <= a; i++) best = list[i]!;
  return best;
}

import { describe, expect, it } from 'vitest';
import {
  isStandardRating,
  largestStandardRatingAtMost,
  nextStandardRatingAbove,
  standardRatingsA,
} from '../../../core/src/tables/standardRatings';

// NFPA 70-2023 240.6(A), from memory, checked against public reproductions.
const LIST_2023 = [
  10, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500,
  600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
];

describe('240.6(A) standard ampere ratings', () => {
  it('NFPA 70-2023 breakers: 10 A to 6000 A', () => {
    expect(standardRatingsA(2023, 'breaker')).toEqual(LIST_2023);
  });

  it('NFPA 70-2023 fuses add 1, 3, 6 and 601 A', () => {
    expect(standardRatingsA(2023, 'fuse')).toEqual([1, 3, 6, ...LIST_2023.slice(0, 27), 601, ...LIST_2023.slice(27)]);
  });

  it('NFPA 70-2020 breakers start at 15 A; fuses add 1, 3, 6, 10 and 601 A', () => {
    expect(standardRatingsA(2020, 'breaker')).toEqual(LIST_2023.slice(1));
    expect(standardRatingsA(2020, 'fuse')).toEqual(standardRatingsA(2023, 'fuse'));
    expect(isStandardRating(10, 2020, 'breaker')).toBe(false);
    expect(isStandardRating(10, 2020, 'fuse')).toBe(true);
    expect(isStandardRating(10, 2023, 'breaker')).toBe(true);
  });

  it('lists rise strictly (a lookup by scanning relies on it)', () => {
    for (const edition of [2020, 2023] as const)
      for (const device of ['breaker', 'fuse'] as const) {
        const list = standardRatingsA(edition, device);
        for (let i = 1; i < list.length; i++) expect(list[i]!).toBeGreaterThan(list[i - 1]!);
      }
  });

  it('601 A is a fuse rating only', () => {
    expect(isStandardRating(601, 2023, 'fuse')).toBe(true);
    expect(isStandardRating(601, 2023, 'breaker')).toBe(false);
  });

  it('240.4(B) practice: next size above 110 A is 125 A; above 100 A is 110 A (strictly above)', () => {
    expect(nextStandardRatingAbove(110, 2023, 'breaker')).toBe(125);
    expect(nextStandardRatingAbove(100, 2023, 'breaker')).toBe(110);
    expect(nextStandardRatingAbove(112.75, 2023, 'breaker')).toBe(125);
  });

  it('above 800 A the next rating is 1000 A; 240.4(B) stops at 800 A (common practice)', () => {
    expect(nextStandardRatingAbove(800, 2023, 'breaker')).toBe(1000);
    expect(nextStandardRatingAbove(760, 2023, 'breaker')).toBe(800);
    expect(nextStandardRatingAbove(600, 2023, 'fuse')).toBe(601);
    expect(nextStandardRatingAbove(600, 2023, 'breaker')).toBe(700);
  });

  it('nothing above 6000 A; nothing at or below 9 A for a 2023 breaker', () => {
    expect(nextStandardRatingAbove(6000, 2023, 'breaker')).toBeNull();
    expect(largestStandardRatingAtMost(9, 2023, 'breaker')).toBeNull();
    expect(largestStandardRatingAtMost(9, 2023, 'fuse')).toBe(6);
  });

  it('largest rating at or below: 225.5 A → 225 A; 200 A → 200 A; 14 A → 10 A (2023) / none (2020 breaker)', () => {
    expect(largestStandardRatingAtMost(225.5, 2023, 'breaker')).toBe(225);
    expect(largestStandardRatingAtMost(200, 2023, 'breaker')).toBe(200);
    expect(largestStandardRatingAtMost(14, 2023, 'breaker')).toBe(10);
    expect(largestStandardRatingAtMost(14, 2020, 'breaker')).toBeNull();
  });
});

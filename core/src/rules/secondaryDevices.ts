import type { Termination } from './facts';

/** The devices on a transformer's secondary as Table 450.3(B) counts them. */
export interface SecondaryDevices {
  /**
   * Every secondary run ends in a device and there are at most six in all
   * (Note 2): a single breaker or set of fuses, or a board without a main
   * whose every output goes through one of at most six breakers or sets of
   * fuses grouped on it.
   */
  present: boolean;
  /** Breakers or sets of fuses counted. */
  count: number;
  /** Their ratings added (Note 2); null when one is not given or a run ends in no device. */
  sumA: number | null;
}

/** Most breakers or sets of fuses that Table 450.3(B) Note 2 lets count as one secondary device. */
export const MAX_GROUPED_SECONDARY_DEVICES = 6;

/** 450.3(B) Note 2: up to six breakers or sets of fuses grouped in one location are the secondary device, their ratings added. */
export function secondaryDevices(ends: readonly Termination[]): SecondaryDevices {
  let count = 0;
  let sum: number | null = 0;
  let every = ends.length > 0;
  for (const e of ends) {
    if (e.kind === 'ocpd') {
      count++;
      sum = sum === null || e.ratingA === null ? null : sum + e.ratingA;
    } else if (e.kind === 'bus' && e.onlyOcpdsBelow && e.groupedOcpdCount <= MAX_GROUPED_SECONDARY_DEVICES) {
      count += e.groupedOcpdCount;
      sum = sum === null || e.groupedOcpdSumA === null ? null : sum + e.groupedOcpdSumA;
    } else every = false;
  }
  const present = every && count <= MAX_GROUPED_SECONDARY_DEVICES;
  return { present, count, sumA: present ? sum : null };
}

/**
 * Typical total clearing times at high fault currents, used when a device's
 * clearingTimeS is not entered. The time-current curve of the actual device
 * always wins.
 *
 * Source: common practice, from memory: a current-limiting fuse in its
 * current-limiting range clears within half a cycle; a molded-case breaker on
 * its instantaneous trip in about 1.5 cycles; an adjustable-trip breaker is
 * taken as an insulated-case or power breaker on its instantaneous trip,
 * about 3 cycles (longer with a short-time delay, which the user must enter);
 * a fuse that is not current limiting in about one cycle.
 * Independent check: test/core/tables/clearingTime.test.ts (cycles at 60 Hz).
 */
export const CLEARING_TIME_SOURCE = 'common practice, from memory (typical total clearing times at 60 Hz)';

const CYCLE_S = 1 / 60;

export interface DefaultClearingTime {
  seconds: number;
  basis: string;
}

/** Typical clearing time of a device kind (common practice). */
export function defaultClearingTime(device: { kind: 'breaker'; adjustableTrip?: unknown } | { kind: 'fuse'; currentLimiting: boolean }): DefaultClearingTime {
  if (device.kind === 'fuse')
    return device.currentLimiting
      ? { seconds: CYCLE_S / 2, basis: 'current-limiting fuse in its current-limiting range, ½ cycle' }
      : { seconds: CYCLE_S, basis: 'fuse, not current limiting, about 1 cycle' };
  return device.adjustableTrip
    ? { seconds: 3 * CYCLE_S, basis: 'adjustable-trip breaker on its instantaneous trip, about 3 cycles' }
    : { seconds: 1.5 * CYCLE_S, basis: 'molded-case breaker on its instantaneous trip, about 1.5 cycles' };
}

import { takeoffTotals, type TakeoffTotals } from '../takeoff/totals';
import type { Takeoff } from '../takeoff/types';

/** The takeoff as JSON: every run with its working, the devices and equipment, and the totals. */
export interface TakeoffJson extends Takeoff {
  format: 'linewright-takeoff';
  version: 1;
  totals: TakeoffTotals;
}

export function toTakeoffJson(t: Takeoff): TakeoffJson {
  return { format: 'linewright-takeoff', version: 1, ...t, totals: takeoffTotals(t) };
}

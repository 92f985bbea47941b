import type { NodeId } from '../model/schema';
import type { RuleCases } from './testing';
import type { InterruptingFacts } from './studyFacts';

const S = 'NFPA 70-2023 110.9';
const device = (o: Partial<InterruptingFacts> = {}): InterruptingFacts => ({
  edition: 2023,
  deviceId: 'CB-1' as NodeId,
  device: 'CB-1',
  interruptingKA: 22,
  faultKA: 18.2,
  upperBound: false,
  series: null,
  ...o,
});
const series = (combinationKA: number, lineSideIsAhead = true) => ({ lineSideId: 'CB-MAIN' as NodeId, lineSide: 'CB-MAIN', combinationKA, lineSideIsAhead });

export const cases: RuleCases<InterruptingFacts> = {
  meets: [
    { name: '22 kA breaker where 18.2 kA is available', facts: device(), source: S },
    { name: 'at the limit: 22 kA breaker, 22 kA available', facts: device({ faultKA: 22 }), source: S },
    { name: '10 kA branch breaker series-rated 42 kA with the main ahead of it, 30 kA available', facts: device({ interruptingKA: 10, faultKA: 30, series: series(42) }), source: 'NFPA 70-2023 240.86(B)' },
  ],
  fails: [
    { name: '10 kA breaker where 18.2 kA is available', facts: device({ interruptingKA: 10 }), expect: ['rating'], source: S },
    { name: 'series combination 22 kA below the 30 kA available', facts: device({ interruptingKA: 10, faultKA: 30, series: series(22) }), expect: ['series'], source: 'NFPA 70-2023 240.86(B)' },
    { name: 'declared line-side device is not ahead of this one', facts: device({ interruptingKA: 10, faultKA: 30, series: series(65, false) }), expect: ['series'], source: 'NFPA 70-2023 240.86(B)' },
  ],
  unknown: [{ name: 'fault current unknown', facts: device({ faultKA: null }), expect: ['rating'], source: S }],
};

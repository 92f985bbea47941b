import type { NodeId } from '../model/schema';
import type { RuleCases } from './testing';
import type { EquipmentRatingFacts } from './studyFacts';

const S = 'NFPA 70-2023 110.10';
const panel = (o: Partial<EquipmentRatingFacts> = {}): EquipmentRatingFacts => ({ edition: 2023, equipmentId: 'LP-1' as NodeId, equipment: 'LP-1', sccrKA: 22, faultKA: 14, upperBound: false, ...o });

export const cases: RuleCases<EquipmentRatingFacts> = {
  meets: [
    { name: 'panelboard rated 22 kA where 14 kA is available', facts: panel(), source: S },
    { name: 'at the limit: 22 kA rating, 22 kA available', facts: panel({ faultKA: 22 }), source: S },
  ],
  fails: [{ name: 'panelboard rated 10 kA where 14 kA is available', facts: panel({ sccrKA: 10 }), expect: ['sccr'], source: S }],
  unknown: [{ name: 'fault current unknown', facts: panel({ faultKA: null }), expect: ['sccr'], source: S }],
};

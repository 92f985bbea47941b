import { atLeast, defineRule, when } from './define';
import type { EquipmentRatingFacts } from './studyFacts';

/**
 * 110.10: equipment (switchboards, panelboards and the like) must be rated
 * for the fault current available where it is installed; its short-circuit
 * current rating is the marked value the user enters as `sccrKA`.
 */
export const equipmentSccr = defineRule({
  id: 'equipment-sccr',
  verdict: null,
  family: 'equipment',
  section: '110.10',
  title: 'Equipment short-circuit current rating',
  messages: {
    sccr: '{{equipment}}: short-circuit current rating {{sccrKA}} kA must be at least the {{faultKA}} kA available.',
  },
  check(f: EquipmentRatingFacts) {
    return [when('sccr', atLeast(f.sccrKA, f.faultKA), { equipment: f.equipment, sccrKA: f.sccrKA ?? '?', faultKA: f.faultKA === null ? '?' : Math.round(f.faultKA * 100) / 100 })];
  },
});

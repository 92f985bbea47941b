import { sizeLabel } from '../tables/sizes';
import { withstandConstant, withstandTimeS } from '../tables/conductorWithstand';
import { defineRule, when } from './define';
import type { WithstandFacts } from './studyFacts';

/**
 * A tap or secondary conductor relies on the device ahead of it to clear a
 * short circuit; 110.10 asks that the conductors not be damaged before it
 * does. ICEA P-32-382: the longest time the conductor carries the fault
 * current from its rated temperature to the insulation's short-time limit
 * must be at least the device's clearing time. Parallel sets share the fault.
 */
export const conductorWithstand = defineRule({
  id: 'conductor-withstand',
  verdict: null,
  family: 'study',
  section: '110.10',
  title: 'Conductor short-circuit withstand',
  messages: {
    withstand:
      '{{conductor}} carries {{faultKA}} kA for at most {{allowedMs}} ms ({{initialC}} → {{finalC}} °C, ICEA P-32-382); the {{device}} must clear within that, and takes {{clearingMs}} ms ({{clearingBasis}}). Smallest size that withstands: {{smallestSize}}.',
  },
  check(f: WithstandFacts) {
    const k = withstandConstant(f.material, f.initialC, f.finalC);
    const allowed = f.faultKA === null || f.areaCmil === null ? null : withstandTimeS(f.faultKA * 1000, f.areaCmil * f.parallelSets, k);
    return [
      when('withstand', allowed === null ? null : allowed >= f.clearingTimeS, {
        conductor: `${f.parallelSets > 1 ? `${f.parallelSets} sets of ` : ''}${sizeLabel(f.size)} ${f.material === 'cu' ? 'Cu' : 'Al'}`,
        faultKA: f.faultKA === null ? '?' : Math.round(f.faultKA * 100) / 100,
        allowedMs: allowed === null ? '?' : Number((allowed * 1000).toPrecision(3)),
        initialC: f.initialC,
        finalC: f.finalC,
        device: f.device,
        clearingMs: Number((f.clearingTimeS * 1000).toPrecision(3)),
        clearingBasis: f.clearingBasis,
        smallestSize: f.smallestSize ? sizeLabel(f.smallestSize) : 'none in the table',
      }),
    ];
  },
});

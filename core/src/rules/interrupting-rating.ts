import { atLeast, defineRule, when } from './define';
import type { InterruptingFacts } from './studyFacts';

/**
 * 110.9: a breaker or fuse intended to interrupt fault current must have an
 * interrupting rating at least the current available at its line terminals.
 * A series rating declared by the user (240.86) lets a load-side breaker
 * rely on the tested combination; it is never inferred.
 */
export const interruptingRating = defineRule({
  id: 'interrupting-rating',
  verdict: null,
  family: 'equipment',
  section: '110.9',
  title: 'Interrupting rating',
  messages: {
    rating: '{{device}}: interrupting rating {{interruptingKA}} kA must be at least the {{faultKA}} kA available at its line terminals.',
    series:
      '{{device}}: series-rated with {{lineSide}} ({{position}}; 240.86, declared): the combination rating {{combinationKA}} kA must be at least the {{faultKA}} kA available, with the line-side device ahead of it.',
  },
  check(f: InterruptingFacts) {
    const fault = f.faultKA === null ? '?' : round2(f.faultKA);
    const own = atLeast(f.interruptingKA, f.faultKA);
    if (f.series && own !== true) {
      const s = f.series;
      const ok = s.lineSideIsAhead ? atLeast(s.combinationKA, f.faultKA) : false;
      return [when('series', ok, { device: f.device, lineSide: s.lineSide, position: s.lineSideIsAhead ? 'ahead of it' : 'not ahead of it', combinationKA: s.combinationKA, faultKA: fault })];
    }
    return [when('rating', own, { device: f.device, interruptingKA: f.interruptingKA ?? '?', faultKA: fault })];
  },
});

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

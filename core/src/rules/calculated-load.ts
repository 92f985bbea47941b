import { atLeast, defineRule, when } from './define';
import type { RunFacts } from './facts';

/**
 * 210.19(A)(1), 215.2(A)(1) and 230.42(A): a conductor is sized for its load
 * twice over. (a) 125 % of the continuous load plus the noncontinuous load
 * against the ampacity before any correction or adjustment, in the column of
 * the termination (110.14(C)); (b) the load itself against the ampacity after
 * correction and adjustment. The 125 % and the derating factors are never
 * multiplied together. Adds findings; never decides a verdict.
 */
export const calculatedLoad = defineRule({
  id: 'calculated-load',
  verdict: null,
  family: 'load',
  section: '215.2(A)(1)',
  title: 'Conductor sized for its load',
  messages: {
    continuous:
      'Ampacity before correction and adjustment, at the termination rating ({{uncorrectedA}} A), must be at least the calculated load: 125 % of the continuous load plus the noncontinuous load ({{calculatedA}} A).',
    conditions: 'Ampacity after correction and adjustment ({{ampacityA}} A) must be at least the load it carries ({{loadA}} A).',
  },
  check(f) {
    return [
      when('continuous', coversCalculatedLoad(f), { uncorrectedA: f.ampacityUncorrectedA ?? '?', calculatedA: f.calculatedLoadA ?? '?' }),
      when('conditions', carriesLoad(f), { ampacityA: f.ampacityA ?? '?', loadA: f.loadA ?? '?' }),
    ];
  },
});

/** (a): the ampacity before correction and adjustment covers the calculated load; null when either is unknown. */
export function coversCalculatedLoad(f: Pick<RunFacts, 'ampacityUncorrectedA' | 'calculatedLoadA'>): boolean | null {
  return atLeast(f.ampacityUncorrectedA, f.calculatedLoadA);
}

/** (b): the ampacity after correction and adjustment carries the load; null when either is unknown. */
export function carriesLoad(f: Pick<RunFacts, 'ampacityA' | 'loadA'>): boolean | null {
  return atLeast(f.ampacityA, f.loadA);
}

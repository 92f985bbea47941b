import { isStandardRating, nextStandardRatingAbove } from '../tables/standardRatings';
import { defineRule, when } from './define';

/**
 * 230.90(A), 240.21(D): service conductors are protected at their load end by
 * the service disconnect's OCPD, whose rating may not exceed their ampacity
 * (240.4(B) round-up allowed). Checked only where the run ends in an OCPD.
 */
export const serviceRule = defineRule({
  id: 'service',
  verdict: 'service',
  family: 'service',
  section: '230.90(A)',
  title: 'Service conductors, protected at their load end',
  messages: {
    loadEnd: 'The service device at the load end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A), or the next standard rating above it ({{nextA}} A).',
  },
  check(f) {
    const t = f.termination;
    if (t.kind !== 'ocpd') return [];
    const A = f.ampacityA;
    const R = t.ratingA;
    if (A === null || R === null) return [when('loadEnd', null, { deviceA: R ?? '?', ampacityA: A ?? '?', nextA: '?' })];
    const next = !isStandardRating(A, f.edition, 'breaker') && R <= 800 ? nextStandardRatingAbove(A, f.edition, 'breaker') : A;
    return [when('loadEnd', R <= (next ?? A), { deviceA: R, ampacityA: A, nextA: next ?? A })];
  },
});

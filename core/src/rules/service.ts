import { isStandardRating, nextStandardRatingAbove } from '../tables/standardRatings';
import { atLeast, defineRule, when } from './define';

/** 230.71: at most six service disconnects (breakers or sets of fuses) per service. */
export const MAX_SERVICE_DISCONNECTS = 6;

/**
 * 230.90(A), 240.21(D): service conductors are protected at their load end by
 * the service disconnect's OCPD, whose rating may not exceed their ampacity
 * (240.4(B) round-up allowed, Exception 2). Where they end on a board without
 * a main whose outputs are all breakers or sets of fuses, those are the
 * service disconnects: at most six (230.71), and by Exception 3 their ratings
 * added may exceed the ampacity only where the calculated load does not.
 */
export const serviceRule = defineRule({
  id: 'service',
  verdict: 'service',
  family: 'service',
  section: '230.90(A)',
  title: 'Service conductors, protected at their load end',
  messages: {
    loadEnd: 'The service device at the load end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A), or the next standard rating above it ({{nextA}} A).',
    disconnects: 'A service may have at most six disconnects (230.71); {{label}} has {{count}}.',
    sumOrLoad:
      'The {{count}} service disconnects on {{label}} ({{sumA}} A added) may exceed the ampacity ({{ampacityA}} A) only where the calculated load ({{calculatedA}} A) does not (230.90(A) Exception 3).',
  },
  check(f) {
    const t = f.termination;
    if (t.kind === 'bus' && t.onlyOcpdsBelow) {
      const A = f.ampacityA;
      const sum = t.groupedOcpdSumA;
      const data = { label: t.label || 'the board', count: t.groupedOcpdCount, sumA: sum ?? 'not all given', ampacityA: A ?? 'unknown', calculatedA: f.calculatedLoadA ?? 'unknown' };
      const withinSum = atLeast(A, sum);
      const withinLoad = atLeast(A, f.calculatedLoadA);
      return [
        when('disconnects', t.groupedOcpdCount <= MAX_SERVICE_DISCONNECTS, data),
        when('sumOrLoad', withinSum === true || withinLoad === true ? true : withinSum === null || withinLoad === null ? null : false, data),
      ];
    }
    if (t.kind !== 'ocpd') return [];
    const A = f.ampacityA;
    const R = t.ratingA;
    if (A === null || R === null) return [when('loadEnd', null, { deviceA: R ?? '?', ampacityA: A ?? '?', nextA: '?' })];
    const next = !isStandardRating(A, f.edition, 'breaker') && R <= 800 ? nextStandardRatingAbove(A, f.edition, 'breaker') : A;
    return [when('loadEnd', R <= (next ?? A), { deviceA: R, ampacityA: A, nextA: next ?? A })];
  },
});

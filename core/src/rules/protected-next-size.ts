import { isStandardRating, nextStandardRatingAbove } from '../tables/standardRatings';
import { atMost, defineRule, when, type Check, conductorName } from './define';

/**
 * 240.4(B): the next standard rating above the ampacity may protect the
 * conductor when the device is 800 A or less, the ampacity is not itself a
 * standard rating, and the circuit is not a multioutlet branch circuit for
 * cord-and-plug loads. 240.4(D) still caps small conductors.
 */
export const protectedNextSize = defineRule({
  id: 'protected-next-size',
  verdict: 'protected-next-size',
  family: 'protection',
  section: '240.4(B)',
  title: 'Protected by the next standard rating up',
  messages: {
    atMost800: 'The device ({{deviceA}} A) must be 800 A or less; above that 240.4(C) allows no round-up.',
    notStandard: 'The ampacity ({{ampacityA}} A) must not itself be a standard rating (240.6(A)).',
    nextSize: 'The device ({{deviceA}} A) must not exceed the next standard rating above the ampacity ({{ampacityA}} A), which is {{nextA}} A.',
    notCordAndPlug: 'Must not be a multioutlet branch circuit supplying receptacles for cord-and-plug loads.',
    small: '240.4(D): a {{size}} conductor may be protected at no more than {{maxA}} A; the device is {{deviceA}} A.',
  },
  check(f) {
    const R = f.supplyOcpdA;
    const A = f.ampacityA;
    const device = f.supplyOcpdKind ?? 'breaker';
    const next = A === null ? null : nextStandardRatingAbove(A, f.edition, device);
    const out: Check<'atMost800' | 'notStandard' | 'nextSize' | 'notCordAndPlug' | 'small'>[] = [
      when('atMost800', atMost(R, 800), { deviceA: R ?? '?' }),
      when('notStandard', A === null ? null : !isStandardRating(A, f.edition, device), { ampacityA: A ?? '?' }),
      when('nextSize', R === null || A === null ? null : next !== null && R <= next, {
        deviceA: R ?? '?',
        ampacityA: A ?? '?',
        nextA: next ?? 'none',
      }),
      when('notCordAndPlug', !f.multioutletCordAndPlug),
    ];
    if (f.smallConductorMaxOcpdA !== null) {
      out.push(when('small', R === null ? null : R <= f.smallConductorMaxOcpdA, { size: conductorName(f), maxA: f.smallConductorMaxOcpdA, deviceA: R ?? '?' }));
    }
    return out;
  },
});

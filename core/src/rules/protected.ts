import { atLeast, defineRule, when, type Check, conductorName } from './define';

/** 240.4: the OCPD rating does not exceed the conductor's ampacity (and 240.4(D) for small sizes). */
export const protectedRule = defineRule({
  id: 'protected',
  verdict: 'protected',
  family: 'protection',
  section: '240.4',
  title: 'Protected at its ampacity',
  messages: {
    rating: 'The device ahead ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A).',
    small: '240.4(D): a {{size}} conductor may be protected at no more than {{maxA}} A; the device is {{deviceA}} A.',
  },
  check(f) {
    const out: Check<'rating' | 'small'>[] = [
      when('rating', atLeast(f.ampacityA, f.supplyOcpdA), { deviceA: f.supplyOcpdA ?? '?', ampacityA: f.ampacityA ?? '?' }),
    ];
    if (f.smallConductorMaxOcpdA !== null) {
      out.push(
        when('small', atLeast(f.smallConductorMaxOcpdA, f.supplyOcpdA), {
          size: conductorName(f),
          maxA: f.smallConductorMaxOcpdA,
          deviceA: f.supplyOcpdA ?? '?',
        }),
      );
    }
    return out;
  },
});

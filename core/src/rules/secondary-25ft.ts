import { atLeast, atMost, damageCheck, defineRule, deviceLimitCheck, singleDeviceCheck, toSecondaryA, when } from './define';

/** 240.21(C)(6): secondary conductors not over 25 ft. Round-up never applies. */
export const secondary25ft = defineRule({
  id: 'secondary-25ft',
  verdict: 'secondary-25ft',
  family: 'transformer-secondary',
  section: '240.21(C)(6)',
  title: 'Transformer secondary not over 25 ft',
  lengthLimit: { maxFt: 25, conditionId: 'length' },
  sizeIndependent: ['length', 'single', 'damage'],
  messages: {
    length: 'Length {{lengthFt}} ft; must be at most 25 ft.',
    third: 'Ampacity ({{ampacityA}} A) must be at least one third of the primary device {{primaryA}} A × {{vp}} V / {{vs}} V ({{minA}} A).',
    single: 'Must end in a single circuit breaker or a single set of fuses (ends in: {{termination}}).',
    device: 'The device at the end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A).',
    damage: 'Must be protected from physical damage (here: {{protection}}).',
  },
  check(f) {
    const t = f.transformer;
    const P = t?.primaryOcpdA ?? null;
    const reflected = toSecondaryA(P, t);
    const minA = reflected === null ? null : reflected / 3;
    return [
      when('length', atMost(f.lengthFt, 25), { lengthFt: f.lengthFt ?? '?' }),
      when('third', atLeast(f.ampacityA, minA), {
        ampacityA: f.ampacityA ?? '?',
        primaryA: P ?? '?',
        vp: t?.primaryVoltsLL ?? '?',
        vs: t?.secondaryVoltsLL ?? '?',
        minA: minA ?? '?',
      }),
      singleDeviceCheck(f),
      deviceLimitCheck(f),
      damageCheck(f),
    ];
  },
});

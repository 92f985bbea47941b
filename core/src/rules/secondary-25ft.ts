import { atLeast, atMost, damageCheck, defineRule, deviceLimitCheck, singleDeviceCheck, when } from './define';

/** 240.21(C)(6): secondary conductors not over 25 ft. Round-up never applies. */
export const secondary25ft = defineRule({
  id: 'secondary-25ft',
  verdict: 'secondary-25ft',
  family: 'transformer-secondary',
  section: '240.21(C)(6)',
  title: 'Transformer secondary not over 25 ft',
  messages: {
    length: 'The run is {{lengthFt}} ft; at most 25 ft.',
    third: 'The ampacity of {{ampacityA}} A is at least one third of the {{primaryA}} A primary device × {{vp}} V / {{vs}} V ({{minA}} A).',
    single: 'Ends in a single circuit breaker or a single set of fuses ({{termination}}).',
    device: 'The device at the end ({{deviceA}} A) limits the load to the ampacity of {{ampacityA}} A.',
    damage: 'Protected from physical damage by {{protection}}.',
  },
  check(f) {
    const t = f.transformer;
    const P = t?.primaryOcpdA ?? null;
    const minA = t && P !== null ? (P * t.primaryVoltsLL) / t.secondaryVoltsLL / 3 : null;
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

import { atMost, damageCheck, defineRule, deviceLimitCheck, singleDeviceCheck, when, loadCheck, LOAD_MESSAGE, oneThirdCheck, ONE_THIRD_MESSAGE } from './define';

/** 240.21(B)(2): feeder tap not over 25 ft. Round-up (240.4(B)) never applies, so raw values are compared. */
export const tap25ft = defineRule({
  id: 'tap-25ft',
  verdict: 'tap-25ft',
  family: 'feeder-tap',
  section: '240.21(B)(2)',
  title: 'Feeder tap not over 25 ft',
  lengthLimit: { maxFt: 25, conditionId: 'length' },
  sizeIndependent: ['length', 'single', 'damage'],
  messages: {
    length: 'Length {{lengthFt}} ft; must be at most 25 ft.',
    third: ONE_THIRD_MESSAGE,
    load: LOAD_MESSAGE,
    single: 'Must end in a single circuit breaker or a single set of fuses (ends in: {{termination}}).',
    device: 'The device at the end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A).',
    damage: 'Must be protected from physical damage (here: {{protection}}).',
  },
  check(f) {
    return [
      when('length', atMost(f.lengthFt, 25), { lengthFt: f.lengthFt ?? '?' }),
      oneThirdCheck(f),
      loadCheck(f),
      singleDeviceCheck(f),
      deviceLimitCheck(f),
      damageCheck(f),
    ];
  },
});

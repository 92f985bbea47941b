import { sizeIndexOf } from '../tables/sizes';
import { atMost, damageCheck, defineRule, deviceLimitCheck, singleDeviceCheck, when, loadCheck, LOAD_MESSAGE, oneThirdCheck, ONE_THIRD_MESSAGE } from './define';

/** 240.21(B)(4): feeder tap over 25 ft in a high-bay manufacturing building. */
export const tapHighBay = defineRule({
  id: 'tap-high-bay',
  verdict: 'tap-high-bay',
  family: 'feeder-tap',
  section: '240.21(B)(4)',
  title: 'Feeder tap in a high-bay manufacturing building, up to 100 ft',
  lengthLimit: { maxFt: 100, conditionId: 'total' },
  sizeIndependent: ['building', 'qualified', 'horizontal', 'total', 'single', 'damage', 'noSplices', 'noPenetration', 'height'],
  messages: {
    building: 'Must be a manufacturing building with walls over 35 ft high (project: {{wallFt}} ft).',
    qualified: 'Maintenance and supervision must ensure that only qualified persons service the system (project setting).',
    horizontal: 'Horizontal run {{horizontalFt}} ft; must be at most 25 ft.',
    total: 'Length {{lengthFt}} ft; must be at most 100 ft in all.',
    third: ONE_THIRD_MESSAGE,
    load: LOAD_MESSAGE,
    single: 'Must end in a single circuit breaker or a single set of fuses (ends in: {{termination}}).',
    device: 'The device at the end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A).',
    damage: 'Must be protected from physical damage (here: {{protection}}).',
    noSplices: 'Must run from end to end without splices.',
    minSize: 'Must be at least 6 AWG copper or 4 AWG aluminum (here {{size}} {{material}}).',
    noPenetration: 'Must not penetrate walls, floors or ceilings.',
    height: 'Tap made {{heightFt}} ft above the floor; must be at least 30 ft.',
  },
  check(f) {
    const hb = f.highBay;
    const minSize = sizeIndexOf(f.material === 'cu' ? '6' : '4');
    return [
      when('building', (f.site.manufacturingWallHeightFt ?? 0) > 35, { wallFt: f.site.manufacturingWallHeightFt ?? 'not given' }),
      when('qualified', f.site.qualifiedMaintenance),
      when('horizontal', hb ? hb.horizontalFt <= 25 : null, { horizontalFt: hb?.horizontalFt ?? '?' }),
      when('total', atMost(f.lengthFt, 100), { lengthFt: f.lengthFt ?? '?' }),
      oneThirdCheck(f),
      loadCheck(f),
      singleDeviceCheck(f),
      deviceLimitCheck(f),
      damageCheck(f),
      when('noSplices', !f.hasSplices),
      when('minSize', f.size === null ? null : sizeIndexOf(f.size) >= minSize, { size: f.size ?? '?', material: f.material }),
      when('noPenetration', hb ? !hb.penetratesWallFloorCeiling : null),
      when('height', hb ? hb.tapHeightAboveFloorFt >= 30 : null, { heightFt: hb?.tapHeightAboveFloorFt ?? '?' }),
    ];
  },
});

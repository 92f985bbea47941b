import { atLeast, atMost, defineRule, when, loadCheck, LOAD_MESSAGE } from './define';
import type { Check } from './define';
import type { RunFacts } from './facts';

type Id = 'length' | 'load' | 'termination' | 'beyond' | 'raceway' | 'fieldTenth';

/**
 * The checks that 240.21(B)(1) and 240.21(C)(2) share: at most 10 ft, carries
 * the load, at least the rating at the termination, stays within the
 * equipment, in a raceway. The field-installation limit differs and is added by each rule.
 */
export function tenFootChecks(f: RunFacts): Check<Id>[] {
  const t = f.termination;
  const terminationOk = t.kind === 'ocpd' || t.kind === 'bus' ? atLeast(f.ampacityA, t.ratingA) : false;
  return [
    when('length', atMost(f.lengthFt, 10), { lengthFt: f.lengthFt ?? '?' }),
    loadCheck(f),
    when('termination', terminationOk, {
      ampacityA: f.ampacityA ?? '?',
      termination: t.label || t.kind,
      rating:
        t.kind === 'ocpd' || t.kind === 'bus'
          ? t.ratingA === null ? 'rating not given' : `${t.ratingA} A`
          : `a ${t.kind}, not a device or rated equipment`,
    }),
    when('beyond', !f.extendsBeyondEquipment),
    when('raceway', f.inRaceway),
  ];
}

/**
 * Whether the one-tenth limit of a field installation applies, and how the
 * working says so: a tap between two pieces of equipment leaves the enclosure
 * unless the drawing says it does not, so an unstated fact is taken as leaving.
 */
export function fieldInstallation(f: RunFacts): { applies: boolean; stated: string } {
  if (f.leavesEnclosure === false) return { applies: false, stated: '' };
  return { applies: true, stated: f.leavesEnclosure === null ? ' (not stated, so taken as leaving: the conservative case)' : '' };
}

export const TEN_FOOT_MESSAGES = {
  length: 'Length {{lengthFt}} ft; must be at most 10 ft.',
  load: LOAD_MESSAGE,
  termination: 'Ampacity ({{ampacityA}} A) must be at least the rating of the device or equipment it ends in: {{termination}}, {{rating}}.',
  beyond: 'Must not extend beyond the equipment it supplies.',
  raceway: 'Must be enclosed in a raceway from the tap to the enclosure it ends in.',
} as const;

/** 240.21(B)(1): feeder tap not over 10 ft. */
export const tap10ft = defineRule<Id>({
  id: 'tap-10ft',
  verdict: 'tap-10ft',
  family: 'feeder-tap',
  section: '240.21(B)(1)',
  title: 'Feeder tap not over 10 ft',
  lengthLimit: { maxFt: 10, conditionId: 'length' },
  sizeIndependent: ['length', 'beyond', 'raceway'],
  messages: {
    ...TEN_FOOT_MESSAGES,
    fieldTenth: 'Field installation leaving the enclosure{{stated}}: ampacity ({{ampacityA}} A) must be at least one tenth of the {{feederA}} A feeder device ({{minA}} A).',
  },
  check(f) {
    const out = tenFootChecks(f);
    const field = fieldInstallation(f);
    if (field.applies) {
      const minA = f.supplyOcpdA === null ? null : f.supplyOcpdA / 10;
      out.push(when('fieldTenth', atLeast(f.ampacityA, minA), { ampacityA: f.ampacityA ?? '?', feederA: f.supplyOcpdA ?? '?', minA: minA ?? '?', stated: field.stated }));
    }
    return out;
  },
});

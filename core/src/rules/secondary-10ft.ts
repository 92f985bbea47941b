import { atLeast, defineRule, toSecondaryA, when } from './define';
import { fieldInstallation, TEN_FOOT_MESSAGES, tenFootChecks } from './tap-10ft';

/** 240.21(C)(2): transformer secondary conductors not over 10 ft. */
export const secondary10ft = defineRule({
  id: 'secondary-10ft',
  verdict: 'secondary-10ft',
  family: 'transformer-secondary',
  section: '240.21(C)(2)',
  title: 'Transformer secondary not over 10 ft',
  lengthLimit: { maxFt: 10, conditionId: 'length' },
  sizeIndependent: ['length', 'beyond', 'raceway'],
  messages: {
    ...TEN_FOOT_MESSAGES,
    fieldTenth:
      'Field installation leaving the enclosure{{stated}}: the primary device {{primaryA}} A × {{vp}} V / {{vs}} V ({{reflectedA}} A) must not exceed 10 × the ampacity ({{ampacityA}} A).',
  },
  check(f) {
    const out = tenFootChecks(f);
    const field = fieldInstallation(f);
    if (field.applies) {
      const t = f.transformer;
      const P = t?.primaryOcpdA ?? null;
      const reflected = toSecondaryA(P, t);
      out.push(
        when('fieldTenth', atLeast(f.ampacityA === null ? null : f.ampacityA * 10, reflected), {
          primaryA: P ?? '?',
          vp: t?.primaryVoltsLL ?? '?',
          vs: t?.secondaryVoltsLL ?? '?',
          reflectedA: reflected ?? '?',
          ampacityA: f.ampacityA ?? '?',
          stated: field.stated,
        }),
      );
    }
    return out;
  },
});

import { atLeast, atMost, damageCheck, defineRule, when } from './define';

/** 240.21(C)(3): industrial installations, secondary not over 25 ft to switchgear or a switchboard. */
export const secondaryIndustrial25ft = defineRule({
  id: 'secondary-industrial-25ft',
  verdict: 'secondary-25ft',
  family: 'transformer-secondary',
  section: '240.21(C)(3)',
  title: 'Industrial transformer secondary not over 25 ft',
  lengthLimit: { maxFt: 25, conditionId: 'length' },
  sizeIndependent: ['industrial', 'qualified', 'length', 'switchboard', 'damage'],
  messages: {
    industrial: 'Must be an industrial installation (project setting).',
    qualified: 'Maintenance and supervision must ensure that only qualified persons service the system (project setting).',
    length: 'Length {{lengthFt}} ft; must be at most 25 ft.',
    switchboard: 'Must supply switchgear or a switchboard (ends in: {{termination}}).',
    rated: 'Ampacity ({{ampacityA}} A) must be at least the transformer secondary current rating ({{flaA}} A).',
    grouped: 'Ampacity ({{ampacityA}} A) must be at least the sum of the ratings of the grouped devices it supplies ({{sumA}} A).',
    damage: 'Must be protected from physical damage (here: {{protection}}).',
  },
  check(f) {
    const t = f.termination;
    const tx = f.transformer;
    return [
      when('industrial', f.site.industrialInstallation),
      when('qualified', f.site.qualifiedMaintenance),
      when('length', atMost(f.lengthFt, 25), { lengthFt: f.lengthFt ?? '?' }),
      when('switchboard', t.kind === 'bus' && (t.busType === 'switchgear' || t.busType === 'switchboard'), { termination: t.label || t.kind }),
      when('rated', atLeast(f.ampacityA, tx?.secondaryFlaA ?? null), {
        ampacityA: f.ampacityA ?? '?',
        flaA: tx ? Math.round(tx.secondaryFlaA * 100) / 100 : '?',
      }),
      when('grouped', t.kind === 'bus' ? atLeast(f.ampacityA, t.groupedOcpdSumA) : false, { ampacityA: f.ampacityA ?? '?', sumA: t.groupedOcpdSumA ?? '?' }),
      damageCheck(f),
    ];
  },
});

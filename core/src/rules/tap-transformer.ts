import { Check, atLeast, atMost, damageCheck, defineRule, toSecondaryA, when } from './define';

type Id = 'transformer' | 'oneSecondary' | 'primaryThird' | 'secondaryThird' | 'load' | 'length' | 'damage' | 'single' | 'device';

/**
 * 240.21(B)(3): a feeder tap to a transformer, primary plus secondary at most
 * 25 ft. Judged on the primary run; its facts carry the transformer and the
 * secondary runs. The secondary gets the same verdict (240.21(C)(5)).
 */
export const tapTransformer = defineRule<Id>({
  id: 'tap-transformer',
  verdict: 'tap-transformer',
  family: 'feeder-tap',
  section: '240.21(B)(3)',
  title: 'Feeder tap to a transformer, primary plus secondary not over 25 ft',
  lengthLimit: { maxFt: 25, conditionId: 'length' },
  sizeIndependent: ['transformer', 'oneSecondary'],
  messages: {
    transformer: 'The tap must supply a transformer (here: {{transformer}}).',
    oneSecondary: 'The transformer must supply secondary conductors (it has {{count}} runs).',
    primaryThird: 'Primary ampacity ({{ampacityA}} A) must be at least one third of the {{feederA}} A feeder device ({{minA}} A).',
    secondaryThird:
      '{{set}}Secondary ampacity ({{secondaryA}} A) must be at least one third of {{feederA}} A × {{vp}} V / {{vs}} V ({{minA}} A).',
    load: '{{set}}Secondary ampacity ({{secondaryA}} A) must be at least the load it serves ({{loadA}} A).',
    length: '{{set}}Primary {{primaryFt}} ft plus secondary {{secondaryFt}} ft = {{totalFt}} ft; must be at most 25 ft.',
    damage: '{{set}}Primary and secondary must be protected from physical damage (weakest: {{protection}}).',
    single: '{{set}}The secondary must end in a single circuit breaker or set of fuses (ends in: {{termination}}).',
    device: '{{set}}That device ({{deviceA}}) must not exceed the secondary ampacity ({{secondaryA}} A).',
  },
  check(f) {
    const t = f.transformer;
    const R = f.supplyOcpdA;
    const minP = R === null ? null : R / 3;
    const reflected = toSecondaryA(R, t);
    const minS = reflected === null ? null : reflected / 3;
    const out: Check<Id>[] = [
      when('transformer', t !== null, { transformer: t?.label ?? 'none' }),
      when('oneSecondary', f.secondaries.length > 0, { count: f.secondaries.length }),
      when('primaryThird', atLeast(f.ampacityA, minP), { ampacityA: f.ampacityA ?? 'unknown', feederA: R ?? 'unknown', minA: minP ?? 'unknown' }),
    ];
    // No secondary to judge: each secondary condition fails, so a run that feeds no transformer is never nearest to this rule.
    if (f.secondaries.length === 0) {
      const none = { set: '', secondaryA: 'none', feederA: R ?? 'unknown', vp: t?.primaryVoltsLL ?? 'unknown', vs: t?.secondaryVoltsLL ?? 'unknown', minA: minS ?? 'unknown', loadA: 'none', primaryFt: f.lengthFt ?? 'unknown', secondaryFt: 'none', totalFt: 'none', termination: 'none', deviceA: 'none' };
      for (const id of ['secondaryThird', 'load', 'length', 'single', 'device'] as const) out.push(when(id, false, none));
    }
    // With several secondary sets each is judged on its own, named in every condition.
    for (const s of f.secondaries) {
      const set = f.secondaries.length > 1 ? `Secondary ${s.conductorIds.join(' → ')}: ` : '';
      const total = f.lengthFt !== null && s.lengthFt !== null ? f.lengthFt + s.lengthFt : null;
      const weakest = [f.damageProtection, s.damageProtection].includes('none')
        ? 'none'
        : [f.damageProtection, s.damageProtection].includes('other-approved-means')
          ? 'other-approved-means'
          : 'raceway';
      const sEnd = s.termination;
      const damage = damageCheck({ damageProtection: weakest });
      out.push(
        when('secondaryThird', atLeast(s.ampacityA, minS), { set, secondaryA: s.ampacityA ?? 'unknown', feederA: R ?? 'unknown', vp: t?.primaryVoltsLL ?? 'unknown', vs: t?.secondaryVoltsLL ?? 'unknown', minA: minS ?? 'unknown' }),
        when('load', atLeast(s.ampacityA, s.loadA), { set, secondaryA: s.ampacityA ?? 'unknown', loadA: s.loadA ?? 'unknown' }),
        when('length', atMost(total, 25), { set, primaryFt: f.lengthFt ?? 'unknown', secondaryFt: s.lengthFt ?? 'unknown', totalFt: total ?? 'unknown', secondaryId: s.conductorIds[0] ?? '' }),
        new Check('damage', damage.status, { ...damage.data, set }, damage.needsAhj),
        when('single', sEnd.kind === 'ocpd' && sEnd.single, { set, termination: sEnd.label || sEnd.kind }),
        when('device', sEnd.kind === 'ocpd' ? atLeast(s.ampacityA, sEnd.ratingA) : false, { set, deviceA: sEnd.ratingA === null ? 'not given' : `${sEnd.ratingA} A`, secondaryA: s.ampacityA ?? 'unknown' }),
      );
    }
    return out;
  },
});

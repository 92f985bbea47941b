import { atLeast, atMost, damageCheck, defineRule, toSecondaryA, when } from './define';
import type { RunFacts } from './facts';

/**
 * 240.21(B)(3): a feeder tap to a transformer, primary plus secondary at most
 * 25 ft. Judged on the primary run; its facts carry the transformer and the
 * secondary runs. The secondary gets the same verdict (240.21(C)(5)).
 */
export const tapTransformer = defineRule({
  id: 'tap-transformer',
  verdict: 'tap-transformer',
  family: 'feeder-tap',
  section: '240.21(B)(3)',
  title: 'Feeder tap to a transformer, primary plus secondary not over 25 ft',
  lengthLimit: { maxFt: 25, conditionId: 'length' },
  messages: {
    transformer: 'The tap must supply a transformer (here: {{transformer}}).',
    oneSecondary: 'The transformer must have one secondary run (it has {{count}}).',
    primaryThird: 'Primary ampacity ({{ampacityA}} A) must be at least one third of the {{feederA}} A feeder device ({{minA}} A).',
    secondaryThird:
      'Secondary ampacity ({{secondaryA}} A) must be at least one third of {{feederA}} A × {{vp}} V / {{vs}} V ({{minA}} A).',
    load: 'Secondary ampacity ({{secondaryA}} A) must be at least the load it serves ({{loadA}} A).',
    length: 'Primary {{primaryFt}} ft plus secondary {{secondaryFt}} ft = {{totalFt}} ft; must be at most 25 ft.',
    damage: 'Primary and secondary must be protected from physical damage (weakest: {{protection}}).',
    single: 'The secondary must end in a single circuit breaker or set of fuses (ends in: {{termination}}).',
    device: 'That device ({{deviceA}} A) must not exceed the secondary ampacity ({{secondaryA}} A).',
  },
  check(f) {
    const t = f.transformer;
    const R = f.supplyOcpdA;
    const s: RunFacts | undefined = f.secondaries.length === 1 ? f.secondaries[0] : undefined;
    const minP = R === null ? null : R / 3;
    const reflected = toSecondaryA(R, t);
    const minS = reflected === null ? null : reflected / 3;
    const total = s && f.lengthFt !== null && s.lengthFt !== null ? f.lengthFt + s.lengthFt : null;
    const weakest = [f.damageProtection, s?.damageProtection ?? 'raceway'].includes('none')
      ? 'none'
      : [f.damageProtection, s?.damageProtection].includes('other-approved-means')
        ? 'other-approved-means'
        : 'raceway';
    const sEnd = s?.termination;
    return [
      when('transformer', t !== null, { transformer: t?.label ?? 'none' }),
      when('oneSecondary', s !== undefined, { count: f.secondaries.length }),
      when('primaryThird', atLeast(f.ampacityA, minP), { ampacityA: f.ampacityA ?? '?', feederA: R ?? '?', minA: minP ?? '?' }),
      when('secondaryThird', s ? atLeast(s.ampacityA, minS) : false, {
        secondaryA: s?.ampacityA ?? '?',
        feederA: R ?? '?',
        vp: t?.primaryVoltsLL ?? '?',
        vs: t?.secondaryVoltsLL ?? '?',
        minA: minS ?? '?',
      }),
      when('load', s ? atLeast(s.ampacityA, s.loadA) : false, { secondaryA: s?.ampacityA ?? '?', loadA: s?.loadA ?? '?' }),
      when('length', s ? atMost(total, 25) : false, { primaryFt: f.lengthFt ?? '?', secondaryFt: s?.lengthFt ?? '?', totalFt: total ?? '?' }),
      damageCheck({ damageProtection: weakest }),
      when('single', sEnd ? sEnd.kind === 'ocpd' && sEnd.single : false, { termination: sEnd ? sEnd.label || sEnd.kind : 'none' }),
      when('device', sEnd?.kind === 'ocpd' ? atLeast(s?.ampacityA ?? null, sEnd.ratingA) : false, {
        deviceA: sEnd?.ratingA ?? '?',
        secondaryA: s?.ampacityA ?? '?',
      }),
    ];
  },
});

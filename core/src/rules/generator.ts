import { atLeast, defineRule, when } from './define';

/** 445.13(A), 240.21(G): generator conductors carry 115 % of nameplate current (100 % when the design prevents overload). */
export const generatorRule = defineRule({
  id: 'generator',
  verdict: 'generator',
  family: 'generator',
  section: '445.13(A)',
  title: 'Generator conductors, terminals to the first OCPD',
  messages: {
    ampacity: 'Ampacity ({{ampacityA}} A) must be at least {{pct}} % of the nameplate current {{nameplateA}} A ({{minA}} A).',
  },
  check(f) {
    const g = f.generator;
    if (!g) return [when('ampacity', null, { ampacityA: f.ampacityA ?? '?', pct: 115, nameplateA: '?', minA: '?' })];
    const pct = g.overloadPreventedByDesign ? 100 : 115;
    const minA = (g.nameplateA * pct) / 100;
    return [when('ampacity', atLeast(f.ampacityA, minA), { ampacityA: f.ampacityA ?? '?', pct, nameplateA: Math.round(g.nameplateA * 100) / 100, minA })];
  },
});

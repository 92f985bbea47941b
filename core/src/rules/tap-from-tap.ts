import { defineRule, when } from './define';

/**
 * 240.21: conductors supplied under 240.21(A)–(H) may supply other conductors
 * only through an OCPD that meets 240.4. A run whose supply point lies on a
 * tap or a transformer secondary is a tap from a tap.
 */
export const tapFromTap = defineRule({
  id: 'tap-from-tap',
  verdict: 'tap-from-tap',
  family: 'tap-from-tap',
  section: '240.21',
  title: 'No tap from a tap',
  messages: {
    supply: 'The supply point must not lie on a conductor that is itself a tap or secondary (it lies on {{upstream}}: {{upstreamVerdict}}).',
  },
  check(f) {
    const s = f.suppliedFrom;
    const onProtected = s === null || s.verdict === 'protected' || s.verdict === 'protected-next-size';
    return [when('supply', onProtected, { upstream: s ? s.conductorIds.join(' → ') : 'none', upstreamVerdict: s?.verdict ?? '' })];
  },
});

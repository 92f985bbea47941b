import { FAILING_VERDICTS } from '../analyze/types';
import { defineRule, when } from './define';

/**
 * 240.21: conductors supplied under 240.21(A)–(H) may supply other conductors
 * only through an OCPD that meets 240.4. A run whose supply point lies on a
 * tap or a transformer secondary is a tap from a tap. A run whose supply
 * point lies on a conductor that no rule makes acceptable is not called a
 * tap from a tap: it fails because what feeds it is unprotected, and the
 * condition says so.
 */
export const tapFromTap = defineRule({
  id: 'tap-from-tap',
  verdict: 'tap-from-tap',
  family: 'tap-from-tap',
  section: '240.21',
  title: 'No tap from a tap',
  messages: {
    supply: 'The supply point must not lie on a conductor that is itself a tap or secondary (it lies on {{upstream}}: {{upstreamVerdict}}).',
    protectedSupply: 'The supply point must lie on a conductor that an OCPD protects under 240.4 or a tap rule allows (it lies on {{upstream}}: {{upstreamVerdict}}).',
  },
  check(f) {
    const s = f.suppliedFrom;
    const upstream = s ? s.conductorIds.join(' → ') : 'none';
    const onProtected = s === null || s.verdict === 'protected' || s.verdict === 'protected-next-size';
    const supply = when('supply', onProtected, { upstream, upstreamVerdict: s?.verdict ?? '' });
    if (!s) return [supply];
    const failing = FAILING_VERDICTS.has(s.verdict);
    const fed = when('protectedSupply', !failing, { upstream, upstreamVerdict: s.verdict });
    // On an unprotected conductor the question is not whether it is a tap but that nothing protects it.
    return failing ? [fed] : [fed, supply];
  },
});

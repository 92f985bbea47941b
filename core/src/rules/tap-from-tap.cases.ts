import type { ConductorId } from '../model/schema';
import { runFacts, type RuleCases } from './testing';

const S = 'NFPA 70-2023 240.21';

const upstream = (verdict: 'tap-25ft' | 'tap-10ft' | 'secondary-10ft' | 'tap-outside' | 'unprotected' | 'tap-from-tap') => ({
  conductorIds: ['C-TAP-1' as ConductorId],
  verdict,
});

export const cases: RuleCases = {
  meets: [
    {
      name: 'supplied at the load terminals of the feeder breaker, not from another tap',
      facts: runFacts(),
      source: S,
    },
    {
      name: 'the same tap continued through a same-size pass-through splice: one run, its lengths added, still no tap from a tap',
      facts: runFacts({ conductorIds: ['C-1a' as ConductorId, 'C-1b' as ConductorId], hasSplices: true }),
      source: `${S}; common practice (a same-size splice continues the same tap)`,
    },
    {
      name: 'the upstream run recorded is protected under 240.4: fed from a protected conductor, not a tap from a tap',
      facts: runFacts({ suppliedFrom: { conductorIds: ['C-FDR' as ConductorId], verdict: 'protected' } }),
      source: `${S}; NFPA 70-2023 240.4`,
    },
  ],
  fails: [
    {
      name: 'spliced onto a 25 ft tap: a tap from a tap',
      facts: runFacts({ size: '1', ampacityA: 130, suppliedFrom: upstream('tap-25ft') }),
      expect: ['supply'],
      source: S,
    },
    {
      name: 'spliced onto a 10 ft tap: a tap from a tap',
      facts: runFacts({ size: '1', ampacityA: 130, suppliedFrom: upstream('tap-10ft') }),
      expect: ['supply'],
      source: S,
    },
    {
      name: 'spliced onto an outside tap: a tap from a tap',
      facts: runFacts({ suppliedFrom: upstream('tap-outside') }),
      expect: ['supply'],
      source: S,
    },
    {
      name: 'spliced onto a 10 ft transformer secondary: conductors supplied under 240.21(C) may feed others only through an OCPD',
      facts: runFacts({ suppliedFrom: upstream('secondary-10ft') }),
      expect: ['supply'],
      source: S,
    },
    {
      name: 'spliced onto a conductor no rule protects: fails because it is fed from an unprotected conductor, not called a tap from a tap',
      facts: runFacts({ suppliedFrom: upstream('unprotected') }),
      expect: ['protectedSupply'],
      source: `${S}; NFPA 70-2023 240.4 (the upstream run has no OCPD that protects it)`,
    },
    {
      name: 'spliced onto a conductor that is itself a tap from a tap: fed from an unprotected conductor',
      facts: runFacts({ suppliedFrom: upstream('tap-from-tap') }),
      expect: ['protectedSupply'],
      source: `${S}; NFPA 70-2023 240.4`,
    },
  ],
};

import type { ConductorId } from '../model/schema';
import type { RuleCases } from './testing';
import type { WithstandFacts } from './studyFacts';

/**
 * 1/0 Cu (105 600 cmil, Chapter 9 Table 8) at 20 kA, from 75 °C to 150 °C:
 * K = 0.0297·log10(384/309) = 0.0028029, so it carries the fault for
 * t = 0.0028029/(20 000/105 600)² = 0.0781 s (ICEA P-32-382).
 */
const S = 'NFPA 70-2023 110.10; ICEA P-32-382 (common practice)';
const tap = (o: Partial<WithstandFacts> = {}): WithstandFacts => ({
  edition: 2023,
  conductorIds: ['TAP-1' as ConductorId],
  material: 'cu',
  size: '1/0',
  parallelSets: 1,
  areaCmil: 105_600,
  initialC: 75,
  finalC: 150,
  thermalClass: 'thermoplastic',
  device: 'breaker CB-F',
  clearingTimeS: 0.025,
  clearingBasis: 'molded-case breaker on its instantaneous trip, about 1.5 cycles, common practice',
  faultKA: 20,
  upperBound: false,
  smallestSize: '4',
  ...o,
});

export const cases: RuleCases<WithstandFacts> = {
  meets: [
    { name: '1/0 Cu THHN-rated 75 → 150 °C at 20 kA allows 0.0781 s; a molded-case breaker clears in 0.025 s', facts: tap(), source: S },
    { name: 'two sets of 1/0 Cu at 40 kA share it: same 0.0781 s against 0.05 s', facts: tap({ parallelSets: 2, faultKA: 40, clearingTimeS: 0.05 }), source: S },
  ],
  fails: [
    { name: '1/0 Cu at 20 kA behind a power breaker on a 0.3 s short-time band (0.35 s): 0.0781 s is not enough; 250 kcmil withstands', facts: tap({ clearingTimeS: 0.35, clearingBasis: 'entered', smallestSize: '250' }), expect: ['withstand'], source: S },
    { name: '12 AWG Cu (6530 cmil) at 10 kA survives 0.0012 s; only a current-limiting device in its range protects it', facts: tap({ size: '12', areaCmil: 6530, faultKA: 10, smallestSize: '3' }), expect: ['withstand'], source: S },
  ],
  unknown: [
    { name: 'fault current unknown', facts: tap({ faultKA: null, smallestSize: null }), expect: ['withstand'], source: S },
    // Issue 6, item 13: without a size there is no area (Chapter 9 Table 8), so the time it withstands is unknown.
    { name: 'drawn without a size (needs the size): 20 kA known, no conductor area, so unknown, never failed', facts: tap({ size: null, areaCmil: null }), expect: ['withstand'], source: `${S}; common practice (an unknown fact is asked for, not judged)` },
  ],
};

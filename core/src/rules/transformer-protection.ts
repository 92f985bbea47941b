import { maxPrimaryOcpd, maxSecondaryOcpd, ocpdLimitA } from '../tables/transformer';
import { atLeast, defineRule, when, type Check } from './define';

/**
 * 450.3(B) (transformers of 1000 V and less): the primary device may not
 * exceed 125 % of primary rated current when it alone protects the
 * transformer (next standard size allowed from 9 A up; 167 % from 2 A, 300 %
 * below), or 250 % when every secondary run also ends in a device of at most
 * 125 % of secondary rated current. Judged on the primary run; it adds a
 * finding and never decides a conductor's verdict.
 */
export const transformerProtection = defineRule({
  id: 'transformer-protection',
  verdict: null,
  family: 'transformer-protection',
  section: 'Table 450.3(B)',
  title: 'Transformer overcurrent protection',
  messages: {
    primary:
      'The primary device ({{primaryA}} A) must not exceed {{allowedA}} A: {{pct}} % of the {{flaA}} A primary rated current ({{scheme}}).',
    secondary:
      'The secondary devices ({{secondaryA}} A in all) must not exceed {{allowedA}} A: {{pct}} % of the {{flaA}} A secondary rated current.',
  },
  check(f) {
    const t = f.transformer;
    if (!t) return [];
    const device = f.supplyOcpdKind ?? 'breaker';
    const ends = f.secondaries.map((s) => s.termination);
    // Every secondary run ends in a device: primary-and-secondary protection, even while a rating is still missing.
    const secondaryProtected = ends.length > 0 && ends.every((e) => e.kind === 'ocpd');
    const scheme = secondaryProtected ? 'primary-and-secondary' : 'primary-only';
    const p = maxPrimaryOcpd(t.primaryFlaA, scheme, f.edition, device);
    const out: Check<'primary' | 'secondary'>[] = [
      when('primary', atLeast(ocpdLimitA(p), t.primaryOcpdA), {
        primaryA: t.primaryOcpdA ?? '?',
        allowedA: ocpdLimitA(p),
        pct: p.maxPct,
        flaA: round2(t.primaryFlaA),
        scheme: secondaryProtected ? 'secondary protected as well' : 'primary protection only',
      }),
    ];
    if (secondaryProtected) {
      const s = maxSecondaryOcpd(t.secondaryFlaA, f.edition, device);
      const known = ends.every((e) => e.ratingA !== null);
      const sum = ends.reduce((a, e) => a + (e.ratingA ?? 0), 0);
      const limitA = ocpdLimitA(s);
      out.push(when('secondary', known ? sum <= limitA : null, { secondaryA: known ? sum : '?', allowedA: limitA, pct: s.maxPct, flaA: round2(t.secondaryFlaA) }));
    }
    return out;
  },
});

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

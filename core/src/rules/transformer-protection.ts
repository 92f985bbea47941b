import { maxPrimaryOcpd, maxSecondaryOcpd, ocpdLimitA } from '../tables/transformer';
import { atLeast, defineRule, when, type Check } from './define';
import { secondaryDevices } from './secondaryDevices';

/**
 * 450.3(B) (transformers of 1000 V and less): the primary device may not
 * exceed 125 % of primary rated current when it alone protects the
 * transformer (next standard size allowed from 9 A up; 167 % from 2 A, 300 %
 * below), or 250 % when every secondary run also ends in a device of at most
 * 125 % of secondary rated current. Note 2: up to six breakers or sets of
 * fuses grouped in one location (a board without a main) are that device,
 * their ratings added. Judged on the primary run; it adds a finding and never
 * decides a conductor's verdict.
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
      'The {{devices}} secondary device(s) ({{secondaryText}}, Note 2) must not exceed {{allowedA}} A: {{pct}} % of the {{flaA}} A secondary rated current.',
  },
  check(f) {
    const t = f.transformer;
    if (!t) return [];
    const device = f.supplyOcpdKind ?? 'breaker';
    // Every secondary run ends in a device (Note 2: up to six grouped): primary-and-secondary protection, even while a rating is still missing.
    const devices = secondaryDevices(f.secondaries.length > 0 ? f.secondaries.map((s) => s.termination) : t.secondaryEnds);
    const secondaryProtected = devices.present;
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
      const sum = devices.sumA;
      const limitA = ocpdLimitA(s);
      out.push(when('secondary', sum === null ? null : sum <= limitA, { secondaryText: sum === null ? 'ratings not all given' : `${sum} A in all`, devices: devices.count, allowedA: limitA, pct: s.maxPct, flaA: round2(t.secondaryFlaA) }));
    }
    return out;
  },
});

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

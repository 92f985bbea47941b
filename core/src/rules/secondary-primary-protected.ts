import { maxPrimaryOcpd, ocpdLimitA } from '../tables/transformer';
import { atLeast, defineRule, when } from './define';
import { secondaryDevices } from './secondaryDevices';

/**
 * 240.21(C)(1): secondary conductors protected by the primary device, for a
 * 2-wire single-voltage or 3-wire delta-delta secondary, when the primary
 * device meets 450.3 and does not exceed secondary ampacity × Vs / Vp.
 * 450.3(B) is read as Table 450.3(B) reads it: with a secondary device at the
 * end of every secondary run (Note 2: up to six grouped), the primary device
 * may be 250 %; without, 125 % (Note 1 round-up). The two checks agree with
 * the transformer-protection rule.
 */
export const secondaryPrimaryProtected = defineRule({
  id: 'secondary-primary-protected',
  verdict: 'secondary-primary-protected',
  family: 'transformer-secondary',
  section: '240.21(C)(1)',
  title: 'Secondary protected by the primary device',
  sizeIndependent: ['connection', 'primary450'],
  messages: {
    connection: 'Must be a single-phase 2-wire or three-phase 3-wire delta-delta secondary (here: {{connection}}).',
    primary450: 'The primary device ({{primaryA}} A) must meet Table 450.3(B), {{scheme}}: at most {{allowedA}} A ({{pct}} % of {{flaA}} A, next standard size where allowed).',
    ratio: 'The primary device ({{primaryA}} A) must not exceed the secondary ampacity {{ampacityA}} A × {{vs}} V / {{vp}} V ({{maxA}} A).',
  },
  check(f) {
    const t = f.transformer;
    const P = t?.primaryOcpdA ?? null;
    const secondaryProtected = t ? secondaryDevices(t.secondaryEnds).present : false;
    const limit = t ? maxPrimaryOcpd(t.primaryFlaA, secondaryProtected ? 'primary-and-secondary' : 'primary-only', f.edition, 'breaker') : null;
    const maxA = t && f.ampacityA !== null ? (f.ampacityA * t.secondaryVoltsLL) / t.primaryVoltsLL : null;
    return [
      when('connection', t ? t.connection === 'single-phase-2w' || t.connection === 'delta-delta-3w' : false, { connection: t?.connection ?? '?' }),
      when('primary450', limit ? atLeast(ocpdLimitA(limit), P) : null, {
        primaryA: P ?? '?',
        allowedA: limit ? ocpdLimitA(limit) : '?',
        pct: limit?.maxPct ?? '?',
        scheme: secondaryProtected ? 'with a secondary device as well' : 'primary protection only',
        flaA: t ? Math.round(t.primaryFlaA * 100) / 100 : '?',
      }),
      when('ratio', atLeast(maxA, P), { primaryA: P ?? '?', ampacityA: f.ampacityA ?? '?', vs: t?.secondaryVoltsLL ?? '?', vp: t?.primaryVoltsLL ?? '?', maxA: maxA ?? '?' }),
    ];
  },
});

import type { Check } from './define';
import { damageCheck, defineRule, deviceLimitCheck, singleDeviceCheck, when, loadCheck, LOAD_MESSAGE } from './define';
import type { RunFacts } from './facts';

type Id = 'outdoors' | 'load' | 'damage' | 'single' | 'device' | 'atDisconnect' | 'accessible';

/** The checks 240.21(B)(5) and 240.21(C)(4) share: outside conductors of any length. */
export function outsideChecks(f: RunFacts): Check<Id>[] {
  const t = f.termination;
  const location = t.kind === 'ocpd' ? t.disconnectLocation : null;
  return [
    when('outdoors', f.outdoors),
    loadCheck(f),
    damageCheck(f),
    singleDeviceCheck(f),
    deviceLimitCheck(f),
    when('atDisconnect', t.kind === 'ocpd' && t.atDisconnectingMeans),
    when('accessible', location === null ? (t.kind === 'ocpd' ? null : false) : location !== 'elsewhere', {
      location: location ?? 'not given',
    }),
  ];
}

export const OUTSIDE_MESSAGES = {
  outdoors: 'Must be outdoors of a building except at the point of termination.',
  load: LOAD_MESSAGE,
  damage: 'Must be protected from physical damage (here: {{protection}}).',
  single: 'Must end in a single circuit breaker or a single set of fuses (ends in: {{termination}}).',
  device: 'The device at the end ({{deviceA}} A) must not exceed the ampacity ({{ampacityA}} A).',
  atDisconnect: 'That device must be part of, or next to, the disconnecting means.',
  accessible: 'The disconnecting means must be readily accessible outside, or inside nearest the point of entrance (here: {{location}}).',
} as const;

/** 240.21(B)(5): outside feeder taps of unlimited length. */
export const tapOutside = defineRule<Id>({
  id: 'tap-outside',
  verdict: 'tap-outside',
  family: 'feeder-tap',
  section: '240.21(B)(5)',
  title: 'Outside feeder tap, any length',
  sizeIndependent: ['outdoors', 'damage', 'single', 'atDisconnect', 'accessible'],
  messages: OUTSIDE_MESSAGES,
  check: outsideChecks,
});

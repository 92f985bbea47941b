import { motorMaxDeviceA, type MotorDeviceKind } from '../tables/motor';
import { defineRule, when } from './define';
import type { RunFacts } from './facts';

const DEVICE_WORDS: Record<MotorDeviceKind, string> = {
  'inverse-time-breaker': 'inverse-time breaker',
  'instantaneous-trip-breaker': 'instantaneous-trip breaker',
  'dual-element-fuse': 'dual-element (time-delay) fuse',
  'non-time-delay-fuse': 'non-time-delay fuse',
};

/** The Table 430.52 column of the device ahead; a fuse whose delay is not stated gives both fuse columns. */
function columnsOf(f: RunFacts): { kinds: MotorDeviceKind[]; note: string } {
  if (f.supplyOcpdKind === 'fuse') {
    if (f.supplyDeviceType === 'time-delay') return { kinds: ['dual-element-fuse'], note: '' };
    if (f.supplyDeviceType === 'non-time-delay') return { kinds: ['non-time-delay-fuse'], note: '' };
    return { kinds: ['dual-element-fuse', 'non-time-delay-fuse'], note: ' (fuse type not stated)' };
  }
  if (f.supplyDeviceType === 'instantaneous') return { kinds: ['instantaneous-trip-breaker'], note: '' };
  return { kinds: ['inverse-time-breaker'], note: f.supplyDeviceType === null ? ' (trip type not stated, taken as inverse-time)' : '' };
}

/**
 * The largest device 430.52 allows ahead of this motor run: the first
 * column's limit, and the largest of the columns a device not fully
 * described could be.
 */
export function motorDeviceLimit(f: RunFacts): { lowA: number; highA: number; pct: string; rawA: string; device: string } | null {
  const m = f.motor;
  if (!m) return null;
  const { kinds, note } = columnsOf(f);
  const limits = kinds.map((k) => motorMaxDeviceA(m.fullLoadA, m.motorType, k, f.edition));
  return {
    lowA: Math.min(...limits.map((l) => l.allowedA)),
    highA: Math.max(...limits.map((l) => l.allowedA)),
    pct: limits.map((l) => `${l.pct} %`).join(' or '),
    rawA: limits.map((l) => `${l.rawA} A`).join(' or '),
    device: kinds.map((k) => DEVICE_WORDS[k]).join(' or ') + note,
  };
}

/**
 * 430.52(C)(1) and Table 430.52 (2023: Table 430.52(C)(1)): the branch-circuit
 * short-circuit and ground-fault device ahead of a motor is at most the table
 * percentage of its full-load current, or the next standard rating above when
 * that is not one (Exception No. 1). A fuse whose delay is not stated is
 * judged on both fuse columns: within the smaller it holds, above the larger
 * it fails, between them it is unknown until the fuse type is given.
 */
export const motorDevice = defineRule({
  id: 'motor-device',
  verdict: null,
  family: 'motor',
  section: '430.52',
  title: 'Motor branch-circuit short-circuit and ground-fault device',
  messages: {
    device:
      'The {{device}} ahead ({{deviceA}} A) must not exceed {{pct}} of the {{flcA}} A full-load current ({{rawA}}), or the next standard rating above it: {{allowedA}} A.',
  },
  check(f) {
    const lim = motorDeviceLimit(f);
    if (!lim) return [];
    const R = f.supplyOcpdA;
    const ok = R === null ? null : R <= lim.lowA + 1e-6 ? true : R > lim.highA + 1e-6 ? false : null;
    return [
      when('device', ok, {
        device: lim.device,
        deviceA: R ?? '?',
        pct: lim.pct,
        flcA: f.motor!.fullLoadA,
        rawA: lim.rawA,
        allowedA: lim.lowA === lim.highA ? lim.lowA : `${lim.lowA} A or ${lim.highA}`,
      }),
    ];
  },
});

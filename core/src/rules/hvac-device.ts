import { defineRule, when } from './define';

/**
 * 440.22(C) with 440.4(B): the branch-circuit short-circuit and ground-fault
 * device ahead of air-conditioning or refrigeration equipment does not exceed
 * the maximum the nameplate marks (MOP).
 */
export const hvacDevice = defineRule({
  id: 'hvac-device',
  verdict: null,
  family: 'hvac',
  section: '440.22',
  title: 'HVAC branch-circuit device at most the nameplate maximum',
  messages: {
    device: 'The device ahead ({{deviceA}} A) must not exceed the nameplate maximum overcurrent device (MOP) of {{mopA}} A.',
  },
  check(f) {
    const h = f.hvac;
    if (!h) return [];
    const R = f.supplyOcpdA;
    return [when('device', R === null ? null : R <= h.mopA, { deviceA: R ?? '?', mopA: h.mopA })];
  },
});

import { atLeast, defineRule, when } from './define';
import { hvacDevice } from './hvac-device';

/**
 * 240.4(G): an air-conditioning or refrigeration equipment circuit's
 * conductors are protected as Article 440 says: at least the nameplate
 * minimum circuit ampacity (440.35, MCA) behind a device no larger than the
 * nameplate maximum (440.22, MOP). The conductor's verdict.
 */
export const hvacCircuit = defineRule({
  id: 'hvac-circuit',
  verdict: 'hvac-circuit',
  family: 'hvac',
  section: '240.4(G)',
  title: 'HVAC equipment circuit protected under Article 440',
  messages: {
    mca: 'Ampacity ({{ampacityA}} A) must be at least the nameplate minimum circuit ampacity (MCA) of {{mcaA}} A (440.35).',
    ...hvacDevice.messages,
  },
  check(f) {
    const h = f.hvac;
    if (!h) return [];
    return [when('mca', atLeast(f.ampacityA, h.mcaA), { ampacityA: f.ampacityA ?? '?', mcaA: h.mcaA }), ...hvacDevice.check(f)];
  },
});

import { defineRule } from './define';
import { motorConductor } from './motor-conductor';
import { motorDevice } from './motor-device';

/**
 * 240.4(G): a motor branch circuit's conductors are protected as Article 430
 * says, not by 240.4's general rule: conductors of at least 125 % of the
 * full-load current (430.22) behind a short-circuit and ground-fault device no
 * larger than Table 430.52 allows (430.52), with the motor's overload device
 * (430.32) guarding against overload. The conductor's verdict.
 */
export const motorCircuit = defineRule({
  id: 'motor-circuit',
  verdict: 'motor-circuit',
  family: 'motor',
  section: '240.4(G)',
  title: 'Motor branch circuit protected under Article 430',
  messages: { ...motorConductor.messages, ...motorDevice.messages },
  check(f) {
    return [...motorConductor.check(f), ...motorDevice.check(f)];
  },
});

import { defineRule } from './define';
import { OUTSIDE_MESSAGES, outsideChecks } from './tap-outside';

/** 240.21(C)(4): outside secondary conductors of any length. */
export const secondaryOutside = defineRule({
  id: 'secondary-outside',
  verdict: 'secondary-outside',
  family: 'transformer-secondary',
  section: '240.21(C)(4)',
  title: 'Outside transformer secondary, any length',
  sizeIndependent: ['outdoors', 'damage', 'single', 'atDisconnect', 'accessible'],
  messages: OUTSIDE_MESSAGES,
  check: outsideChecks,
});

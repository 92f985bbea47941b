import { atLeast, defineRule, when } from './define';

/** 430.22: a single motor's branch-circuit conductors carry at least 125 % of its full-load current. */
export const motorConductor = defineRule({
  id: 'motor-conductor',
  verdict: null,
  family: 'motor',
  section: '430.22',
  title: 'Motor branch-circuit conductor, 125 % of full-load current',
  messages: {
    ampacity: 'Ampacity ({{ampacityA}} A) must be at least 125 % of the motor\'s {{flcA}} A full-load current ({{source}}): {{minA}} A.',
  },
  check(f) {
    const m = f.motor;
    if (!m) return [];
    const minA = Math.round(m.fullLoadA * 125) / 100;
    return [when('ampacity', atLeast(f.ampacityA, minA), { ampacityA: f.ampacityA ?? '?', flcA: m.fullLoadA, minA, source: m.source })];
  },
});

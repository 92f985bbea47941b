import { defineRule, when } from './define';
import type { VoltageDropFacts } from './studyFacts';

/**
 * The informational notes to 210.19 and 215.2 recommend at most 3 % drop on
 * one feeder or branch circuit and 5 % from the service to the farthest
 * outlet. Recommendations, not requirements, so the finding is a warning;
 * both limits are project settings (some energy codes ask less).
 */
export const voltageDropRule = defineRule({
  id: 'voltage-drop',
  verdict: null,
  family: 'study',
  section: '210.19 and 215.2 informational notes',
  title: 'Voltage drop',
  messages: {
    circuit: '{{subject}}: voltage drop of the circuit {{pct}} % should be at most {{limitPct}} %.',
    total: '{{subject}}: voltage drop from the source {{pct}} % should be at most {{limitPct}} %.',
  },
  check(f: VoltageDropFacts) {
    return [when(f.scope, f.pct === null ? null : f.pct <= f.limitPct + 1e-9, { subject: f.subject, pct: f.pct === null ? '?' : Math.round(f.pct * 100) / 100, limitPct: f.limitPct })];
  },
});

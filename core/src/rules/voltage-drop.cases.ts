import type { RuleCases } from './testing';
import type { VoltageDropFacts } from './studyFacts';

const S = 'NFPA 70-2023 210.19(A) and 215.2(A) informational notes';
const vd = (o: Partial<VoltageDropFacts> = {}): VoltageDropFacts => ({ edition: 2023, scope: 'circuit', subject: 'Conductor F-1', pct: 1.71, limitPct: 3, ...o });

export const cases: RuleCases<VoltageDropFacts> = {
  meets: [
    { name: 'feeder 1.71 % ≤ 3 %', facts: vd(), source: S },
    { name: 'feeder 1.71 % + branch 1.92 % = 3.63 % ≤ 5 % in total', facts: vd({ scope: 'total', subject: 'Load LT-1', pct: 3.63, limitPct: 5 }), source: S },
  ],
  fails: [
    { name: 'branch 3.4 % > 3 %', facts: vd({ pct: 3.4 }), expect: ['circuit'], source: S },
    { name: 'total 5.6 % > 5 %', facts: vd({ scope: 'total', pct: 5.6, limitPct: 5 }), expect: ['total'], source: S },
    { name: 'a project setting of 2 % (an energy code) fails a 2.5 % circuit', facts: vd({ pct: 2.5, limitPct: 2 }), expect: ['circuit'], source: `${S}; limit a project setting (common practice)` },
  ],
  unknown: [{ name: 'length missing', facts: vd({ pct: null }), expect: ['circuit'], source: S }],
};

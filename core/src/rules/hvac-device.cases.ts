import { hvacRunFacts, type RuleCases } from './testing';

const S = 'NFPA 70-2023 440.22(C), 440.4(B)';

export const cases: RuleCases = {
  meets: [
    { name: 'a 25 A breaker on a unit marked MOP 25 A: at the limit', facts: hvacRunFacts(), source: S },
    { name: 'a 20 A breaker on a unit marked MOP 25 A', facts: hvacRunFacts({ supplyOcpdA: 20 }), source: S },
  ],
  fails: [{ name: 'a 30 A breaker on a unit marked MOP 25 A: across the limit', facts: hvacRunFacts({ supplyOcpdA: 30 }), expect: ['device'], source: S }],
  unknown: [{ name: 'rating of the breaker ahead not given', facts: hvacRunFacts({ supplyOcpdA: null }), expect: ['device'], source: S }],
};

import { motorRunFacts, type RuleCases } from './testing';

const S = 'NFPA 70-2023 430.52(C)(1), Table 430.52(C)(1) and Exception No. 1; 240.6(A)';
const fuse = (ratingA: number | null, type: 'time-delay' | 'non-time-delay' | null) =>
  motorRunFacts({ supplyOcpdA: ratingA, supplyOcpdKind: 'fuse', supplyDeviceType: type });

export const cases: RuleCases = {
  meets: [
    {
      name: 'inverse-time breaker, 27 A motor: 250 % is 67.5 A, not a standard rating, so the next one up, 70 A, is allowed',
      facts: motorRunFacts(),
      source: S,
    },
    {
      name: 'dual-element fuse, 27 A motor: 175 % is 47.25 A, next standard 50 A; a 50 A time-delay fuse is at the limit',
      facts: fuse(50, 'time-delay'),
      source: S,
    },
    {
      name: 'non-time-delay fuse, 27 A motor: 300 % is 81 A, next standard 90 A; a 90 A fuse is at the limit',
      facts: fuse(90, 'non-time-delay'),
      source: S,
    },
    {
      name: 'fuse type not stated, 27 A motor: a 50 A fuse is within what either kind allows (50 A and 90 A)',
      facts: fuse(50, null),
      source: S,
    },
    {
      name: 'instantaneous-trip breaker, 27 A motor: 800 % is 216 A, next standard 225 A; 200 A is within it',
      facts: motorRunFacts({ supplyOcpdA: 200, supplyDeviceType: 'instantaneous' }),
      source: S,
    },
    {
      name: 'Design B energy-efficient motor, instantaneous trip: 1100 % of 27 A is 297 A, next standard 300 A',
      facts: motorRunFacts({ supplyOcpdA: 300, supplyDeviceType: 'instantaneous', motorFacts: { motorType: 'design-b-energy-efficient' } }),
      source: S,
    },
  ],
  fails: [
    {
      name: 'inverse-time breaker, 27 A motor: 80 A is above the 70 A that 250 % with the next size up allows',
      facts: motorRunFacts({ supplyOcpdA: 80 }),
      expect: ['device'],
      source: S,
    },
    {
      name: 'dual-element fuse, 27 A motor: 60 A is above 50 A',
      facts: fuse(60, 'time-delay'),
      expect: ['device'],
      source: S,
    },
    {
      name: 'fuse type not stated, 27 A motor: 100 A is above what even a non-time-delay fuse may be (90 A)',
      facts: fuse(100, null),
      expect: ['device'],
      source: S,
    },
    {
      name: 'wound-rotor motor, 27 A: 150 % is 40.5 A, next standard 45 A; a 50 A breaker is too large',
      facts: motorRunFacts({ supplyOcpdA: 50, motorFacts: { motorType: 'wound-rotor' } }),
      expect: ['device'],
      source: S,
    },
  ],
  unknown: [
    {
      name: 'fuse type not stated, 27 A motor: a 70 A fuse is allowed if non-time-delay (90 A) and not if time-delay (50 A)',
      facts: fuse(70, null),
      expect: ['device'],
      source: S,
    },
    {
      name: 'rating of the breaker ahead not given',
      facts: motorRunFacts({ supplyOcpdA: null }),
      expect: ['device'],
      source: S,
    },
  ],
};

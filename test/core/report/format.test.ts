import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES, VERDICTS, type DeviceRef, type NodeId } from '@linewright/core';
import { VERDICT_WORDS, conductorText, deviceText, hasViolations, labelStatesRating, numberFindings, sizeText, verdictClass, verdictText } from '../../../core/src/report/format';
import { fixtureReport, cleanReport } from './fixture';

describe('report words', () => {
  it('names sizes as Table 310.16 does: AWG through 4/0, kcmil from 250 (NFPA 70-2023 Table 310.16)', () => {
    expect(sizeText('14')).toBe('14 AWG');
    expect(sizeText('4/0')).toBe('4/0 AWG');
    expect(sizeText('250')).toBe('250 kcmil');
    expect(sizeText('2000')).toBe('2000 kcmil');
    const kcmil = CONDUCTOR_SIZES.filter((s) => sizeText(s).endsWith('kcmil'));
    expect(kcmil[0]).toBe('250');
    expect(kcmil).toHaveLength(CONDUCTOR_SIZES.length - CONDUCTOR_SIZES.indexOf('250'));
  });

  it('shows parallel sets only when there are several', () => {
    expect(conductorText({ parallelSets: 1, size: '3/0', material: 'al' })).toBe('3/0 AWG Al');
    expect(conductorText({ parallelSets: 3, size: '500', material: 'cu' })).toBe('3×500 kcmil Cu');
  });

  it('has words for every verdict, none of them "approved", and every verdict in one legend class', () => {
    expect(Object.keys(VERDICT_WORDS).sort()).toEqual([...VERDICTS].sort());
    for (const v of VERDICTS) {
      expect(VERDICT_WORDS[v]).not.toMatch(/approv/i);
      expect(['protected', 'tap-rule', 'failing', 'incomplete']).toContain(verdictClass(v));
    }
    expect(verdictText({ verdict: 'tap-25ft', cites: { code: 'NEC', edition: 2023, section: '240.21(B)(2)' } })).toBe('tap: 25 ft (240.21(B)(2))');
    expect(verdictText({ verdict: 'unprotected', cites: null })).toBe('unprotected');
  });

  it('does not repeat a rating the device label already states', () => {
    const d = (label: string, ratingA: number | null): DeviceRef => ({ id: 'X' as NodeId, kind: 'breaker', label, ratingA });
    expect(deviceText(d('MDP-2 roof feeder 400 A', 400))).toBe('MDP-2 roof feeder 400 A');
    expect(deviceText(d('MDP-2 roof feeder', 400))).toBe('MDP-2 roof feeder 400 A');
    expect(deviceText(d('Panel 1400 A bus', 400))).toBe('Panel 1400 A bus 400 A');
    expect(deviceText(d('CB-1', null))).toBe('CB-1 (rating ?)');
    expect(deviceText(null)).toBe('none');
    expect(labelStatesRating('fuse 17.5A', 17.5)).toBe(true);
  });

  it('numbers findings violation first, then needs AHJ review, warning, info', () => {
    expect(numberFindings(fixtureReport.findings).map((x) => [x.n, x.finding.severity])).toEqual([
      [1, 'violation'],
      [2, 'needs-ahj'],
      [3, 'warning'],
      [4, 'info'],
    ]);
  });

  it('counts a violation finding or a failing verdict as a violation (exit code 1)', () => {
    expect(hasViolations(fixtureReport)).toBe(true);
    expect(hasViolations(cleanReport)).toBe(false);
    expect(hasViolations({ findings: [], conductors: fixtureReport.conductors })).toBe(true);
  });
});

import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../../core/src/analyze/analyze';
import { loadProject } from '../../../core/src/model/load';
import { SCHEDULE_COLUMNS, toConductorScheduleCsv } from '../../../core/src/report/csv';
import { toJsonReport } from '../../../core/src/report/json';
import { loadDropRows } from '../../../core/src/report/studies';
import { renderText } from '../../../core/src/report/text';
import { renderPermitPdf } from '../../../core/src/report/pdf';

let hasPdftotext = true;
try {
  execFileSync('pdftotext', ['-v'], { stdio: 'ignore' });
} catch {
  hasPdftotext = false;
}

const loadSample = (name: string) => {
  const r = loadProject(JSON.parse(readFileSync(new URL(`../../../samples/${name}.json`, import.meta.url), 'utf8')));
  if (!r.ok) throw new Error('sample refused');
  return r.project;
};
const sample = (name: string) => {
  const r = loadProject(JSON.parse(readFileSync(new URL(`../../../samples/${name}.json`, import.meta.url), 'utf8')));
  if (!r.ok) throw new Error('sample refused');
  return analyze(r.project);
};

describe('study figures in the reports', () => {
  const report = sample('demo-clinic');

  it('the JSON report carries a studies section: kA and X/R per node, VD per conductor, the 110.24 list', () => {
    const j = toJsonReport(report).studies!;
    expect(j.shortCircuit).toHaveLength(report.studies!.faults.length);
    const util = j.shortCircuit.find((f) => f.node === 'UTIL')!;
    expect(util.kA).toBe(42);
    expect(j.voltageDrop.conductors.map((c) => c.id)).toEqual(report.conductors.map((c) => c.id));
    expect(j.serviceMarkings.map((m) => m.node)).toEqual(['MSB-MAIN']);
  });

  it('by default a short-circuit row is node, kA and atMost; --detail full adds the working (docs/report-json.md)', () => {
    const summary = toJsonReport(report).studies!.shortCircuit;
    const full = toJsonReport(report, { detail: 'full' }).studies!.shortCircuit;
    expect(summary.map((r) => Object.keys(r))).toEqual(summary.map(() => ['node', 'kA', 'atMost']));
    expect(Object.keys(full[0]!)).toEqual(['node', 'kA', 'xOverR', 'lineToGroundKA', 'motorKA', 'atMost', 'voltsLL', 'unknownWhy']);
    expect(full.map(({ node, kA, atMost }) => ({ node, kA, atMost }))).toEqual(summary);
    expect(full.find((r) => r.node === 'UTIL')!.xOverR).not.toBeNull();
  });

  it('each load row adds up: the segments from the source to the load sum to its total', () => {
    const rows = loadDropRows(report);
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(r.segments.reduce((a, g) => a + (g.pct ?? 0), 0)).toBeCloseTo(r.totalPct!, 9);
  });

  it('the text report prints both tables and the CSV schedule ends with the study columns', () => {
    const text = renderText(report);
    expect(text).toContain('SHORT-CIRCUIT');
    expect(text).toContain('VOLTAGE DROP');
    const header = toConductorScheduleCsv(report).split('\r\n')[0]!.split(',');
    expect(header.slice(-4)).toEqual(['fault_ka_at_supply', 'vd_pct', 'vd_circuit_pct', 'vd_total_pct']);
    expect(SCHEDULE_COLUMNS).toContain('vd_total_pct');
  });

  it.skipIf(!hasPdftotext)('the permit PDF carries the short-circuit table (node, kA, X/R) and the voltage-drop table (load, % by segment, total) (needs pdftotext)', () => {
    const project = loadSample('demo-clinic');
    const dir = mkdtempSync(join(tmpdir(), 'lw-studies-'));
    try {
      const file = join(dir, 'set.pdf');
      writeFileSync(file, renderPermitPdf(project, analyze(project), { generatedAt: '2026-01-01T00:00:00Z' }));
      const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
      expect(text).toContain('Available fault current (short-circuit study)');
      expect(text).toMatch(/UTIL\s.*42\.00 kA\s+6\.0/);
      expect(text).toContain('Voltage drop (limits 3 % per circuit, 5 % total)');
      // LTG-1 is a 277 V lighting load (line to neutral): its branch B-LP1-1 alone is 2 × 90 ft × 13 A ×
      // (2.0 × 0.9 + 0.068 × 0.436) Ω/1000 ft = 4.28 V of 277 V = 1.55 % (NFPA 70 Chapter 9 Table 9, 12 AWG Cu
      // in steel conduit; approximate drop formula of Table 9 Note 2); with the feeders above it, 1.62 %.
      expect(text).toMatch(/LTG-1\s+1\.62 %/);
      expect(text).toContain('110.24 marking');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

import type { AnalysisReport } from '../analyze/types';
import type { StudiesReport } from '../studies/types';

/**
 * The short-circuit and voltage-drop figures as the reports carry them: one
 * section of the JSON report, the two tables of the text report and the PDF
 * (node, kA, X/R; load, % by segment, total), and the CSV columns. Figures are
 * rounded as a reviewer reads them: kA to 0.01, X/R to 0.1, % to 0.01.
 */

const r2 = (x: number | null): number | null => (x === null ? null : Math.round(x * 100) / 100);
const r1 = (x: number | null): number | null => (x === null || !Number.isFinite(x) ? null : Math.round(x * 10) / 10);

/** One node's row of `shortCircuit`: `node`, `kA` and `atMost` always; the rest only with `detail: 'full'`. */
export interface JsonShortCircuit {
  node: string;
  kA: number | null;
  xOverR?: number | null;
  lineToGroundKA?: number | null;
  motorKA?: number;
  atMost: boolean;
  voltsLL?: number | null;
  unknownWhy?: string | null;
}

export interface JsonStudies {
  notes: string[];
  shortCircuit: JsonShortCircuit[];
  serviceMarkings: { node: string; kA: number | null; atMost: boolean; date: string | null }[];
  withstand: { conductorIds: string[]; faultKA: number | null; clearingTimeS: number; clearingBasis: string; allowedS: number | null; withstands: boolean | null }[];
  voltageDrop: {
    circuitLimitPct: number;
    totalLimitPct: number;
    conductors: { id: string; currentA: number | null; powerFactor: number | null; pct: number | null; circuitPct: number | null; totalPct: number | null }[];
  };
}

/**
 * The `studies` section of the JSON report (docs/report-json.md), keys in a fixed order. A row per
 * node is a third of a default report; by default it carries the figure a reviewer marks and
 * compares ratings with (kA, and whether it is an upper bound), and `full` adds the working.
 */
export function jsonStudies(s: StudiesReport, full = false): JsonStudies {
  return {
    notes: [...s.notes],
    shortCircuit: s.faults.map(
      (f): JsonShortCircuit =>
        full
          ? {
              node: f.nodeId,
              kA: r2(f.kA),
              xOverR: r1(f.xOverR),
              lineToGroundKA: r2(f.lineToGroundKA),
              motorKA: r2(f.motorKA) ?? 0,
              atMost: f.upperBound,
              voltsLL: f.voltsLL,
              unknownWhy: f.unknownWhy ?? null,
            }
          : { node: f.nodeId, kA: r2(f.kA), atMost: f.upperBound },
    ),
    serviceMarkings: s.serviceMarkings.map((m) => ({ node: m.nodeId, kA: r2(m.kA), atMost: m.upperBound, date: m.date })),
    withstand: s.withstand.map((w) => ({ conductorIds: [...w.conductorIds], faultKA: r2(w.faultKA), clearingTimeS: w.clearingTimeS, clearingBasis: w.clearingBasis, allowedS: w.allowedS === null ? null : Number(w.allowedS.toPrecision(3)), withstands: w.withstands })),
    voltageDrop: {
      circuitLimitPct: s.voltageDrop.circuitLimitPct,
      totalLimitPct: s.voltageDrop.totalLimitPct,
      conductors: s.voltageDrop.conductors.map((c) => ({ id: c.conductorId, currentA: r2(c.currentA), powerFactor: r2(c.powerFactor), pct: r2(c.pct), circuitPct: r2(c.circuitPct), totalPct: r2(c.totalPct) })),
    },
  };
}

/** "18.2 kA", "≤ 18.2 kA" for an upper bound, "unknown". */
export function faultText(kA: number | null, atMost: boolean): string {
  if (kA === null) return 'unknown';
  return `${atMost ? '≤ ' : ''}${(Math.round(kA * 100) / 100).toFixed(kA >= 100 ? 1 : 2)} kA`;
}

export function pctText(pct: number | null): string {
  return pct === null ? '—' : `${(Math.round(pct * 100) / 100).toFixed(2)} %`;
}

/** One row of the voltage-drop table: a load, the drop of each conductor from the source or transformer to it, and the total. */
export interface LoadDropRow {
  loadId: string;
  segments: { conductorId: string; pct: number | null }[];
  totalPct: number | null;
}

/**
 * The voltage-drop table: each load with the conductors from its source or
 * transformer secondary down to it. Each path is walked once per load (a load's
 * depth), and only for the loads asked for.
 */
export function loadDropRows(report: AnalysisReport, limit = Number.POSITIVE_INFINITY): LoadDropRow[] {
  const s = report.studies;
  if (!s) return [];
  const arriving = new Map<string, number>();
  report.conductors.forEach((c, i) => arriving.set(c.to, i));
  const kindOf = new Map(s.faults.map((f) => [f.nodeId as string, f]));
  const rows: LoadDropRow[] = [];
  for (const f of s.faults) {
    if (rows.length >= limit) break;
    if (f.kind !== 'load') continue;
    const segments: LoadDropRow['segments'] = [];
    let at: string | null = f.nodeId;
    let totalPct: number | null = null;
    for (let guard = 0; at !== null && guard < 10_000; guard++) {
      const ci = arriving.get(at);
      const node = kindOf.get(at);
      if (ci === undefined) {
        // Bus links carry no drop; follow them up to the next conductor.
        at = node?.parentId ?? null;
        if (at !== null && isSourceOrTransformer(kindOf.get(at)?.kind)) break;
        continue;
      }
      const c = report.conductors[ci]!;
      const d = s.voltageDrop.conductors[ci]!;
      if (segments.length === 0) totalPct = d.totalPct;
      segments.unshift({ conductorId: c.id, pct: d.pct });
      at = c.from;
      if (isSourceOrTransformer(kindOf.get(at)?.kind)) break;
    }
    if (segments.length > 0) rows.push({ loadId: f.nodeId, segments, totalPct });
  }
  return rows;
}

function isSourceOrTransformer(kind: string | undefined): boolean {
  return kind === 'utility' || kind === 'generator' || kind === 'transformer';
}

/** A line of the text report's study tables: a heading, a table row (never wrapped) or a paragraph (wrapped). */
export interface StudyLine {
  kind: 'head' | 'row' | 'para';
  text: string;
}

/** The text report's two tables: available fault current by node, and voltage drop by load. */
export function studiesTextLines(report: AnalysisReport): StudyLine[] {
  const s = report.studies;
  if (!s) return [];
  const out: StudyLine[] = [{ kind: 'head', text: 'SHORT-CIRCUIT (available fault current, ohmic method; see notes)' }];
  const row = (text: string) => out.push({ kind: 'row', text });
  const para = (text: string) => out.push({ kind: 'para', text });
  const known = s.faults.filter((f) => f.kA !== null);
  const width = Math.max(4, ...known.map((f) => f.nodeId.length));
  row(`${'node'.padEnd(width)}  ${'fault'.padStart(11)}  ${'X/R'.padStart(5)}  ${'L-G'.padStart(9)}`);
  for (const f of known) {
    row(`${f.nodeId.padEnd(width)}  ${faultText(f.kA, f.upperBound).padStart(11)}  ${(r1(f.xOverR)?.toFixed(1) ?? '—').padStart(5)}  ${(f.lineToGroundKA === null ? '—' : faultText(f.lineToGroundKA, false)).padStart(9)}`);
  }
  const unknown = s.faults.length - known.length;
  if (unknown > 0) para(`${unknown} node${unknown === 1 ? '' : 's'} without a figure: ${s.faults.find((f) => f.kA === null)?.unknownWhy ?? 'see the notes'}${unknown > 1 ? ', …' : ''}`);
  for (const m of s.serviceMarkings) para(`110.24 marking at ${m.label}: ${faultText(m.kA, m.upperBound)}, date ${m.date ?? 'not entered (project setting faultStudyDate)'}`);
  out.push({ kind: 'head', text: `VOLTAGE DROP (by load; limits ${s.voltageDrop.circuitLimitPct} % per circuit, ${s.voltageDrop.totalLimitPct} % total)` });
  const rows = loadDropRows(report);
  if (rows.length === 0) para('no load with a computed drop');
  for (const r of rows) para(`${r.loadId}: ${r.segments.map((g) => `${g.conductorId} ${pctText(g.pct)}`).join(' + ')} = ${pctText(r.totalPct)}`);
  for (const n of s.notes) para(`- ${n}`);
  return out;
}

/** One step of the short-circuit working at a node: the element added, its R + jX and where the figure comes from. */
export interface FaultStep {
  nodeId: string;
  kind: string;
  rOhm: number;
  xOhm: number;
  voltsLL: number | null;
  source: string;
}

const STEP_SOURCES: Readonly<Record<string, string>> = {
  utility: 'utility: V / (√3 × available kA) at its X/R (an infinite bus when no kA is given)',
  generator: 'generator: X″d × V² / kVA at its X/R (typical X″d when not given, common practice)',
  transformer: '%Z × V² / kVA at its X/R (typical by kVA when not given, common practice); the primary side referred by (Vs/Vp)²',
};

/**
 * The short-circuit working at one node, source first: each element's R + jX
 * (ohms at its own voltage) and its source; the sum and the result are the
 * node's own figures. Walks the supply chain once (the node's depth).
 */
export function faultWorking(report: AnalysisReport, nodeId: string): { steps: FaultStep[]; fault: StudiesReport['faults'][number] } | null {
  const s = report.studies;
  if (!s) return null;
  const byId = new Map(s.faults.map((f) => [f.nodeId as string, f]));
  const arriving = new Map(report.conductors.map((c) => [c.to as string, c]));
  const fault = byId.get(nodeId);
  if (!fault) return null;
  const steps: FaultStep[] = [];
  for (let f: typeof fault | undefined = fault, guard = 0; f && guard < 10_000; f = f.parentId ? byId.get(f.parentId) : undefined, guard++) {
    if (f.stepROhm === 0 && f.stepXOhm === 0 && f.parentId !== null) continue;
    const c = arriving.get(f.nodeId);
    const source = STEP_SOURCES[f.kind] ?? (c ? `conductor ${c.id}: Chapter 9 Table 9 R and X per 1000 ft × ${c.lengthFt ?? '?'} ft${c.parallelSets > 1 ? ` / ${c.parallelSets} sets` : ''} (× 2 for a single-phase loop)` : 'bus link: no impedance');
    steps.unshift({ nodeId: f.nodeId, kind: f.kind, rOhm: f.stepROhm, xOhm: f.stepXOhm, voltsLL: f.voltsLL, source });
  }
  return { steps, fault };
}

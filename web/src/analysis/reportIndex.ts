import type { AnalysisReport, ConductorReport, Finding, Severity } from '@linewright/core';
import { SEVERITY_LOOK } from './verdicts';

export interface ReportIndex {
  conductor: ReadonlyMap<string, ConductorReport>;
  /** Findings by the id of every element they name (subject or related). */
  findingsByElement: ReadonlyMap<string, Finding[]>;
  /** Most serious severity among findings whose subject is the element. */
  worstByElement: ReadonlyMap<string, Severity>;
}

const EMPTY: ReportIndex = { conductor: new Map(), findingsByElement: new Map(), worstByElement: new Map() };
const cache = new WeakMap<AnalysisReport, ReportIndex>();

/** Lookups over one report, built once per report. */
export function indexReport(r: AnalysisReport | null): ReportIndex {
  if (!r) return EMPTY;
  const hit = cache.get(r);
  if (hit) return hit;
  const conductor = new Map<string, ConductorReport>();
  for (const c of r.conductors) conductor.set(c.id, c);
  const findingsByElement = new Map<string, Finding[]>();
  const worstByElement = new Map<string, Severity>();
  for (const f of r.findings) {
    const refs = [f.subject, ...f.related];
    for (const ref of refs) {
      if (ref.kind === 'project') continue;
      const list = findingsByElement.get(ref.id);
      if (list) {
        if (!list.includes(f)) list.push(f);
      } else findingsByElement.set(ref.id, [f]);
    }
    if (f.subject.kind !== 'project') {
      const prev = worstByElement.get(f.subject.id);
      if (!prev || SEVERITY_LOOK[f.severity].rank < SEVERITY_LOOK[prev].rank) worstByElement.set(f.subject.id, f.severity);
    }
  }
  const idx = { conductor, findingsByElement, worstByElement };
  cache.set(r, idx);
  return idx;
}

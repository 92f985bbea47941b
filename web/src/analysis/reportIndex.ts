import type { AnalysisReport, ConductorReport, Finding, Severity } from '@linewright/core';
import { SEVERITY_LOOK } from './verdicts';

/** Reads one thing by id. */
export interface Lookup<T> {
  get(id: string): T | undefined;
}

export interface ReportIndex {
  conductor: Lookup<ConductorReport>;
  /** Findings by the id of every element they name (subject or related). */
  findingsByElement: ReadonlyMap<string, Finding[]>;
  /** Most serious severity among findings whose subject is the element. */
  worstByElement: ReadonlyMap<string, Severity>;
}

const EMPTY: ReportIndex = { conductor: new Map(), findingsByElement: new Map(), worstByElement: new Map() };
const cache = new WeakMap<AnalysisReport, ReportIndex>();

/**
 * Where each conductor id sits in a report's list, shared by every later report that lists the same ids
 * in the same order: after an edit that keeps the conductors (a length, a size, a rating) the next
 * report is indexed by one pass of identity checks instead of a new map of every conductor.
 */
let lastPositions: { conductors: readonly ConductorReport[]; at: ReadonlyMap<string, number> } | null = null;

function positionsOf(conductors: readonly ConductorReport[]): ReadonlyMap<string, number> {
  const last = lastPositions;
  if (last && sameIds(last.conductors, conductors)) {
    lastPositions = { conductors, at: last.at };
    return last.at;
  }
  const at = new Map<string, number>();
  conductors.forEach((c, i) => at.set(c.id, i));
  lastPositions = { conductors, at };
  return at;
}

function sameIds(a: readonly ConductorReport[], b: readonly ConductorReport[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i] && a[i]!.id !== b[i]!.id) return false;
  return true;
}

/** Lookups over one report, built once per report. */
export function indexReport(r: AnalysisReport | null): ReportIndex {
  if (!r) return EMPTY;
  const hit = cache.get(r);
  if (hit) return hit;
  const at = positionsOf(r.conductors);
  const list = r.conductors;
  const conductor: Lookup<ConductorReport> = {
    get: (id) => {
      const i = at.get(id);
      return i === undefined ? undefined : list[i];
    },
  };
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

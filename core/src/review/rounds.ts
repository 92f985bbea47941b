import type { AnalysisReport } from '../analyze/types';
import type { DrawingChanges, DrawingSnapshot, Project, ReviewAuthor, ReviewBlock, ReviewRound, RoundSummary } from '../model/schema';
import { fingerprintsOf } from './fingerprint';
import { sameValue } from './values';

type Keyed = { id: string };

/** The drawing part of a document (what a round freezes): settings and elements, no review data. */
export function snapshotOf(p: Pick<Project, 'project' | 'nodes' | 'conductors' | 'busLinks' | 'seriesRatings'>): DrawingSnapshot {
  const s: DrawingSnapshot = { project: p.project, nodes: p.nodes, conductors: p.conductors, busLinks: p.busLinks };
  if (p.seriesRatings !== undefined) s.seriesRatings = p.seriesRatings;
  return s;
}

/** What turns drawing `a` into drawing `b`: changed or new elements whole, removed ones by id. */
export function changesBetween(a: DrawingSnapshot, b: DrawingSnapshot): DrawingChanges {
  const upserts = <T extends Keyed>(xs: readonly T[], ys: readonly T[]): T[] => {
    const before = new Map(xs.map((x) => [x.id, x]));
    return ys.filter((y) => !sameValue(before.get(y.id), y));
  };
  const removed = <T extends Keyed>(xs: readonly T[], ys: readonly T[]): T['id'][] => {
    const after = new Set(ys.map((y) => y.id));
    return xs.filter((x) => !after.has(x.id)).map((x) => x.id);
  };
  const out: DrawingChanges = {
    nodes: upserts(a.nodes, b.nodes),
    conductors: upserts(a.conductors, b.conductors),
    busLinks: upserts(a.busLinks, b.busLinks),
    removed: { nodes: removed(a.nodes, b.nodes), conductors: removed(a.conductors, b.conductors), busLinks: removed(a.busLinks, b.busLinks) },
  };
  if (!sameValue(a.project, b.project)) out.project = b.project;
  if (!sameValue(a.seriesRatings ?? [], b.seriesRatings ?? [])) out.seriesRatings = b.seriesRatings ?? [];
  return out;
}

/** Drawing `a` with the changes applied: replaced elements keep their place, new ones go last. */
export function applyChanges(a: DrawingSnapshot, ch: DrawingChanges): DrawingSnapshot {
  const apply = <T extends Keyed>(xs: readonly T[], ups: readonly T[], gone: readonly string[]): T[] => {
    const dropped = new Set(gone);
    const byId = new Map(ups.map((u) => [u.id, u]));
    const out = xs.filter((x) => !dropped.has(x.id)).map((x) => byId.get(x.id) ?? x);
    const present = new Set(xs.map((x) => x.id));
    for (const u of ups) if (!present.has(u.id)) out.push(u);
    return out;
  };
  const out: DrawingSnapshot = {
    project: ch.project ?? a.project,
    nodes: apply(a.nodes, ch.nodes, ch.removed.nodes),
    conductors: apply(a.conductors, ch.conductors, ch.removed.conductors),
    busLinks: apply(a.busLinks, ch.busLinks, ch.removed.busLinks),
  };
  const series = ch.seriesRatings ?? a.seriesRatings;
  if (series !== undefined && (series.length > 0 || a.seriesRatings !== undefined)) out.seriesRatings = series;
  return out;
}

/** The drawing frozen by round `number`, rebuilt from the first round forward. Throws when the rounds are broken. */
export function roundDrawing(rounds: readonly ReviewRound[], number: number): DrawingSnapshot {
  let drawing: DrawingSnapshot | null = null;
  for (const r of [...rounds].sort((x, y) => x.number - y.number)) {
    if (r.snapshot) drawing = r.snapshot;
    else if (r.changes && drawing) drawing = applyChanges(drawing, r.changes);
    else throw new Error(`Round ${r.number} ("${r.name}") has neither a drawing nor changes from an earlier round; the file's rounds are damaged.`);
    if (r.number === number) return drawing;
  }
  throw new Error(`There is no round ${number}.`);
}

/** What a round keeps of an analysis: each conductor's verdict and each finding's id, severity, fingerprint and message. */
export function summarize(report: Pick<AnalysisReport, 'edition' | 'conductors' | 'findings'>): RoundSummary {
  const prints = fingerprintsOf(report);
  return {
    edition: report.edition,
    verdicts: report.conductors.map((c) => ({ id: c.id, verdict: c.verdict })),
    findings: report.findings.map((f) => ({ id: f.id, severity: f.severity, fingerprint: prints.get(f.id)!, message: f.message.slice(0, 2000) })),
  };
}

/** The name a new round is offered: "Submittal 1", then "Resubmittal 2", … */
export function suggestRoundName(number: number): string {
  return number <= 1 ? 'Submittal 1' : `Resubmittal ${number}`;
}

/**
 * The review with the present drawing frozen as a new round. The first round keeps the whole
 * drawing; later ones keep what changed since the round before, or the whole drawing when that
 * is smaller (a redrawn one-line).
 */
export function freezeRound(doc: Project, report: Pick<AnalysisReport, 'edition' | 'conductors' | 'findings'>, review: ReviewBlock, name: string, date: string, by?: ReviewAuthor): { review: ReviewBlock; round: ReviewRound } {
  const trimmed = name.trim();
  if (trimmed === '') throw new Error('Give the round a name, e.g. "Resubmittal 2".');
  if (trimmed.length > 120) throw new Error('Keep the round name to 120 characters.');
  const number = review.rounds.reduce((m, r) => Math.max(m, r.number), 0) + 1;
  const drawing = snapshotOf(doc);
  const round: ReviewRound = { number, name: trimmed, date, summary: summarize(report) };
  if (by) round.by = by;
  if (review.rounds.length === 0) round.snapshot = drawing;
  else {
    const changes = changesBetween(roundDrawing(review.rounds, number - 1), drawing);
    if (JSON.stringify(changes).length < JSON.stringify(drawing).length) round.changes = changes;
    else round.snapshot = drawing;
  }
  return { review: { ...review, rounds: [...review.rounds, round] }, round };
}

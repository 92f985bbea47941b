import type { AnalysisReport, Finding, Severity } from '../analyze/types';
import type { DispositionKind, FindingDisposition, ReviewAuthor, ReviewBlock } from '../model/schema';
import { findingFingerprint, findingTrial, fingerprintsOf, type FindingContext } from './fingerprint';

/** Words for each disposition, as the UI, letter and reports print them. */
export const DISPOSITION_WORDS: Readonly<Record<DispositionKind, string>> = {
  'ahj-accepted': 'accepted by the AHJ',
  disputed: 'disputed',
  deferred: 'deferred to a later round',
};

/**
 * How a disposition stands against the present analysis:
 * - `stands`: the finding is there and says what it said when dispositioned;
 * - `look-again`: the finding is there with other values (its fingerprint moved);
 * - `resolved-by-change`: the finding is gone; the design changed.
 */
export type DispositionStanding = 'stands' | 'look-again' | 'resolved-by-change';
export const STANDING_WORDS: Readonly<Record<DispositionStanding, string>> = {
  stands: 'stands',
  'look-again': 'finding changed: look again',
  'resolved-by-change': 'resolved by change',
};

export interface DispositionState {
  disposition: FindingDisposition;
  standing: DispositionStanding;
  finding: Finding | null;
}

export function findingsById(report: Pick<AnalysisReport, 'findings'>): Map<string, Finding> {
  return new Map(report.findings.map((f) => [f.id, f]));
}

/** Every disposition of the review, judged against the present findings. */
export function dispositionStates(review: ReviewBlock | undefined, report: FindingContext): DispositionState[] {
  if (!review || review.dispositions.length === 0) return [];
  const byId = findingsById(report);
  const prints = fingerprintsOf(report);
  return review.dispositions.map((d) => {
    const f = byId.get(d.findingId) ?? null;
    const standing: DispositionStanding = f === null ? 'resolved-by-change' : prints.get(f.id) === d.fingerprint ? 'stands' : 'look-again';
    return { disposition: d, standing, finding: f };
  });
}

/** Ids of needs-AHJ findings that carry an AHJ acceptance that still stands: these no longer count as open. */
export function acceptedFindingIds(review: ReviewBlock | undefined, report: FindingContext): Set<string> {
  const out = new Set<string>();
  for (const s of dispositionStates(review, report)) {
    if (s.standing === 'stands' && s.disposition.kind === 'ahj-accepted' && s.finding?.severity === 'needs-ahj') out.add(s.finding.id);
  }
  return out;
}

/** Findings by severity that are still open: an accepted needs-AHJ finding is not open. */
export function openCounts(report: Pick<AnalysisReport, 'findings'>, accepted: ReadonlySet<string>): Record<Severity, number> & { accepted: number } {
  const counts = { violation: 0, warning: 0, 'needs-ahj': 0, info: 0, accepted: 0 };
  for (const f of report.findings) {
    if (accepted.has(f.id)) counts.accepted++;
    else counts[f.severity]++;
  }
  return counts;
}

export interface DispositionInput {
  kind: DispositionKind;
  ahjName?: string;
  ahjDate?: string;
  reference?: string;
  reason?: string;
}

/** What is missing from a disposition before it can be recorded, in words naming the field; [] when complete. */
export function dispositionProblems(input: DispositionInput, finding: Pick<Finding, 'severity'>): string[] {
  const problems: string[] = [];
  const blank = (s: string | undefined) => s === undefined || s.trim() === '';
  if (input.kind === 'ahj-accepted') {
    if (finding.severity !== 'needs-ahj') problems.push('Only a finding that needs AHJ review can be accepted by the AHJ; dispute or defer this one.');
    if (blank(input.ahjName)) problems.push('Who accepted it: give the AHJ\'s name or office.');
    if (blank(input.ahjDate)) problems.push('When: give the date of the acceptance.');
  }
  if (input.kind === 'disputed' && blank(input.reason)) problems.push('Why: a dispute needs a reason.');
  return problems;
}

/**
 * The review with this finding's disposition set (replacing any earlier one): a pure function,
 * so the editor can record it as one undoable edit.
 */
export function setDisposition(review: ReviewBlock, finding: Finding, report: Pick<AnalysisReport, 'conductors'>, input: DispositionInput, by: ReviewAuthor, at: string): ReviewBlock {
  const problems = dispositionProblems(input, finding);
  if (problems.length > 0) throw new Error(problems.join(' '));
  const d: FindingDisposition = { findingId: finding.id, kind: input.kind, fingerprint: findingFingerprint(finding, findingTrial(finding, report)), by, at };
  const trimmed = (s: string | undefined) => (s === undefined || s.trim() === '' ? undefined : s.trim());
  if (input.kind === 'ahj-accepted') {
    d.ahjName = trimmed(input.ahjName);
    d.ahjDate = trimmed(input.ahjDate);
    const ref = trimmed(input.reference);
    if (ref !== undefined) d.reference = ref;
  } else {
    const reason = trimmed(input.reason);
    if (reason !== undefined) d.reason = reason;
  }
  return { ...review, dispositions: [...review.dispositions.filter((x) => x.findingId !== finding.id), d] };
}

/** The review without this finding's disposition. */
export function clearDisposition(review: ReviewBlock, findingId: string): ReviewBlock {
  return { ...review, dispositions: review.dispositions.filter((x) => x.findingId !== findingId) };
}

/** Accepted needs-AHJ findings with the acceptance in words, for SARIF suppressions and reports. */
export function ahjJustifications(review: ReviewBlock | undefined, report: FindingContext): Map<string, string> {
  const out = new Map<string, string>();
  for (const s of dispositionStates(review, report)) {
    if (s.standing !== 'stands' || s.disposition.kind !== 'ahj-accepted' || s.finding?.severity !== 'needs-ahj') continue;
    const d = s.disposition;
    out.set(d.findingId, `Accepted by the AHJ: ${d.ahjName ?? '?'}, ${d.ahjDate ?? '?'}${d.reference ? `, reference ${d.reference}` : ''}; recorded by ${d.by.name} (${d.by.role}) ${d.at}.`);
  }
  return out;
}

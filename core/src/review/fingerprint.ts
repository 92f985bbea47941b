import type { AnalysisReport, Finding, RuleTrial } from '../analyze/types';

export type FindingContext = Pick<AnalysisReport, 'findings' | 'conductors'>;

/**
 * A short fingerprint of what a finding says: its severity, message id, message values and,
 * for a finding about a conductor, the values its rule judged (each condition's status and
 * data). The finding id stays the same when a tap is lengthened; the fingerprint does not, so a
 * disposition made on other values asks for a new look. FNV-1a, 32 bits, as 8 hex digits: a
 * change detector, not a security measure.
 */
export function findingFingerprint(f: Pick<Finding, 'severity' | 'messageId' | 'data' | 'message'>, trial?: RuleTrial | null): string {
  let text = `${f.severity}|${f.messageId}|${f.message}${sortedPairs(f.data)}`;
  if (trial) for (const c of trial.conditions) text += `|${c.id}:${c.status}${sortedPairs(c.data)}`;
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

function sortedPairs(data: Readonly<Record<string, string | number>>): string {
  let out = '';
  for (const k of Object.keys(data).sort()) out += `|${k}=${String(data[k])}`;
  return out;
}

/** The trial of the rule that raised the finding, on its subject conductor; null when there is none. */
export function findingTrial(f: Finding, report: Pick<AnalysisReport, 'conductors'>, byId?: ReadonlyMap<string, AnalysisReport['conductors'][number]>): RuleTrial | null {
  const subject = f.subject;
  if (subject.kind !== 'conductor') return null;
  const c = byId ? byId.get(subject.id) : report.conductors.find((x) => x.id === subject.id);
  return c?.tried.find((t) => t.ruleId === f.ruleId) ?? null;
}

/** Fingerprint of every finding of a report, by finding id. */
export function fingerprintsOf(report: FindingContext): Map<string, string> {
  const byId = new Map(report.conductors.map((c) => [c.id as string, c]));
  return new Map(report.findings.map((f) => [f.id, findingFingerprint(f, findingTrial(f, report, byId))]));
}

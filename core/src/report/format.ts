import type { ConductorSize, Material } from '../model/schema';
import type { AnalysisReport, Citation, ConductorReport, ConductorRole, DeviceRef, ElementRef, Finding, Fix, Severity, Verdict } from '../analyze/types';
import { FAILING_VERDICTS, VERDICT_LABELS } from '../analyze/types';
import { materialLabel, sizeLabel } from '../tables/sizes';

/**
 * Words shared by every report (text, CSV, PDF, SARIF) and the editor, so a verdict reads the
 * same everywhere. Trade words only; none of them is a verdict of acceptance.
 */
export const VERDICT_WORDS: Readonly<Record<Verdict, string>> = VERDICT_LABELS;

/** How a verdict is drawn: a line style and mark that do not rely on colour. */
export type VerdictClass = 'protected' | 'tap-rule' | 'failing' | 'incomplete';

/** Okabe–Ito colours of the four verdict classes, the same on screen and on paper; always paired with a line style and words. */
export const VERDICT_COLOURS: Readonly<Record<VerdictClass, string>> = {
  protected: '#0072B2',
  'tap-rule': '#009E73',
  failing: '#D55E00',
  incomplete: '#CC79A7',
};

/** '#D55E00' → [213, 94, 0]. */
export function hexToRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** Groups verdicts into the four marks of the drawing legend. */
export function verdictClass(verdict: Verdict): VerdictClass {
  switch (verdict) {
    case 'protected':
    case 'protected-next-size':
    case 'motor-circuit':
    case 'hvac-circuit':
    case 'service':
    case 'generator':
      return 'protected';
    case 'tap-from-tap':
    case 'unprotected':
      return 'failing';
    case 'incomplete':
      return 'incomplete';
    default:
      return 'tap-rule';
  }
}

/** The ids of a report's violation findings, built once per list of findings. */
const violationIds = new WeakMap<readonly Finding[], ReadonlySet<string>>();

/**
 * The one answer every view gives to "does this conductor show as
 * violating?": its verdict is a failing one, or any finding on it is a
 * violation, whatever its classification (an undersized service conductor is
 * "service" and still alarms). The drawing, the CLI table and the PDF all ask here.
 */
export function showsViolation(report: Pick<AnalysisReport, 'findings'>, c: Pick<ConductorReport, 'verdict' | 'findingIds'>): boolean {
  if (FAILING_VERDICTS.has(c.verdict)) return true;
  if (c.findingIds.length === 0) return false;
  let ids = violationIds.get(report.findings);
  if (!ids) violationIds.set(report.findings, (ids = new Set(report.findings.filter((f) => f.severity === 'violation').map((f) => f.id))));
  return c.findingIds.some((id) => ids.has(id));
}

/** The class a conductor is drawn with: its verdict's, or 'failing' whenever it shows a violation. */
export function displayClass(report: Pick<AnalysisReport, 'findings'>, c: Pick<ConductorReport, 'verdict' | 'findingIds'>): VerdictClass {
  return showsViolation(report, c) ? 'failing' : verdictClass(c.verdict);
}

/** The verdict words, with the alarm added where the verdict alone would not show it: 'service (230.90(A)) · violation'. */
export function verdictAlarmText(report: Pick<AnalysisReport, 'findings'>, c: Pick<ConductorReport, 'verdict' | 'cites' | 'findingIds'>): string {
  const text = verdictText(c);
  return showsViolation(report, c) && !FAILING_VERDICTS.has(c.verdict) ? `${text} · violation` : text;
}

export const SEVERITY_WORDS: Record<Severity, string> = {
  violation: 'violation',
  'needs-ahj': 'needs AHJ review',
  warning: 'warning',
  info: 'info',
};

export const ROLE_WORDS: Record<ConductorRole, string> = {
  service: 'service',
  feeder: 'feeder',
  branch: 'branch circuit',
  'transformer-primary': 'xfmr primary',
  'transformer-secondary': 'xfmr secondary',
  generator: 'generator',
  unknown: 'unknown',
};

export const MATERIAL_WORDS: Readonly<Record<Material, string>> = { cu: materialLabel('cu'), al: materialLabel('al'), 'cu-clad-al': materialLabel('cu-clad-al') };

/** '4/0 AWG', '500 kcmil' (Table 310.16 names sizes of 250 and up in kcmil); 'size unknown' when not entered. */
export const sizeText: (size: ConductorSize | null | undefined) => string = sizeLabel;

/** '2×500 kcmil Cu' or '3/0 AWG Al' (sets shown only when more than one). */
export function conductorText(c: Pick<ConductorReport, 'parallelSets' | 'size' | 'material'>): string {
  const sets = c.parallelSets > 1 ? `${c.parallelSets}×` : '';
  if (c.size === null) return `${sets}${MATERIAL_WORDS[c.material]}, ${sizeText(null)}`;
  return `${sets}${sizeText(c.size)} ${MATERIAL_WORDS[c.material]}`;
}

/** 'NEC 2023 240.21(B)(2)'. */
export function citationText(cites: Citation | null): string {
  return cites ? `NEC ${cites.edition} ${cites.section}` : '';
}

/** 'tap: 25 ft (240.21(B)(2))': the verdict word with the section that supports it. */
export function verdictText(c: Pick<ConductorReport, 'verdict' | 'cites'>): string {
  const word = VERDICT_WORDS[c.verdict];
  return c.cites ? `${word} (${c.cites.section})` : word;
}

/** Rounds for display: whole numbers stay whole, others keep one decimal. */
export function num(value: number): string {
  if (Number.isInteger(value)) return String(value);
  return (Math.round(value * 10) / 10).toFixed(1).replace(/\.0$/, '');
}

export function lengthText(lengthFt: number | null): string {
  return lengthFt === null ? '?' : `${num(lengthFt)} ft`;
}

export function ampsText(a: number | null | undefined): string {
  return a === null || a === undefined ? '?' : `${num(a)} A`;
}

/** True when a device's label already states its rating ('MDP-2 roof feeder 400 A'). */
export function labelStatesRating(label: string, ratingA: number): boolean {
  return new RegExp(`(^|[^0-9.])${num(ratingA).replace('.', '\\.')}\\s?A\\b`).test(label);
}

/** 'CB-2 400 A' or 'CB-2 (rating ?)'; the rating is not repeated when the label already gives it. */
export function deviceText(d: DeviceRef | null): string {
  if (!d) return 'none';
  const name = d.label || d.id;
  if (d.ratingA === null) return `${name} (rating ?)`;
  return labelStatesRating(name, d.ratingA) ? name : `${name} ${num(d.ratingA)} A`;
}

/** 'conductor C7', 'node CB-2', 'project'. */
export function refText(ref: ElementRef): string {
  switch (ref.kind) {
    case 'conductor':
      return `conductor ${ref.id}`;
    case 'node':
      return `node ${ref.id}`;
    case 'busLink':
      return `bus link ${ref.id}`;
    case 'project':
      return 'project';
  }
}

/** The fix in words; the analyzer's label already names sizes and lengths, so prefer it. */
export function fixText(fix: Fix): string {
  if (fix.label) return fix.label;
  switch (fix.kind) {
    case 'resize':
      return `use ${fix.parallelSets > 1 ? `${fix.parallelSets}×` : ''}${sizeText(fix.size)} ${MATERIAL_WORDS[fix.material]} (${fix.forRule})`;
    case 'shorten':
      return `keep the run at most ${num(fix.maxLengthFt)} ft (${fix.forRule})`;
    case 'add-ocpd':
      return `add an OCPD of at most ${num(fix.ratingA)} A at the tap point`;
    case 'add-main':
      return `add a ${num(fix.ratingA)} A main breaker in ${fix.busId}`;
    case 'set-field':
      return `set ${fix.field} to ${String(fix.value)}`;
  }
}

/** A finding with its display number; the same number labels its callout on the drawing. */
export interface NumberedFinding {
  n: number;
  finding: Finding;
}

const SEVERITY_ORDER: readonly Severity[] = ['violation', 'needs-ahj', 'warning', 'info'];

/** Findings grouped by severity (violation, needs-ahj, warning, info), report order kept inside a group, numbered from 1. */
export function numberFindings(findings: readonly Finding[]): NumberedFinding[] {
  const out: NumberedFinding[] = [];
  for (const severity of SEVERITY_ORDER) {
    for (const finding of findings) if (finding.severity === severity) out.push({ n: out.length + 1, finding });
  }
  return out;
}

export { SEVERITY_ORDER };

/** True when the report holds a violation: the CLI's exit code 1. */
export function hasViolations(report: Pick<AnalysisReport, 'findings' | 'conductors'>): boolean {
  return report.findings.some((f) => f.severity === 'violation') || report.conductors.some((c) => FAILING_VERDICTS.has(c.verdict));
}

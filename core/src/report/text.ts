import { CAUTION } from '../caution';
import { studiesTextLines } from './studies';
import type { AnalysisReport, ConductorReport, Severity } from '../analyze/types';
import {
  ROLE_WORDS,
  SEVERITY_ORDER,
  SEVERITY_WORDS,
  ampsText,
  citationText,
  conductorText,
  deviceText,
  num,
  fixText,
  lengthText,
  numberFindings,
  refText,
  displayClass,
  verdictAlarmText,
} from './format';
import { clipText, inertText, textLength } from './safeText';

export interface TextOptions {
  /** ANSI colour on verdicts and severities; off by default (and words carry the meaning either way). */
  color?: boolean;
  /** Wrap width for paragraphs (the table is as wide as it needs). */
  width?: number;
}

const SEVERITY_PLURAL: Record<Severity, string> = { violation: 'violations', 'needs-ahj': 'needs AHJ review', warning: 'warnings', info: 'info' };

const ANSI = { red: '\x1b[31m', yellow: '\x1b[33m', blue: '\x1b[34m', gray: '\x1b[90m', bold: '\x1b[1m', reset: '\x1b[0m' };

interface Column {
  head: string;
  max: number;
  align?: 'right';
  cell: (c: ConductorReport, numbers: Map<string, number>, report: AnalysisReport) => string;
}

const COLUMNS: Column[] = [
  { head: 'Conductor', max: 14, cell: (c) => c.id },
  { head: 'Label', max: 30, cell: (c) => c.label },
  { head: 'Role', max: 14, cell: (c) => ROLE_WORDS[c.role] },
  { head: 'Size', max: 24, cell: (c) => conductorText(c) },
  // A tap or secondary shows the length its rule counts (the whole run), not the segment's.
  { head: 'Length', max: 10, align: 'right', cell: (c) => lengthText(c.tapLengthFt ?? c.lengthFt) },
  { head: 'Ampacity', max: 10, align: 'right', cell: (c) => ampsText(c.ampacity?.ampacityA) },
  // The rating must survive clipping, so only the device's name is shortened.
  { head: 'Upstream OCPD', max: 30, cell: (c) => deviceCell(c) },
  { head: 'Findings', max: 16, cell: (c, numbers) => c.findingIds.map((id) => numbers.get(id)).filter((n) => n !== undefined).map((n) => `[${n}]`).join(' ') },
  { head: 'Verdict', max: 60, cell: (c, _n, report) => verdictAlarmText(report, c) },
];

function deviceCell(c: ConductorReport): string {
  const d = c.upstreamDevice;
  if (!d || d.ratingA === null) return deviceText(d);
  const whole = inertText(deviceText(d));
  if (textLength(whole) <= 30) return whole;
  const rating = ` ${num(d.ratingA)} A`;
  return clipText(inertText(d.label || d.id), 30 - rating.length) + rating;
}

/** Pads by code points, so a row holding an emoji or a CJK label still lines up with its clipped width. */
function pad(s: string, width: number, align?: 'right'): string {
  const fill = ' '.repeat(Math.max(0, width - textLength(s)));
  return align === 'right' ? fill + s : s + fill;
}

/** Greedy word wrap; words longer than the width stay whole. `hang` indents the continuation lines further. */
export function wrap(text: string, width: number, indent = '', hang = ''): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    let line = '';
    let lead = indent;
    for (const word of para.split(/\s+/).filter(Boolean)) {
      if (line && lead.length + line.length + 1 + word.length > width) {
        lines.push(lead + line);
        lead = indent + hang;
        line = word;
      } else line = line ? `${line} ${word}` : word;
    }
    lines.push(lead + line);
  }
  return lines;
}

/** Renders the analysis as a fixed-width plain-text report ending with the caution. */
export function renderText(report: AnalysisReport, options: TextOptions = {}): string {
  const width = options.width ?? 100;
  const paint = (code: string, s: string) => (options.color ? `${code}${s}${ANSI.reset}` : s);
  const verdictColour = (c: ConductorReport) => {
    const k = displayClass(report, c);
    return k === 'failing' ? ANSI.red : k === 'incomplete' ? ANSI.gray : k === 'tap-rule' ? ANSI.blue : '';
  };
  const severityColour: Record<Severity, string> = { violation: ANSI.red, 'needs-ahj': ANSI.yellow, warning: ANSI.yellow, info: ANSI.gray };

  const out: string[] = [];
  const sev = report.counts.bySeverity;
  out.push(paint(ANSI.bold, `Linewright check: ${inertText(report.projectName)}`));
  out.push(
    `NEC ${report.edition} · ${report.conductors.length} conductor${report.conductors.length === 1 ? '' : 's'} · ` +
      SEVERITY_ORDER.map((s) => `${SEVERITY_PLURAL[s]}: ${sev[s] ?? 0}`).join(', '),
  );
  out.push('');

  const numbered = numberFindings(report.findings);
  const numbers = new Map(numbered.map((x) => [x.finding.id, x.n]));
  out.push(paint(ANSI.bold, 'CONDUCTORS'));
  if (report.conductors.length === 0) out.push('  (the drawing has no conductors)');
  else {
    // User text is made inert (no terminal escapes, no forged lines) before it is clipped and padded.
    const cells = report.conductors.map((c) => COLUMNS.map((col) => clipText(inertText(col.cell(c, numbers, report)), col.max)));
    const widths = COLUMNS.map((col, i) => cells.reduce((w, row) => Math.max(w, textLength(row[i]!)), col.head.length));
    const line = (row: string[]) => row.map((s, i) => pad(s, widths[i]!, COLUMNS[i]!.align)).join('  ').trimEnd();
    out.push(line(COLUMNS.map((c) => c.head)));
    out.push(widths.map((w) => '-'.repeat(w)).join('  '));
    report.conductors.forEach((c, r) => {
      const row = cells[r]!;
      const last = row.length - 1;
      // Pad the other columns first, then colour the verdict, so ANSI codes never shift the columns.
      const prefix = row.slice(0, last).map((s, i) => `${pad(s, widths[i]!, COLUMNS[i]!.align)}  `).join('');
      out.push(prefix + paint(verdictColour(c), row[last]!));
    });
  }
  out.push('');

  out.push(paint(ANSI.bold, 'FINDINGS'));
  if (numbered.length === 0) out.push('  none');
  for (const severity of SEVERITY_ORDER) {
    const group = numbered.filter((f) => f.finding.severity === severity);
    if (group.length === 0) continue;
    out.push(paint(severityColour[severity], `${SEVERITY_WORDS[severity]} (${group.length})`));
    for (const { n, finding } of group) {
      const cite = citationText(finding.cites);
      out.push(inertText(`  [${n}] ${refText(finding.subject)} · ${[cite, `rule ${finding.ruleId}`].filter(Boolean).join(' · ')}`));
      out.push(...wrap(inertText(finding.message), width, '      '));
      for (const fix of finding.fixes) out.push(...wrap(inertText(`fix: ${fixText(fix)}`), width, '      ', '     '));
    }
  }
  out.push('');

  for (const line of studiesTextLines(report)) {
    if (line.kind === 'head') out.push(...(out[out.length - 1] === '' ? [] : ['']), paint(ANSI.bold, line.text));
    else if (line.kind === 'row') out.push(`  ${inertText(line.text)}`.trimEnd());
    else out.push(...wrap(inertText(line.text), width, '  ', '    '));
  }
  if (report.studies) out.push('');

  out.push(paint(ANSI.bold, 'ASSUMPTIONS'));
  if (report.assumptions.length === 0) out.push('  none stated');
  for (const a of report.assumptions) out.push(...wrap(inertText(`- ${a}`), width, '  ', '  '));
  out.push('');

  out.push(paint(ANSI.bold, 'CAUTION'));
  out.push(...wrap(report.caution || CAUTION, width, '  '));
  return `${out.join('\n')}\n`;
}

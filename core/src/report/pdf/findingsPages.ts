import type { PdfContext } from './context';
import { SEVERITY_WORDS, citationText, fixText, numberFindings, refText } from '../format';
import { GREY, M, type Sheet } from './sheet';
import { table } from './table';

export function findingsPages(sh: Sheet, { report }: PdfContext): void {
  sh.newPage();
  sh.heading('Findings');
  sh.font(8, 'normal', GREY);
  sh.text('# is the number of the callout on the drawing (violations and AHJ review items). Grouped by severity.', M, sh.y);
  sh.y += 8;
  const numbered = numberFindings(report.findings);
  if (numbered.length === 0) {
    sh.font(9, 'normal');
    sh.text('No findings.', M, sh.y + 9);
    sh.y += 20;
    return;
  }
  table(
    sh,
    [
      { head: '#', width: 30, cell: (r) => String(r.n), bold: () => true },
      { head: 'Severity', width: 90, cell: (r) => SEVERITY_WORDS[r.finding.severity], bold: (r) => r.finding.severity === 'violation' },
      { head: 'Element', width: 140, cell: (r) => refText(r.finding.subject) },
      { head: 'Citation', width: 130, cell: (r) => citationText(r.finding.cites) || '-' },
      { head: 'Rule', width: 110, cell: (r) => r.finding.ruleId },
      {
        head: 'Finding and fixes',
        width: sh.w - 2 * M - 500,
        cell: (r) => [r.finding.message, ...r.finding.fixes.map((f) => `Fix: ${fixText(f)}`)].join('\n'),
      },
    ],
    numbered,
    8,
  );
}

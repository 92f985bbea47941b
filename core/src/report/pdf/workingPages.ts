import type { PdfContext } from './context';
import { CAUTION } from '../../caution';
import { citationText, verdictClass, verdictText } from '../format';
import { M, type Sheet } from './sheet';

export function workingPages(sh: Sheet, { report }: PdfContext): void {
  const flagged = report.conductors.filter((c) => c.findingIds.length > 0 || verdictClass(c.verdict) !== 'protected');
  if (flagged.length === 0) return;
  sh.newPage();
  sh.heading('Working for taps, secondaries and flagged conductors');
  for (const c of flagged) {
    const steps = c.ampacity ? c.ampacity.steps.map((s) => s.text) : ['ampacity not worked out: data missing'];
    sh.need(40);
    sh.font(9, 'bold');
    sh.text(`${c.id}${c.label ? ` (${c.label})` : ''}: ${verdictText(c)}`, M, sh.y + 9);
    sh.y += 14;
    sh.font(7.5, 'normal');
    for (const line of sh.split(`Ampacity: ${steps.join('; ')}`, sh.w - 2 * M - 20)) {
      sh.need(10);
      sh.text(line, M + 10, sh.y + 7.5);
      sh.y += 9.5;
    }
    for (const t of c.tried) {
      sh.need(12);
      sh.font(7.5, 'bold');
      sh.text(`${t.title} (${citationText(t.cites)}): ${t.outcome}`, M + 10, sh.y + 7.5);
      sh.y += 10;
      sh.font(7.5, 'normal');
      for (const cond of t.conditions) {
        for (const line of sh.split(`[${cond.status}] ${cond.text}`, sh.w - 2 * M - 40)) {
          sh.need(10);
          sh.text(line, M + 24, sh.y + 7.5);
          sh.y += 9.5;
        }
      }
    }
    sh.y += 6;
  }
}

export function assumptionsPage(sh: Sheet, { report }: PdfContext): void {
  sh.need(80);
  sh.y += 8;
  sh.heading('Assumptions');
  sh.font(9, 'normal');
  const items = report.assumptions.length > 0 ? report.assumptions : ['None stated by the analysis.'];
  for (const a of items) {
    const lines = sh.split(`- ${a}`, sh.w - 2 * M - 20);
    sh.need(lines.length * 11 + 2);
    sh.text(lines, M + 6, sh.y + 9);
    sh.y += lines.length * 11 + 3;
  }
  sh.y += 10;
  sh.heading('Caution');
  sh.font(9, 'normal');
  const lines = sh.split(report.caution || CAUTION, sh.w - 2 * M - 20);
  sh.need(lines.length * 11);
  sh.text(lines, M + 6, sh.y + 9);
  sh.y += lines.length * 11;
}

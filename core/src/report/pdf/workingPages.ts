import type { PdfContext } from './context';
import { CAUTION } from '../../caution';
import { citationText, verdictClass, verdictText } from '../format';
import { M, type Sheet } from './sheet';

/** A working line: 7.5 pt text, 9.5 pt apart. */
const LINE = { lineH: 9.5, need: 10, ascent: 7.5 };

/**
 * The working of every flagged conductor: ampacity steps, then each rule tried with its conditions.
 * Conductors whose working reads the same word for word (parallel duplicates, repeated branch
 * circuits) print it once under the list of their ids, so 4 000 copies of one conductor make one
 * entry instead of 4 000 identical pages.
 */
export function workingPages(sh: Sheet, { report }: PdfContext): void {
  const flagged = report.conductors.filter((c) => c.findingIds.length > 0 || verdictClass(c.verdict) !== 'protected');
  if (flagged.length === 0) return;
  const groups = new Map<string, { verdict: string; steps: string[]; tried: { head: string; lines: string[] }[]; ids: string[] }>();
  for (const c of flagged) {
    const steps = c.ampacity ? c.ampacity.steps.map((s) => s.text) : ['ampacity not worked out: data missing'];
    const tried = c.tried.map((t) => ({ head: `${t.title} (${citationText(t.cites)}): ${t.outcome}`, lines: t.conditions.map((cond) => `[${cond.status}] ${cond.text}`) }));
    const verdict = verdictText(c);
    const key = JSON.stringify([verdict, steps, tried]);
    const name = c.label && c.label !== c.id ? `${c.id} (${c.label})` : c.id;
    const group = groups.get(key);
    if (group) group.ids.push(name);
    else groups.set(key, { verdict, steps, tried, ids: [name] });
  }
  sh.newPage();
  sh.heading('Working for taps, secondaries and flagged conductors');
  for (const g of groups.values()) {
    sh.need(40);
    sh.font(9, 'bold');
    if (g.ids.length === 1) {
      sh.text(`${g.ids[0]}: ${g.verdict}`, M, sh.y + 9);
      sh.y += 14;
    } else {
      sh.text(`${g.ids.length} conductors with the same working: ${g.verdict}`, M, sh.y + 9);
      sh.y += 14;
      sh.font(7.5, 'normal');
      sh.flow(sh.split(g.ids.join(', '), sh.w - 2 * M - 20), M + 10, LINE);
    }
    sh.font(7.5, 'normal');
    sh.flow(sh.split(`Ampacity: ${g.steps.join('; ')}`, sh.w - 2 * M - 20), M + 10, LINE);
    for (const t of g.tried) {
      sh.need(12);
      sh.font(7.5, 'bold');
      sh.text(t.head, M + 10, sh.y + 7.5);
      sh.y += 10;
      sh.font(7.5, 'normal');
      sh.flow(t.lines.flatMap((line) => sh.split(line, sh.w - 2 * M - 40)), M + 24, LINE);
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

import { CAUTION } from '../caution';
import { formatNumber } from '../rules/define';
import { wrap } from '../report/text';
import type { SizingResult } from './sizeConductor';

/** The sizing result as plain text for the terminal: the run, the choices with their reasons, the cheaper misses, the basis and the caution. */
export function renderSizingText(r: SizingResult, width = 78): string {
  const out: string[] = [];
  const para = (text: string, indent = '') => out.push(...wrap(text, width - indent.length).map((l) => indent + l));
  out.push(`Linewright size: ${r.runIds.length > 1 ? `run ${r.runIds.join(' → ')}` : `conductor ${r.conductorId}`}`);
  para(`As drawn: ${r.present.label}, ${ampacityText(r.present.ampacityA)}, relative cost ${formatNumber(r.present.cost)}: ${r.present.passes ? 'the analyzer accepts it.' : `fails. ${r.present.binding?.text ?? ''}`}`);
  out.push('');
  if (r.problem) para(r.problem);
  if (r.candidates.length > 0) {
    out.push('CHOICES (cheapest first)');
    r.candidates.forEach((c, i) => {
      out.push(`  ${i + 1}. ${c.label}${c.present ? ' (as drawn)' : ''} · ${ampacityText(c.ampacityA)} · relative cost ${formatNumber(c.cost)}`);
      for (const why of c.reasons) para(`- ${why}`, '       ');
      if (c.smallerFails) para(`× ${c.smallerFails.label} fails${c.smallerFails.binding.section ? ` (${c.smallerFails.binding.section})` : ''}: ${c.smallerFails.binding.text}`, '       ');
    });
    out.push('');
  }
  if (r.rejected.length > 0) {
    out.push('CHEAPER, BUT NOT ACCEPTED');
    for (const x of r.rejected) para(`× ${x.label} (relative cost ${formatNumber(x.cost)})${x.binding.section ? ` · ${x.binding.section}` : ''}: ${x.binding.text}`, '  ');
    out.push('');
  }
  out.push('BASIS');
  for (const n of r.notes) para(`- ${n}`, '  ');
  para(`- ${r.screened} configurations tried on the rules, ${r.analyses} confirmed by re-analyzing the whole project.`, '  ');
  out.push('');
  para(`Caution: ${CAUTION}`);
  return `${out.join('\n')}\n`;
}

function ampacityText(a: number | null): string {
  return a === null ? 'no ampacity' : `${formatNumber(a)} A`;
}

import type { Project } from '../../model/schema';
import { hasUnprintable } from './sheet';

/**
 * The user's texts that the PDF cannot show as typed. The standard PDF fonts (jsPDF's Helvetica, the
 * only fonts the set carries: no font file is embedded, so the PDF stays small and needs nothing from
 * outside) print WinAnsi only; CJK, emoji, Cyrillic, Greek and the like print as "?" (pdfSafe). The
 * set says so on its first sheet and the CLI on stderr, naming each text, so nobody reads a "?" as
 * what was typed; the JSON, CSV and SARIF reports keep the text as it is.
 */

/** Names of the texts with characters the PDF font cannot show, e.g. "node MSB label", "project name". */
export function unprintableTexts(project: Project): string[] {
  const found: string[] = [];
  const settings: [string, string | undefined][] = [
    ['project name', project.project.name],
    ['project prepared-by', project.project.preparedBy],
    ['project notes', project.project.notes],
  ];
  for (const [name, text] of settings) if (text !== undefined && hasUnprintable(text)) found.push(name);
  const elements: [string, readonly { id: string }[]][] = [
    ['node', project.nodes],
    ['conductor', project.conductors],
    ['bus link', project.busLinks],
  ];
  for (const [kind, list] of elements) {
    list.forEach((element, i) => {
      // An id the font cannot show is named by its place in the file instead.
      const who = hasUnprintable(element.id) ? `${kind} #${i + 1}` : `${kind} ${element.id}`;
      for (const field of stringFields(element)) found.push(`${who} ${field}`);
    });
  }
  project.review?.comments.forEach((c) => {
    for (const field of stringFields(c)) found.push(`review comment ${c.number} ${field}`);
  });
  return found;
}

/** The string fields of `value`, nested ones as a dotted path, whose text the PDF font cannot show. */
function stringFields(value: object, prefix = ''): string[] {
  const out: string[] = [];
  for (const [key, v] of Object.entries(value)) {
    if (typeof v === 'string') {
      if (hasUnprintable(v)) out.push(`${prefix}${key}`);
    } else if (Array.isArray(v)) {
      v.forEach((item, i) => {
        if (typeof item === 'string') {
          if (hasUnprintable(item)) out.push(`${prefix}${key}[${i}]`);
        } else if (item && typeof item === 'object') out.push(...stringFields(item as object, `${prefix}${key}[${i}].`));
      });
    } else if (v && typeof v === 'object') out.push(...stringFields(v, `${prefix}${key}.`));
  }
  return out;
}

/** How many names the note spells out before "and n more". */
const NAMED = 12;

/** The note for the sheet and the CLI, or null when every text prints as typed. */
export function unprintableNote(project: Project): string | null {
  const found = unprintableTexts(project);
  if (found.length === 0) return null;
  const named = found.slice(0, NAMED).join(', ');
  const more = found.length > NAMED ? ` and ${found.length - NAMED} more` : '';
  const count = found.length === 1 ? '1 label contains' : `${found.length} labels contain`;
  return `${count} characters the PDF font cannot show; shown as ?; the JSON/CSV reports keep them: ${named}${more}.`;
}

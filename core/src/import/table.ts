/**
 * Text tables as a spreadsheet hands them over: CSV (RFC 4180: quoted fields, doubled quotes, line
 * breaks inside quotes), or the tab-separated block a spreadsheet puts on the clipboard. Pure: no DOM,
 * no Node; every cell comes back as the text it held.
 */

export type Delimiter = ',' | ';' | '\t';

/**
 * The delimiter of a text table, from its first line: a tab when there is one (a copied block), else
 * whichever of comma and semicolon occurs more often outside quotes (a semicolon where the comma is the
 * decimal mark, common practice in such locales).
 */
export function detectDelimiter(text: string): Delimiter {
  let inQuote = false;
  let commas = 0;
  let semis = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '"') inQuote = !inQuote;
    else if (!inQuote && (ch === '\n' || ch === '\r')) break;
    else if (!inQuote && ch === '\t') return '\t';
    else if (!inQuote && ch === ',') commas++;
    else if (!inQuote && ch === ';') semis++;
  }
  return semis > commas ? ';' : ',';
}

/** Rows of cells; a leading byte-order mark is dropped, rows with no text at all are left out. */
export function parseDelimited(text: string, delimiter: Delimiter = detectDelimiter(text)): string[][] {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let inQuote = false;
  let i = 0;
  const endRow = () => {
    row.push(cell);
    if (row.some((c) => c.trim() !== '')) rows.push(row);
    row = [];
    cell = '';
  };
  while (i < src.length) {
    const ch = src[i]!;
    if (inQuote) {
      if (ch === '"') {
        if (src[i + 1] === '"') {
          cell += '"';
          i += 2;
          continue;
        }
        inQuote = false;
        i++;
        continue;
      }
      cell += ch;
      i++;
      continue;
    }
    if (ch === '"' && cell.trim() === '') {
      inQuote = true;
      cell = '';
      i++;
    } else if (ch === delimiter) {
      row.push(cell);
      cell = '';
      i++;
    } else if (ch === '\r' || ch === '\n') {
      endRow();
      i += ch === '\r' && src[i + 1] === '\n' ? 2 : 1;
    } else {
      cell += ch;
      i++;
    }
  }
  if (cell !== '' || row.length > 0) endRow();
  return rows;
}

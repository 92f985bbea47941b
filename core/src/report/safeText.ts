/**
 * Text a user typed (labels, ids, project names) is data, never instructions: these helpers make it
 * inert wherever a report hands it to a program that might act on it (a spreadsheet, a terminal).
 * Every report that writes user text into such a place goes through here; do not write a second copy.
 */

/**
 * Characters that make a spreadsheet read a cell as a formula or a command (=, +, -, @) and the
 * invisible ones some spreadsheets skip before looking (tab, CR, LF), after the OWASP guidance on
 * CSV injection (common practice).
 */
const FORMULA_LEAD = /^[\s]*[=+\-@\t\r\n]/;
const FULLWIDTH_LEAD = /^[\s]*[\uFF1D\uFF0B\uFF0D\uFF20]/;

/** True when a spreadsheet could take this text as the start of a formula. */
export function looksLikeFormula(text: string): boolean {
  return FORMULA_LEAD.test(text) || FULLWIDTH_LEAD.test(text);
}

/**
 * One spreadsheet cell (CSV, XLSX, a paste to the clipboard): a string that a spreadsheet could take as a
 * formula gets a leading apostrophe, which spreadsheets show as text and do not evaluate; numbers stay
 * numbers (a negative number is a value, not a formula) and null stays empty. Apply it to the value
 * before any quoting of the file format.
 */
export function spreadsheetCell(value: string | number | null): string | number | null {
  if (typeof value !== 'string') return value;
  return looksLikeFormula(value) ? `'${value}` : value;
}

// C0 and C1 controls and DEL, plus the Unicode line/paragraph separators, which a terminal or a
// line-based reader acts on; bidi controls stay (they are handled by isolation where text is laid out).
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g;

/**
 * User text for a terminal or a line-based report: every control character (ESC sequences that hide or
 * recolour what follows, newlines that forge a line, backspace, bell) is shown as a visible escape such as
 * `\x1b` or `\n`, so the text can neither act on the terminal nor pass as another line of the report.
 */
export function inertText(text: string): string {
  return text.replace(CONTROL, (ch) => {
    switch (ch) {
      case '\n':
        return '\\n';
      case '\r':
        return '\\r';
      case '\t':
        return '\\t';
      default: {
        const code = ch.charCodeAt(0);
        return code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
      }
    }
  });
}

/**
 * The first `max` characters of `text` counted in code points, so a pair of UTF-16 surrogates (an emoji,
 * a rare CJK character) is never cut in half; `…` marks the cut.
 */
export function clipText(text: string, max: number): string {
  if (text.length <= max) return text;
  const points = Array.from(text);
  if (points.length <= max) return text;
  return `${points.slice(0, Math.max(0, max - 1)).join('')}…`;
}

/** Length in code points (what `clipText` counts), so padding lines up with what was clipped. */
export function textLength(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    // A high surrogate followed by a low one is a single code point.
    if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) i++;
    }
    n++;
  }
  return n;
}

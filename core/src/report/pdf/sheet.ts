import { jsPDF } from 'jspdf';
import { type VerdictClass, VERDICT_COLOURS, hexToRgb } from '../format';

/** The sheet: page geometry, pens and fonts, and text that standard PDF fonts can print. */

import { SHEET_SIZES, type SheetSize } from './sheetSizes';
export { SHEET_SIZES, SHEET_SIZE_IDS, type SheetSize } from './sheetSizes';

/** ANSI B, the default sheet. */
export const PAGE_W = 1224;
export const PAGE_H = 792;
export const M = 36;
export const FOOTER_H = 30;
export const BODY_BOTTOM = PAGE_H - M - FOOTER_H;
export const SIDE_W = 270;
export const FONT = 'helvetica';
/**
 * No text on a sheet is set smaller than this: about 6 pt prints legibly on an ANSI B sheet (common
 * practice for drawing notes on reduced-size sets). Drawing views too small for it show structure
 * and callouts only, and detail sheets at a legible scale follow.
 */
export const MIN_TEXT_PT = 6;

export type Rgb = [number, number, number];
// Okabe–Ito colour-blind-safe palette; every colour is paired with a line style and words.
export const BLACK: Rgb = [0, 0, 0];
export const GREY: Rgb = [110, 110, 110];
export const LIGHT: Rgb = [235, 235, 235];
export const STYLE: Record<VerdictClass, { color: Rgb; width: number; dash: number[]; legend: string }> = {
  protected: { color: hexToRgb(VERDICT_COLOURS.protected), width: 1, dash: [], legend: 'solid: protected at its ampacity (240.4), service, generator' },
  'tap-rule': { color: hexToRgb(VERDICT_COLOURS['tap-rule']), width: 1.2, dash: [7, 3], legend: 'dashed: meets a tap or secondary rule (240.21(B)/(C))' },
  failing: { color: hexToRgb(VERDICT_COLOURS.failing), width: 2.4, dash: [9, 2.5, 2, 2.5], legend: 'heavy dash-dot: no rule makes it acceptable' },
  incomplete: { color: hexToRgb(VERDICT_COLOURS.incomplete), width: 1, dash: [1.5, 2.5], legend: 'dotted: incomplete, data missing' },
};
export const VIOLATION: Rgb = [213, 94, 0];
export const AHJ: Rgb = [230, 159, 0];

/** Characters of WinAnsiEncoding beyond Latin-1 (0x80–0x9F), which jsPDF's standard fonts print. */
export const WIN_ANSI_EXTRA = '€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ';

/** Symbols of our own messages that WinAnsi lacks, spelled out in words. */
const SPELLED: readonly [RegExp, string][] = [
  [/ ?≥ ?/g, ' at least '],
  [/ ?≤ ?/g, ' at most '],
  [/√/g, 'sqrt '],
  [/ ?Ω/g, ' ohm'],
  [/ ?→ ?/g, ' -> '],
];
const PRINTABLE = `\n\x20-\x7e\u00a0-\u00ff${WIN_ANSI_EXTRA}`;
/** A character the standard fonts cannot print and pdfSafe does not spell out. */
const UNPRINTABLE = new RegExp(`[^${PRINTABLE}≥≤√Ω→]`, 'u');
const PLAIN = /^[\x20-\x7e]*$/;
const segmenter = new Intl.Segmenter('en', { granularity: 'grapheme' });

/**
 * True when the standard PDF fonts cannot show some character of `text` (CJK, emoji, Cyrillic, a
 * control character...): pdfSafe prints each such character as "?".
 */
export function hasUnprintable(text: string): boolean {
  return !PLAIN.test(text) && UNPRINTABLE.test(text.normalize('NFC'));
}

/**
 * jsPDF's standard fonts are WinAnsi only: spell out what they cannot print (≥, √, Ω...), compose
 * accents written as separate marks (e + ◌́ prints as é), and print every other character they cannot
 * show as one "?" per character as a reader sees it (an emoji, a flag, a family of emoji joined into one
 * is one "?", never one per code unit).
 */
export function pdfSafe(text: string): string {
  if (PLAIN.test(text)) return text;
  let t = text.normalize('NFC');
  for (const [re, words] of SPELLED) t = t.replace(re, words);
  if (!UNPRINTABLE.test(t)) return t;
  let out = '';
  for (const { segment } of segmenter.segment(t)) out += UNPRINTABLE.test(segment) ? '?' : segment;
  return out;
}

/**
 * jsPDF passes every text through its Arabic shaping and bidi reordering plugins, character by
 * character. Every text printed here has been through pdfSafe (WinAnsi, no right-to-left or Arabic
 * letters), so both leave it as it is; they cost about a third of the text time of a large set
 * (4 000 conductors), so this document unsubscribes them. Other text hooks stay.
 */
function dropNoOpTextHooks(doc: jsPDF): void {
  const events = doc.internal.events;
  const topics = events.getTopics();
  for (const topic of ['preProcessText', 'postProcessText']) {
    for (const [token, [hook]] of Object.entries(topics[topic] ?? {})) {
      if (hook === doc.processArabic || String(hook).includes('doBidiReorder')) events.unsubscribe(token);
    }
  }
}

export class Sheet {
  readonly doc: jsPDF;
  readonly size: SheetSize;
  /** Page width and height, pt, and where the body ends above the footer. */
  readonly w: number;
  readonly h: number;
  readonly bodyBottom: number;
  y = M;
  private readonly wrapped = new Map<string, string[]>();

  constructor(size: SheetSize = 'ansi-b') {
    this.size = size;
    this.w = SHEET_SIZES[size].w;
    this.h = SHEET_SIZES[size].h;
    this.bodyBottom = this.h - M - FOOTER_H;
    this.doc = new jsPDF({ orientation: 'landscape', unit: 'pt', format: [this.w, this.h], compress: true });
    this.doc.setFont(FONT, 'normal');
    dropNoOpTextHooks(this.doc);
  }

  stroke(color: Rgb, width: number, dash: number[] = []): void {
    this.doc.setDrawColor(color[0], color[1], color[2]);
    this.doc.setLineWidth(width);
    this.doc.setLineDashPattern(dash, 0);
  }

  fill(color: Rgb): void {
    this.doc.setFillColor(color[0], color[1], color[2]);
  }

  font(size: number, style: 'normal' | 'bold' | 'italic' = 'normal', color: Rgb = BLACK): void {
    this.doc.setFont(FONT, style);
    this.doc.setFontSize(size);
    this.doc.setTextColor(color[0], color[1], color[2]);
  }

  text(s: string | string[], x: number, y: number, opts: { align?: 'left' | 'center' | 'right'; baseline?: 'top' | 'middle' | 'bottom' | 'alphabetic' } = {}): void {
    this.doc.text(Array.isArray(s) ? s.map(pdfSafe) : pdfSafe(s), x, y, { baseline: opts.baseline ?? 'alphabetic', align: opts.align ?? 'left' });
  }

  /**
   * `s` wrapped to `width` in the current font. Remembered by font, size, width and text: schedules
   * repeat the same cells (sizes, ratings, verdict words) thousands of times, and jsPDF measures each
   * character anew on every call.
   */
  split(s: string, width: number): string[] {
    const font = this.doc.getFont();
    const key = `${font.fontName}\u0000${font.fontStyle}\u0000${this.doc.getFontSize()}\u0000${width}\u0000${s}`;
    let lines = this.wrapped.get(key);
    if (!lines) {
      if (this.wrapped.size >= 20_000) this.wrapped.clear();
      lines = this.doc.splitTextToSize(pdfSafe(s), width) as string[];
      this.wrapped.set(key, lines);
    }
    return [...lines];
  }

  /**
   * Prints `lines` one under another from `y`, `lineH` apart, each needing `need` points above the
   * footer, in the current font; breaks to new pages as needed. One text call per page rather than
   * per line: jsPDF's cost is per call as much as per character, and working pages run to thousands
   * of lines.
   */
  flow(lines: readonly string[], x: number, o: { lineH: number; need: number; ascent: number }): void {
    for (let i = 0; i < lines.length; ) {
      this.need(o.need);
      const room = Math.max(1, Math.floor((this.bodyBottom - this.y - o.need) / o.lineH) + 1);
      const chunk = lines.slice(i, i + room);
      this.doc.text(chunk.map(pdfSafe), x, this.y + o.ascent, { baseline: 'alphabetic', lineHeightFactor: o.lineH / this.doc.getFontSize() });
      this.y += chunk.length * o.lineH;
      i += chunk.length;
    }
  }

  newPage(): void {
    this.doc.addPage([this.w, this.h], 'landscape');
    this.y = M;
  }

  /** Starts a new page when `h` more points would run into the footer. */
  need(h: number, onNewPage?: () => void): void {
    if (this.y + h > this.bodyBottom) {
      this.newPage();
      onNewPage?.();
    }
  }

  heading(s: string): void {
    this.need(40);
    this.font(14, 'bold');
    this.text(s, M, this.y + 14);
    this.y += 24;
  }
}

export interface DrawBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

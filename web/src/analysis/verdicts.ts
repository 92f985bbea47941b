import type { AnalysisReport, ConductorReport, Severity, Verdict } from '@linewright/core';
import { VERDICT_WORDS } from '../words';
import { SEVERITY_WORDS, VERDICT_COLOURS, displayClass, verdictClass, type VerdictClass } from './coreApi';

/**
 * How a verdict looks. Each class differs in text, line dash, badge shape and
 * colour at once, so no reader depends on colour (Okabe–Ito palette). The
 * classes, colours and dashes are those of the permit PDF legend
 * (core/src/report/pdf/), so screen and paper read the same.
 */
export type VerdictFamily = VerdictClass | 'pending';

export interface FamilyLook {
  colour: string;
  /** SVG stroke-dasharray; '' for a solid line. */
  dash: string;
  strokeWidth: number;
  badge: 'circle' | 'diamond' | 'triangle' | 'square' | 'none';
  /** Legend wording. */
  legend: string;
}

export const FAMILY_LOOK: Record<VerdictFamily, FamilyLook> = {
  protected: { colour: VERDICT_COLOURS['protected'], dash: '', strokeWidth: 2.5, badge: 'circle', legend: 'protected at its ampacity, service, generator (solid line, round badge)' },
  'tap-rule': { colour: VERDICT_COLOURS['tap-rule'], dash: '10 4', strokeWidth: 2.5, badge: 'diamond', legend: 'meets a tap or secondary rule (dashed line, diamond badge)' },
  failing: { colour: VERDICT_COLOURS['failing'], dash: '12 3 3 3', strokeWidth: 4, badge: 'triangle', legend: 'no rule makes it acceptable (heavy dash-dot line, triangle badge)' },
  incomplete: { colour: VERDICT_COLOURS['incomplete'], dash: '2 4', strokeWidth: 2.5, badge: 'square', legend: 'incomplete: data missing (dotted line, square badge)' },
  pending: { colour: '#8c8c8c', dash: '', strokeWidth: 2, badge: 'none', legend: 'not checked yet' },
};

/** Verdicts in plain words that name the rule (see words.ts). */
export const VERDICT_TEXT = VERDICT_WORDS;

export function verdictFamily(v: Verdict | null | undefined): VerdictFamily {
  return v ? verdictClass(v) : 'pending';
}

/** How one conductor of a report is drawn: the core's display class, so a violation alarms whatever the verdict. */
export function conductorFamily(report: AnalysisReport, c: ConductorReport): VerdictFamily {
  return displayClass(report, c);
}

/** The core's severity words, shared with every report. */
export const SEVERITY_TEXT = SEVERITY_WORDS;

/** Severity marks: shape + glyph + colour, most serious first. */
export const SEVERITY_LOOK: Record<Severity, { colour: string; glyph: string; rank: number }> = {
  violation: { colour: '#D55E00', glyph: '▲', rank: 0 },
  warning: { colour: '#CC79A7', glyph: '■', rank: 1 },
  'needs-ahj': { colour: '#E69F00', glyph: '◆', rank: 2 },
  info: { colour: '#56B4E9', glyph: '●', rank: 3 },
};

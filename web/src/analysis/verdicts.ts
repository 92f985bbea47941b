import type { Severity, Verdict } from '@linewright/core';

/**
 * How a verdict looks. Each family differs in text, line dash, badge shape and
 * colour at once, so no reader depends on colour (Okabe–Ito palette).
 */
export type VerdictFamily = 'meets' | 'by-rule' | 'fails' | 'incomplete' | 'pending';

export interface FamilyLook {
  colour: string;
  /** SVG stroke-dasharray; '' for a solid line. */
  dash: string;
  strokeWidth: number;
  badge: 'circle' | 'diamond' | 'triangle' | 'square' | 'none';
  /** One glyph inside the badge. */
  glyph: string;
  /** Legend wording. */
  legend: string;
}

export const FAMILY_LOOK: Record<VerdictFamily, FamilyLook> = {
  meets: { colour: '#009E73', dash: '', strokeWidth: 2.5, badge: 'circle', glyph: '✓', legend: 'protected at its ampacity (solid line, round badge)' },
  'by-rule': { colour: '#0072B2', dash: '10 5', strokeWidth: 2.5, badge: 'diamond', glyph: 'T', legend: 'allowed by a tap or secondary rule (dashed line, diamond badge)' },
  fails: { colour: '#D55E00', dash: '3 4', strokeWidth: 3.5, badge: 'triangle', glyph: '!', legend: 'no rule makes it acceptable (dotted heavy line, triangle badge)' },
  incomplete: { colour: '#E69F00', dash: '12 4 2 4', strokeWidth: 2.5, badge: 'square', glyph: '?', legend: 'data missing to decide (dash-dot line, square badge)' },
  pending: { colour: '#8c8c8c', dash: '', strokeWidth: 2, badge: 'none', glyph: '', legend: 'not checked yet' },
};

export const VERDICT_TEXT: Record<Verdict, string> = {
  protected: 'protected',
  'protected-next-size': 'protected (next size up)',
  'tap-10ft': 'tap: 10 ft',
  'tap-25ft': 'tap: 25 ft',
  'tap-transformer': 'tap: transformer',
  'tap-high-bay': 'tap: high bay',
  'tap-outside': 'tap: outside',
  'secondary-primary-protected': 'secondary: primary-protected',
  'secondary-10ft': 'secondary: 10 ft',
  'secondary-25ft': 'secondary: 25 ft',
  'secondary-outside': 'secondary: outside',
  service: 'service',
  generator: 'generator conductor',
  'tap-from-tap': 'tap from a tap',
  unprotected: 'unprotected',
  incomplete: 'incomplete (missing data)',
};

export function verdictFamily(v: Verdict | null | undefined): VerdictFamily {
  if (!v) return 'pending';
  if (v === 'tap-from-tap' || v === 'unprotected') return 'fails';
  if (v === 'incomplete') return 'incomplete';
  if (v.startsWith('tap-') || v.startsWith('secondary-')) return 'by-rule';
  return 'meets';
}

export const SEVERITY_TEXT: Record<Severity, string> = {
  violation: 'violation',
  warning: 'warning',
  'needs-ahj': 'needs AHJ review',
  info: 'note',
};

/** Severity marks: shape + glyph + colour, most serious first. */
export const SEVERITY_LOOK: Record<Severity, { colour: string; glyph: string; rank: number }> = {
  violation: { colour: '#D55E00', glyph: '▲', rank: 0 },
  warning: { colour: '#E69F00', glyph: '■', rank: 1 },
  'needs-ahj': { colour: '#CC79A7', glyph: '◆', rank: 2 },
  info: { colour: '#56B4E9', glyph: '●', rank: 3 },
};

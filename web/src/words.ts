import { RULES_BY_ID, type Verdict } from '@linewright/core';

/**
 * Plain words for everything the file stores as a code: no person reads "tap-25ft", "lengthFt",
 * "tap-box" or "delta-delta-3w" on the screen. A verdict names the rule ("25-ft tap rule"), so it is
 * never mistaken for a length beside a run of another length.
 */
export const VERDICT_WORDS: Readonly<Record<Verdict, string>> = {
  protected: 'protected',
  'protected-next-size': 'protected, next size up',
  'motor-circuit': 'motor circuit, 240.4(G)',
  'hvac-circuit': 'HVAC circuit, 240.4(G)',
  'tap-10ft': '10-ft tap rule',
  'tap-25ft': '25-ft tap rule',
  'tap-transformer': 'transformer tap rule',
  'tap-high-bay': 'high-bay tap rule',
  'tap-outside': 'outside tap rule',
  'secondary-primary-protected': 'secondary, primary OCPD',
  'secondary-10ft': '10-ft secondary rule',
  'secondary-25ft': '25-ft secondary rule',
  'secondary-outside': 'outside secondary rule',
  service: 'service conductor',
  generator: 'generator conductor',
  'tap-from-tap': 'tap from a tap',
  unprotected: 'unprotected',
  incomplete: 'incomplete: data missing',
};

const CODES: Readonly<Record<string, string>> = {
  // Bus types
  switchgear: 'switchgear', switchboard: 'switchboard', panelboard: 'panelboard', 'tap-box': 'tap box', busway: 'busway',
  // Transformer connections
  'delta-wye': 'delta–wye', 'delta-delta-3w': 'delta–delta, 3-wire', 'delta-delta-4w': 'delta–delta, 4-wire', 'wye-wye': 'wye–wye',
  'wye-delta': 'wye–delta', 'single-phase-2w': 'single-phase, 2-wire', 'single-phase-3w': 'single-phase, 3-wire',
  // Field names that can reach a message
  lengthFt: 'length (ft)', ratingA: 'rating (A)', parallelSets: 'parallel sets', ambientC: 'ambient (°C)', terminalTempC: 'termination rating (°C)',
  currentCarrying: 'current-carrying conductors', voltsLL: 'voltage line to line (V)', kva: 'kVA', busRatingA: 'bus rating (A)',
  primaryVoltsLL: 'primary voltage (V)', secondaryVoltsLL: 'secondary voltage (V)', impedancePct: 'impedance (%Z)', currentA: 'current (A)',
  powerFactor: 'power factor', busType: 'equipment', topology: 'how the network is connected', from: 'supply end', to: 'load end',
  size: 'size', material: 'material', insulation: 'insulation', wiring: 'wiring method', nodes: 'equipment', conductors: 'conductors', busLinks: 'bus links',
};

/** A stored code or field name in plain words; unknown codes get their hyphens turned into spaces. */
export function plain(code: string): string {
  return CODES[code] ?? VERDICT_WORDS[code as Verdict] ?? code.replace(/([a-z])([A-Z])/g, '$1 $2').replace(/-/g, ' ').toLowerCase();
}

/** A rule's name as the findings list shows it. */
export function ruleName(ruleId: string): string {
  return RULES_BY_ID.get(ruleId)?.title ?? plain(ruleId);
}

/** "1 conductor", "2 conductors"; irregular plurals given. */
export function count(n: number, one: string, many = `${one}s`): string {
  return `${thousands(n)} ${n === 1 ? one : many}`;
}

/**
 * A whole number with thousands separated as in en-US: 12345 → "12,345". Written out because the
 * browser's number formatting loads its locale data on first use, 45–65 ms on the first paint.
 */
export function thousands(n: number): string {
  if (!Number.isInteger(n)) return n.toLocaleString('en-US');
  return `${n < 0 ? '-' : ''}${String(Math.abs(n)).replace(/\B(?=(\d{3})+$)/g, ',')}`;
}

import type { AmpacityStep, AmpacityWorking, Citation } from '../analyze/types';
import { CONDUCTOR_SIZES, type CodeEdition, type ConductorSize, type Insulation, type Material } from '../model/schema';
import { adjustmentFactor } from '../tables/adjustment';
import { ambientCorrectionFactor, MAX_TABULATED_AMBIENT_C } from '../tables/ambientCorrection';
import { baseAmpacityAtIndex, type TempColumnC } from '../tables/ampacity310_16';
import { cite, sectionFor } from '../tables/citations';
import { INSULATION_RATINGS, type InsulationRating } from '../tables/insulation';
import { smallConductorMaxOcpdAtIndex } from '../tables/smallConductor';
import { materialIndexOf, materialLabel, materialName, SIZE_INDEX_1_0, SIZE_INDEX_14, sizeIndexOf, sizeLabel } from '../tables/sizes';

/** What the ampacity of one conductor run depends on (fields as in the project schema). */
export interface AmpacityInput {
  material: Material;
  /** Undefined when the drawing does not give it: no ampacity, and the failure names the field. */
  size: ConductorSize | undefined;
  insulation: Insulation;
  /** Conductors in parallel per phase (310.10(G)); 1 for a single conductor. */
  parallelSets: number;
  ambientC: number;
  /** Current-carrying conductors in the raceway or cable, all sets counted (310.15(C)(1)). */
  currentCarrying: number;
  /** Lowest temperature rating of the terminations at either end (110.14(C)). */
  terminalTempC: 60 | 75 | 90;
  edition: CodeEdition;
}

/** Fields of AmpacityInput a failure can point at. */
export type AmpacityInputField = 'size' | 'material' | 'ambientC' | 'parallelSets' | 'insulation' | 'currentCarrying';

/** The working, or which field makes the ampacity undefined and how to fix it. */
export type AmpacityResult =
  | { ok: true; working: AmpacityWorking }
  | { ok: false; field: AmpacityInputField; message: string };

/*
 * Speed: the analyzer calls computeAmpacity once per conductor, 100 000 times
 * for a large riser. Table reads are array reads (tables/*), citations are
 * shared frozen objects per edition, and every step text is rendered once
 * per distinct key and kept (the arithmetic lines in bounded caches). The
 * working, its steps array and step objects are fresh per call, so callers
 * may keep them; the Citation objects inside are shared and frozen.
 */

interface EditionCites {
  base: Citation;
  ambient: Citation;
  adjustment: Citation;
  corrected: Citation;
  terminal: Citation;
  parallel: Citation;
  small: Citation;
  ambientTable: string;
}

function editionCites(edition: CodeEdition): EditionCites {
  const ambientTable = sectionFor('ambient-correction-table', edition);
  return Object.freeze({
    base: Object.freeze(cite('Table 310.16', edition)),
    ambient: Object.freeze(cite(ambientTable, edition)),
    adjustment: Object.freeze(cite('Table 310.15(C)(1)', edition)),
    corrected: Object.freeze(cite('310.15', edition)),
    terminal: Object.freeze(cite('110.14(C)', edition)),
    parallel: Object.freeze(cite('310.10(G)', edition)),
    small: Object.freeze(cite('240.4(D)', edition)),
    ambientTable,
  });
}

const CITES_2020 = editionCites(2020);
const CITES_2023 = editionCites(2023);

/** '0.00' … '2.00' by hundredths, for factor texts. */
const FACTOR_TEXT: readonly string[] = Array.from({ length: 201 }, (_, i) => (i / 100).toFixed(2));

const N_SIZES = CONDUCTOR_SIZES.length;

/** Rendered once per key, then reused: texts that depend only on table keys. */
const baseTexts = new Map<number, string>();
const ambientTexts = new Map<number, string>();
const adjustmentTexts = new Map<number, string>();
const terminalTexts = new Map<number, string>();
const smallTexts = new Map<number, string>();

function baseText(mi: number, si: number, ii: number, material: Material, size: ConductorSize, insulation: Insulation, tempC: TempColumnC, baseA: number): string {
  const key = (mi * N_SIZES + si) * 32 + ii;
  let t = baseTexts.get(key);
  if (t === undefined) {
    t = `Table 310.16, ${sizeLabel(size)} ${materialLabel(material)}, ${tempC} °C column (${insulation}): ${baseA} A`;
    baseTexts.set(key, t);
  }
  return t;
}

/** Rating and a small integer per insulation type, one Map read per call. */
const INSULATIONS_BY_NAME = new Map<string, { rating: InsulationRating; index: number }>(
  Object.entries(INSULATION_RATINGS).map(([name, rating], index) => [name, { rating, index }]),
);

function ambientText(cites: EditionCites, tempC: TempColumnC, ambientC: number, factorPct: number): string {
  const cacheable = Number.isInteger(ambientC) && ambientC >= -100 && ambientC <= 200;
  const key = ((cites === CITES_2020 ? 0 : 1) * 3 + (tempC === 60 ? 0 : tempC === 75 ? 1 : 2)) * 1000 + ambientC + 100;
  let t = cacheable ? ambientTexts.get(key) : undefined;
  if (t === undefined) {
    t = `${cites.ambientTable}, ${tempC} °C column, ${ambientC} °C ambient: × ${FACTOR_TEXT[factorPct]}`;
    if (cacheable) ambientTexts.set(key, t);
  }
  return t;
}

function adjustmentText(count: number, factorPct: number): string {
  let t = adjustmentTexts.get(count);
  if (t === undefined) {
    t =
      count <= 3
        ? `${count} current-carrying conductor${count === 1 ? '' : 's'} (three or fewer): no adjustment, × 1.00`
        : `Table 310.15(C)(1), ${count} current-carrying conductors: × ${FACTOR_TEXT[factorPct]}`;
    if (Number.isInteger(count) && count <= 1000) adjustmentTexts.set(count, t);
  }
  return t;
}

function terminalText(mi: number, si: number, terminalTempC: TempColumnC, insulationTempC: TempColumnC, limitA: number): string {
  const key = ((mi * N_SIZES + si) * 3 + colIndex(terminalTempC)) * 3 + colIndex(insulationTempC);
  let t = terminalTexts.get(key);
  if (t === undefined) {
    t =
      terminalTempC > insulationTempC
        ? `110.14(C), ${terminalTempC} °C terminations: the ${insulationTempC} °C insulation column is lower and governs, ${limitA} A`
        : `110.14(C), ${terminalTempC} °C terminations: Table 310.16 ${terminalTempC} °C column, ${limitA} A at most`;
    terminalTexts.set(key, t);
  }
  return t;
}

function smallText(mi: number, si: number, material: Material, size: ConductorSize, edition: CodeEdition, maxA: number): string {
  const key = ((edition === 2020 ? 0 : 1) * 3 + mi) * N_SIZES + si;
  let t = smallTexts.get(key);
  if (t === undefined) {
    t = `240.4(D), ${sizeLabel(size)} ${materialLabel(material)}: overcurrent device at most ${maxA} A (unless 240.4(E) or (G) applies)`;
    smallTexts.set(key, t);
  }
  return t;
}

/*
 * The arithmetic lines repeat too: a riser has few distinct (base, factor)
 * pairs. They are keyed by integers (amperes are kept to 0.01 A, so ×100 is
 * whole) and the caches are dropped if they ever grow past ARITHMETIC_CACHE_MAX.
 */
const ARITHMETIC_CACHE_MAX = 50_000;
const correctedTexts = new Map<number, string>();
const perSetTexts = new Map<number, string>();
const parallelTexts = new Map<number, string>();

function remember(map: Map<number, string>, key: number, text: string): string {
  if (map.size >= ARITHMETIC_CACHE_MAX) map.clear();
  map.set(key, text);
  return text;
}

function correctedText(baseA: number, ambientPct: number, adjustmentPct: number, correctedA: number): string {
  const key = (baseA * 256 + ambientPct) * 128 + adjustmentPct;
  return (
    correctedTexts.get(key) ??
    remember(correctedTexts, key, `${baseA} A × ${FACTOR_TEXT[ambientPct]} × ${FACTOR_TEXT[adjustmentPct]} = ${correctedA} A`)
  );
}

function perSetText(correctedA: number, terminalLimitA: number): string {
  const key = Math.round(correctedA * 100) * 1024 + terminalLimitA;
  const t = perSetTexts.get(key);
  if (t !== undefined) return t;
  return remember(
    perSetTexts,
    key,
    terminalLimitA < correctedA
      ? `${correctedA} A exceeds the termination limit: ${terminalLimitA} A per conductor (terminal rating governs)`
      : `${correctedA} A per conductor (within the ${terminalLimitA} A termination limit)`,
  );
}

function parallelText(parallelSets: number, perSetA: number, ampacityA: number): string {
  const key = Math.round(perSetA * 100) * 64 + parallelSets;
  const t = parallelTexts.get(key);
  if (t !== undefined) return t;
  return remember(
    parallelTexts,
    key,
    parallelSets === 1
      ? `One conductor per phase: ${ampacityA} A`
      : `${parallelSets} conductors in parallel per phase: ${parallelSets} × ${perSetA} A = ${ampacityA} A`,
  );
}

function colIndex(tempC: TempColumnC): number {
  return tempC === 60 ? 0 : tempC === 75 ? 1 : 2;
}

/** Kill float noise: results are kept to 0.01 A. */
function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

function fail(field: AmpacityInputField, message: string): AmpacityResult {
  return { ok: false, field, message };
}

/** The message of a conductor drawn without a size: what is unknown and the fix. */
export const NEEDS_SIZE_MESSAGE =
  'needs the size: no conductor size is given (field size), so its ampacity and every verdict that depends on it are unknown. Enter the size, e.g. "3/0" or "500".';

/**
 * Ampacity of one conductor run with every step kept: Table 310.16 base in
 * the insulation's column, ambient correction, adjustment for more than three
 * current-carrying conductors, the 110.14(C) termination cap, parallel sets
 * (310.10(G)) and the 240.4(D) small-conductor limit.
 */
export function computeAmpacity(input: AmpacityInput): AmpacityResult {
  const { material, size, insulation, parallelSets, ambientC, currentCarrying, terminalTempC, edition } = input;

  if (size === undefined) return fail('size', NEEDS_SIZE_MESSAGE);
  const mi = materialIndexOf(material);
  if (mi < 0) return fail('material', `Unknown conductor material '${String(material)}'; use cu, al or cu-clad-al.`);
  const si = sizeIndexOf(size);
  if (si < 0) return fail('size', `Unknown conductor size '${String(size)}'; use an AWG size 14–4/0 or a kcmil size 250–2000.`);
  const ins = INSULATIONS_BY_NAME.get(insulation);
  if (ins === undefined) return fail('insulation', `Unknown insulation type '${String(insulation)}'; choose one of the listed types, e.g. THHN or XHHW-2.`);
  if (!Number.isInteger(parallelSets) || parallelSets < 1)
    return fail('parallelSets', `Conductors in parallel must be a whole number of 1 or more (got ${parallelSets}).`);
  if (!Number.isInteger(currentCarrying) || currentCarrying < 1)
    return fail('currentCarrying', `Current-carrying conductors must be a whole number of 1 or more (got ${currentCarrying}).`);
  if (!Number.isFinite(ambientC)) return fail('ambientC', 'Ambient temperature must be a number of °C; 30 °C is the table basis.');

  const insulationTempC = ins.rating.tempC;
  const copper = mi === 0;
  const baseA = baseAmpacityAtIndex(copper, insulationTempC, si);
  if (baseA === null) {
    if (si < SIZE_INDEX_14)
      return fail('size', `Table 310.16 starts at 14 AWG and lists no ampacity for ${sizeLabel(size)} (a fixture and control size); use 14 AWG or larger.`);
    // 2023 240.4(D) names 14 AWG copper-clad aluminum (10 A), yet Table 310.16 still has no row for it.
    const note = material === 'cu-clad-al' && edition === 2023 ? ' (240.4(D) names it, but gives no ampacity)' : '';
    return fail('size', `Table 310.16 lists no ${materialName(material)} ${sizeLabel(size)}${note}; use 12 AWG or larger, or copper.`);
  }

  if (parallelSets > 1 && si < SIZE_INDEX_1_0)
    return fail(
      'parallelSets',
      `310.10(G) allows conductors in parallel only in 1/0 AWG and larger; ${parallelSets} × ${sizeLabel(size)} in parallel is not permitted. ` +
        'Use one conductor of a larger size, or 1/0 AWG or larger in parallel.',
    );

  const cites = edition === 2020 ? CITES_2020 : CITES_2023;

  const ambientFactor = ambientCorrectionFactor(insulationTempC, ambientC);
  if (ambientFactor === null) {
    const where = ambientC > MAX_TABULATED_AMBIENT_C ? `above ${MAX_TABULATED_AMBIENT_C} °C, the table's last row` : `${ambientC} °C`;
    return fail(
      'ambientC',
      `${cites.ambientTable} gives no correction factor for ${insulationTempC} °C insulation (${insulation}) at ${where}: ` +
        `the conductor may not be used there. Choose insulation with a higher temperature rating or check the ambient.`,
    );
  }
  const adjFactor = adjustmentFactor(currentCarrying);

  // Factors have two decimals: multiply integers first so 225 × 0.91 is exactly 204.75.
  const ambientPct = Math.round(ambientFactor * 100);
  const adjustmentPct = Math.round(adjFactor * 100);
  const correctedA = round2((baseA * ambientPct * adjustmentPct) / 10000);

  // 110.14(C): the termination column caps the corrected ampacity; a termination
  // rated above the insulation cannot lift it past the insulation's column.
  const terminalColumn: TempColumnC = terminalTempC < insulationTempC ? terminalTempC : insulationTempC;
  const terminalLimitA = terminalColumn === insulationTempC ? baseA : (baseAmpacityAtIndex(copper, terminalColumn, si) as number);

  const cappedByTerminal = terminalLimitA < correctedA;
  const perSetA = cappedByTerminal ? terminalLimitA : correctedA;
  const ampacityA = round2(perSetA * parallelSets);
  const governedBy: AmpacityWorking['governedBy'] = cappedByTerminal
    ? 'terminal-rating'
    : ambientPct === 100 && adjustmentPct === 100
      ? 'insulation-column'
      : 'correction-and-adjustment';

  const smallMaxA = smallConductorMaxOcpdAtIndex(edition, mi, si);

  const steps: AmpacityStep[] = [
    { id: 'base', text: baseText(mi, si, ins.index, material, size, insulation, insulationTempC, baseA), value: baseA, cites: cites.base },
    { id: 'ambient', text: ambientText(cites, insulationTempC, ambientC, ambientPct), value: ambientFactor, cites: cites.ambient },
    { id: 'adjustment', text: adjustmentText(currentCarrying, adjustmentPct), value: adjFactor, cites: cites.adjustment },
    {
      id: 'corrected',
      text: correctedText(baseA, ambientPct, adjustmentPct, correctedA),
      value: correctedA,
      cites: cites.corrected,
    },
    { id: 'terminal', text: terminalText(mi, si, terminalTempC, insulationTempC, terminalLimitA), value: terminalLimitA, cites: cites.terminal },
    {
      id: 'per-set',
      text: perSetText(correctedA, terminalLimitA),
      value: perSetA,
      cites: cites.terminal,
    },
    {
      id: 'parallel',
      text: parallelText(parallelSets, perSetA, ampacityA),
      value: ampacityA,
      cites: cites.parallel,
    },
  ];
  if (smallMaxA !== null) steps.push({ id: 'small-conductor', text: smallText(mi, si, material, size, edition, smallMaxA), value: smallMaxA, cites: cites.small });

  return {
    ok: true,
    working: {
      insulationTempC,
      baseA,
      ambientFactor,
      currentCarrying,
      adjustmentFactor: adjFactor,
      correctedA,
      terminalTempC,
      terminalLimitA,
      perSetA,
      parallelSets,
      ampacityA,
      governedBy,
      smallConductorMaxOcpdA: smallMaxA,
      steps,
    },
  };
}

/** A size and its working, as smallestSizeWithAmpacity finds it. */
export interface SizedAmpacity {
  size: ConductorSize;
  working: AmpacityWorking;
}

/**
 * Smallest size (CONDUCTOR_SIZES order) whose ampacity is at least minA for
 * the other facts given, skipping sizes that are not valid for them (e.g.
 * parallel sets under 1/0 AWG, aluminum 14 AWG) and sizes `filter` rejects;
 * null when even 2000 kcmil falls short.
 */
export function smallestSizeWithAmpacity(
  inputWithoutSize: Omit<AmpacityInput, 'size'>,
  minA: number,
  filter?: (size: ConductorSize, working: AmpacityWorking) => boolean,
): SizedAmpacity | null {
  const start = inputWithoutSize.parallelSets > 1 ? SIZE_INDEX_1_0 : 0;
  for (let i = start; i < N_SIZES; i++) {
    const size = CONDUCTOR_SIZES[i]!;
    const r = computeAmpacity({ ...inputWithoutSize, size });
    if (!r.ok) {
      // Only a size-dependent failure lets a larger size succeed; any other
      // field is wrong for every size.
      if (r.field === 'size' || r.field === 'parallelSets') continue;
      return null;
    }
    if (r.working.ampacityA >= minA && (filter === undefined || filter(size, r.working))) return { size, working: r.working };
  }
  return null;
}

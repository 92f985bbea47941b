import type { CodeEdition } from '../model/schema';
import { isStandardRating, largestStandardRatingAtMost, nextStandardRatingAbove, type OcpdDevice } from './standardRatings';

/**
 * Transformer full-load current and overcurrent protection of transformers
 * of 1000 V and less, NFPA 70 Table 450.3(B) (same in 2020 and 2023).
 *
 * Source: Table 450.3(B) and its Note 1 (next higher standard rating when
 * 125 % does not fall on one), from memory, checked against public
 * reproductions. Full-load current: FLA = kVA·1000 / (√3·V) three-phase,
 * kVA·1000 / V single-phase (common practice).
 * Independent check: test/core/tables/transformer.test.ts (published worked
 * values: 75 kVA at 480 V = 90.2 A, at 208 V = 208.2 A; 125 % of 90.2 A
 * = 112.8 A → 125 A device).
 *
 * Not modeled: Note 2 (several secondary devices counted together, up to six)
 * and Note 3 (coordinated thermal overload protection by the manufacturer).
 */
export const TRANSFORMER_PROTECTION_SOURCE = 'NFPA 70-2023 / 2020 Table 450.3(B), from memory, checked against public reproductions';

/** Table 450.3(B) protection method. */
export type TransformerProtectionScheme = 'primary-only' | 'primary-and-secondary';

export interface TransformerOcpdLimit {
  /** Largest rating as a percentage of the rated current. */
  maxPct: number;
  /** rated current × maxPct / 100, A, rounded to 0.01 A. */
  maxA: number;
  /** Note 1 lets the next higher standard rating be used. */
  nextStandardAllowed: boolean;
  /**
   * Largest 240.6(A) rating that complies: the next standard rating at or
   * above maxA when Note 1 applies, otherwise the largest at or below maxA;
   * null when no standard rating complies.
   */
  allowedA: number | null;
}

/** Rated full-load current, A: kVA·1000 / (√3·V) for three-phase, kVA·1000 / V single-phase. */
export function transformerFullLoadA(kva: number, volts: number, phases: 1 | 3): number {
  return phases === 3 ? (kva * 1000) / (Math.sqrt(3) * volts) : (kva * 1000) / volts;
}

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

function limit(ratedA: number, maxPct: number, nextStandardAllowed: boolean, edition: CodeEdition, device: OcpdDevice): TransformerOcpdLimit {
  const maxA = round2((ratedA * maxPct) / 100);
  let allowedA: number | null;
  if (nextStandardAllowed) allowedA = isStandardRating(maxA, edition, device) ? maxA : nextStandardRatingAbove(maxA, edition, device);
  else allowedA = largestStandardRatingAtMost(maxA, edition, device);
  return { maxPct, maxA, nextStandardAllowed, allowedA };
}

/**
 * Table 450.3(B) largest primary OCPD. Primary only: 125 % (Note 1 round-up)
 * at 9 A and more, 167 % from 2 A to under 9 A, 300 % under 2 A. Primary and
 * secondary: 250 % with no round-up.
 */
export function maxPrimaryOcpd(
  primaryFlaA: number,
  scheme: TransformerProtectionScheme,
  edition: CodeEdition,
  device: OcpdDevice,
): TransformerOcpdLimit {
  if (scheme === 'primary-and-secondary') return limit(primaryFlaA, 250, false, edition, device);
  if (primaryFlaA >= 9) return limit(primaryFlaA, 125, true, edition, device);
  if (primaryFlaA >= 2) return limit(primaryFlaA, 167, false, edition, device);
  return limit(primaryFlaA, 300, false, edition, device);
}

/**
 * Table 450.3(B) largest secondary OCPD when the transformer is protected on
 * primary and secondary: 125 % (Note 1 round-up) at 9 A and more, 167 % under 9 A.
 */
export function maxSecondaryOcpd(secondaryFlaA: number, edition: CodeEdition, device: OcpdDevice): TransformerOcpdLimit {
  if (secondaryFlaA >= 9) return limit(secondaryFlaA, 125, true, edition, device);
  return limit(secondaryFlaA, 167, false, edition, device);
}

/**
 * The largest device rating a limit allows: the next standard rating when
 * Note 1 allows round-up, otherwise the percentage value itself (a device
 * at or under it complies even where no standard rating lies below it, as
 * for small transformers).
 */
export function ocpdLimitA(limit: TransformerOcpdLimit): number {
  return limit.nextStandardAllowed && limit.allowedA !== null ? limit.allowedA : limit.maxA;
}

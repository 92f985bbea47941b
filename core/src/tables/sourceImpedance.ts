/**
 * Typical impedances for the short-circuit study where the drawing gives no
 * nameplate value. Nameplate and data-sheet values always win; every default
 * used is named in the study's working.
 *
 * Source: common practice, consistent with the typical values of IEEE Std 141
 * (Red Book) as publicly summarized; from memory. Where a range is typical,
 * the end that gives the larger fault current is taken: a higher X/R leaves
 * less of the source impedance in phase with a conductor's resistance, and a
 * lower X″d lets a generator feed more current.
 * Independent check: test/core/tables/sourceImpedance.test.ts (monotone in kVA,
 * within the published typical ranges).
 */
export const SOURCE_IMPEDANCE_SOURCE = 'common practice (typical values consistent with IEEE Std 141), from memory';

/** Typical transformer X/R by three-phase kVA: the upper end of the liquid-filled range. */
const TRANSFORMER_XR: readonly (readonly [maxKva: number, xOverR: number])[] = [
  [45, 3],
  [150, 4],
  [300, 5],
  [500, 5],
  [750, 6],
  [1000, 7],
  [1500, 8],
  [Number.POSITIVE_INFINITY, 10],
];

/** Typical X/R of a transformer of this rating (common practice). */
export function typicalTransformerXOverR(kva: number): number {
  for (const [maxKva, xr] of TRANSFORMER_XR) if (kva <= maxKva) return xr;
  return 10;
}

/** Generator subtransient reactance X″d, per unit on its own kVA: the low end of the typical 0.10–0.25 (common practice). */
export const TYPICAL_GENERATOR_XDPP_PU = 0.12;
/** Generator X/R (X″d over armature resistance), typically 10–40, lower for small sets (common practice). */
export const TYPICAL_GENERATOR_X_OVER_R = 15;
/** Utility source X/R when the available fault current is given without one (common practice). */
export const TYPICAL_UTILITY_X_OVER_R = 10;

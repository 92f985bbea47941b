import type { ConductorSize, Material } from '../model/schema';
import { conductorAreaCmil } from '../tables/conductorProperties';

/**
 * Relative cost of a conductor configuration, per foot of run and per phase. There is no
 * published price table to cite and prices move, so the sizing search ranks by a stated,
 * monotone proxy instead of money:
 *
 *   cost per ft = sets × (area in kcmil × material factor + installation term)
 *
 * - Metal: proportional to the cross-section (Chapter 9 Table 8 area), the way conductor
 *   prices are quoted per unit of metal.
 * - Material factor: copper 1, aluminum 0.4, copper-clad aluminum 0.5. Aluminum has about
 *   30 % of copper's density (2.70 vs 8.89 g/cm³) and its metal costs less per kilogram; the
 *   factors are a common-practice proxy, not a price.
 * - Installation term: 250 copper-kcmil equivalents per conductor, for pulling, two
 *   terminations and the share of a raceway each parallel set adds (310.10(G)(4): each set in
 *   a raceway of its own, with the same characteristics). A proxy chosen so fewer, larger sets
 *   win up to about 500 kcmil, as designers commonly prefer (common practice).
 *
 * Monotone: a larger size, more sets or a costlier material never costs less.
 */
export const MATERIAL_COST_FACTOR: Readonly<Record<Material, number>> = Object.freeze({ cu: 1, al: 0.4, 'cu-clad-al': 0.5 });
export const INSTALLATION_KCMIL_PER_CONDUCTOR = 250;

/** The proxy as the UI and the CLI state it. */
export const COST_BASIS =
  'Relative cost, not a price: per foot and per set, the conductor area in kcmil × a material factor (copper 1, aluminum 0.4, copper-clad aluminum 0.5) ' +
  `plus ${INSTALLATION_KCMIL_PER_CONDUCTOR} for installing each conductor (pulling, terminations, a raceway per set). A common-practice proxy; price the chosen design with current quotes.`;

export interface CostedConfig {
  size: ConductorSize;
  material: Material;
  parallelSets: number;
}

/** Relative cost per foot of one phase of the configuration (see the header). */
export function costPerFt(c: CostedConfig): number {
  return c.parallelSets * ((conductorAreaCmil(c.size) / 1000) * MATERIAL_COST_FACTOR[c.material] + INSTALLATION_KCMIL_PER_CONDUCTOR);
}

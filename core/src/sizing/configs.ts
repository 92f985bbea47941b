import { CONDUCTOR_SIZES, type Material } from '../model/schema';
import { SIZE_INDEX_1_0, SIZE_INDEX_14 } from '../tables/sizes';
import { costPerFt } from './cost';
import type { SizingConfig } from './trial';

/**
 * Most conductors in parallel per phase the search tries. 310.10(G) sets no maximum; past
 * eight sets designers turn to busway or a higher voltage (common practice).
 */
export const MAX_PARALLEL_SETS = 8;

const cache = new Map<string, readonly SizingConfig[]>();

/**
 * Every configuration of the given materials, cheapest first by the cost proxy (ties: fewer
 * sets, then the materials' order): one conductor per phase from 14 AWG, and 2 to `maxSets`
 * in parallel from 1/0 AWG (310.10(G)(1)). Shared and frozen.
 */
export function configsByCost(materials: readonly Material[], maxSets: number = MAX_PARALLEL_SETS): readonly SizingConfig[] {
  const key = `${materials.join(',')}/${maxSets}`;
  let list = cache.get(key);
  if (list) return list;
  const out: SizingConfig[] = [];
  for (const material of materials) {
    for (let sets = 1; sets <= maxSets; sets++) {
      for (let i = sets > 1 ? SIZE_INDEX_1_0 : SIZE_INDEX_14; i < CONDUCTOR_SIZES.length; i++) out.push(Object.freeze({ size: CONDUCTOR_SIZES[i]!, material, parallelSets: sets }));
    }
  }
  const order = (m: Material) => materials.indexOf(m);
  out.sort((a, b) => costPerFt(a) - costPerFt(b) || a.parallelSets - b.parallelSets || order(a.material) - order(b.material));
  list = Object.freeze(out);
  cache.set(key, list);
  return list;
}

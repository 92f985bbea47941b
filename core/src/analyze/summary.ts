import { formatNumber } from '../rules/define';
import type { RunVerdict } from './classify';
import { RULES_BY_ID } from '../rules/index';
import { VERDICT_LABELS, type RuleTrial } from './types';

const PROTECTION_RULE_IDS: ReadonlySet<string> = new Set(['protected', 'protected-next-size']);

/** The trial closest to holding: fewest failed conditions (a failed length weighs 1 to 2 by how far over), earliest in code order on a tie. */
export function nearestTrial(tried: readonly RuleTrial[]): RuleTrial | null {
  let best: RuleTrial | null = null;
  let bestFails = Number.POSITIVE_INFINITY;
  // A conductor 240.4 does not protect is a tap conductor by definition, so its nearest rule is a tap rule;
  // the fixes still offer the size that 240.4 would protect.
  const taps = tried.filter((t) => !PROTECTION_RULE_IDS.has(t.ruleId));
  for (const t of taps.length > 0 ? taps : tried) {
    if (t.outcome === 'holds') return t;
    // A run's length is set by the building, its size is not: a failed length counts more, the further
    // over the limit the more (up to 2), so a 30 ft tap is nearer the 25 ft rule than the 10 ft one.
    const limit = RULES_BY_ID.get(t.ruleId)?.lengthLimit;
    let fails = 0;
    for (const c of t.conditions) {
      if (c.status !== 'fail') continue;
      const lengthFt = c.data.lengthFt ?? c.data.totalFt;
      fails += limit && c.id === limit.conditionId && typeof lengthFt === 'number' ? 1 + Math.min(1, (lengthFt - limit.maxFt) / limit.maxFt) : 1;
    }
    if (fails < bestFails) {
      best = t;
      bestFails = fails;
    }
  }
  return best;
}

export function failedTexts(t: RuleTrial, status: 'fail' | 'unknown' = 'fail'): string[] {
  return t.conditions.filter((c) => c.status === status).map((c) => c.text);
}

/** Why a run has no verdict yet, in a reviewer's words. */
export function incompleteReason(v: RunVerdict): string {
  switch (v.supply.kind) {
    case 'none':
      return 'nothing upstream supplies it; connect it to a source';
    case 'several':
      return 'it is fed from more than one supply; model the transfer equipment or remove a supply';
    case 'cycle':
      return 'it lies on a loop; a one-line diagram must run from source to load';
    default:
      break;
  }
  // Only rules that nothing else rules out: a missing fact matters where it alone decides.
  const unknown = v.tried.filter((t) => t.outcome === 'unknown').flatMap((t) => t.conditions.filter((c) => c.status === 'unknown').map((c) => c.id));
  const missing = new Set<string>();
  if (v.facts.size === null) missing.add('the size (enter the conductor size)');
  else if (v.facts.ampacityA === null) missing.add('an ampacity (check size, material, ambient and parallel sets)');
  if (v.facts.supplyOcpdA === null && v.family === 'fed-by-ocpd') missing.add('the rating of the device ahead');
  if (v.family === 'secondary' && v.facts.transformer?.primaryOcpdA == null) missing.add('the rating of the primary device');
  for (const id of unknown) {
    if (id === 'length' || id === 'total') missing.add('the length (lengthFt)');
    else if (id === 'device' && (v.facts.motor || v.facts.hvac)) missing.add(v.facts.supplyOcpdA === null ? 'the rating of the device ahead' : 'the fuse type ahead (time-delay or not, Table 430.52)');
    // Without an ampacity these compare nothing: only a missing rating at the end is worth asking for.
    else if ((id === 'termination' || id === 'device') && (v.facts.ampacityA !== null || v.facts.termination.ratingA === null)) missing.add('the rating of the device or equipment it ends in');
    else if (id === 'horizontal' || id === 'height' || id === 'noPenetration') missing.add('the high-bay facts (horizontal run, tap height, penetrations)');
    else if (id === 'accessible') missing.add('where the disconnecting means is');
    else if (id === 'load') missing.add('the system voltage for the load');
  }
  if (missing.size === 0 && v.supply.kind === 'run') return 'the conductor it is supplied from is itself incomplete';
  return `needs ${[...missing].join(', ') || 'more data'}`;
}

export function describeRun(v: RunVerdict): string {
  const f = v.facts;
  const label = VERDICT_LABELS[v.verdict];
  const A = f.ampacityA === null ? '?' : formatNumber(f.ampacityA);
  const R = f.supplyOcpdA === null ? '?' : formatNumber(f.supplyOcpdA);
  switch (v.verdict) {
    case 'protected':
      return `Protected: the ${R} A device does not exceed the ${A} A ampacity (240.4).`;
    case 'protected-next-size':
      return `Protected by the next standard rating: ${R} A over ${A} A (240.4(B)).`;
    case 'service':
    case 'generator': {
      const t = v.tried[0];
      const fails = t ? failedTexts(t) : [];
      // A service shows the load it carries: the calculated load (230.42(A)) beside the ampacity.
      const load = v.verdict === 'service' && f.calculatedLoadA !== null ? ` Calculated load ${formatNumber(f.calculatedLoadA)} A on ${A} A.` : '';
      return fails.length > 0 ? `${capital(label)} conductors; fails ${t!.cites.section}: ${fails.join(' ')}${load}` : `${capital(label)} conductors (${v.rule?.section ?? ''}).${load}`;
    }
    case 'tap-from-tap':
      return `Tap from a tap: supplied from ${f.suppliedFrom?.conductorIds.join(' → ') ?? '?'}, itself "${f.suppliedFrom ? VERDICT_LABELS[f.suppliedFrom.verdict] : '?'}" (240.21).`;
    case 'unprotected': {
      if (f.suppliedFrom) return `Unprotected: fed from unprotected conductor ${f.suppliedFrom.conductorIds.join(' → ')} ("${VERDICT_LABELS[f.suppliedFrom.verdict]}").`;
      const n = nearestTrial(v.tried);
      if (!n) return 'Unprotected: no rule fits.';
      return `Unprotected: no rule fits. Nearest is ${n.cites.section}, which fails: ${failedTexts(n).join(' ')}`;
    }
    case 'incomplete':
      return `Incomplete: ${incompleteReason(v)}.`;
    default: {
      const len = f.lengthFt === null ? '' : `${formatNumber(f.lengthFt)} ft, `;
      const from = v.family === 'secondary' ? `secondary of ${f.transformer?.label ?? '?'}` : `from the ${R} A device`;
      return `${capital(label)} under ${v.rule?.section ?? '?'}: ${len}${A} A, ${from}.`;
    }
  }
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

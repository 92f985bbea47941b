import type { Project } from '../model/schema';
import { runRule, type Rule } from '../rules/define';
import type { RunFacts } from '../rules/facts';
import { FEEDER_TAP_RULES, PROTECTION_RULES, SECONDARY_RULES, generatorRule, serviceRule, tapFromTap, tapTransformer } from '../rules/index';
import { edgeFrom, type Graph } from '../topology/graph';
import { sizeIndexOf } from '../tables/sizes';
import type { Runs } from '../topology/runs';
import { effectiveRatingA, isOcpd, transformerFacts } from './facts';
import type { ConductorRole, RuleTrial, Verdict } from './types';

/** What the upstream walk from a node ends on. */
export type Supply =
  | { kind: 'ocpd' | 'utility' | 'generator' | 'transformer'; node: number }
  | { kind: 'run'; run: number }
  | { kind: 'none' | 'several' | 'cycle'; node: number };

export type Family = 'fed-by-ocpd' | 'secondary' | 'service' | 'generator' | 'on-tap' | 'no-supply';

export interface RunVerdict {
  verdict: Verdict;
  rule: Rule | null;
  family: Family;
  role: ConductorRole;
  supply: Supply;
  /** The OCPD whose rating the run is judged against (node index), or -1. */
  deviceNode: number;
  /** The generator node feeding the run, for generator conductors. */
  generatorNode: number;
  facts: RunFacts;
  tried: RuleTrial[];
  /** The rules of the run's family, in code order, for fix suggestions. */
  candidates: readonly Rule[];
}

const SOURCE_KINDS = new Set(['utility', 'generator', 'transformer', 'breaker', 'fuse']);
const FED_BY_OCPD_RULES: readonly Rule[] = [...PROTECTION_RULES, ...FEEDER_TAP_RULES];

/**
 * Walks the network once in supply-to-load order. Each node learns what
 * supplies it; each run is judged when its supply node is reached, so the run
 * it may be tapped from is always judged first.
 */
export function classifyRuns(
  project: Project,
  g: Graph,
  runs: Runs,
  order: Int32Array,
  count: number,
  onCycle: Uint8Array,
  baseFacts: readonly RunFacts[],
): RunVerdict[] {
  const nodeSupply: Supply[] = new Array(g.nodes.length);
  const results: (RunVerdict | undefined)[] = new Array(runs.members.length);
  const secondariesOf = new Map<number, RunFacts[]>();
  for (let r = 0; r < runs.members.length; r++) {
    const from = g.conductorFrom[runs.members[r]![0]!]!;
    if (from >= 0 && g.nodes[from]!.kind === 'transformer') {
      const list = secondariesOf.get(from) ?? [];
      list.push(baseFacts[r]!);
      secondariesOf.set(from, list);
    }
  }
  const below = ocpdBelow(g, order, count);

  const supplyAt = (v: number): Supply => {
    const kind = g.nodes[v]!.kind;
    if (SOURCE_KINDS.has(kind)) {
      return { kind: kind === 'breaker' || kind === 'fuse' ? 'ocpd' : (kind as 'utility' | 'generator' | 'transformer'), node: v };
    }
    return nodeSupply[v]!;
  };

  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const ins = g.inEdges[v]!;
    if (ins.length === 0) nodeSupply[v] = { kind: 'none', node: v };
    else if (ins.length > 1) nodeSupply[v] = { kind: 'several', node: v };
    else {
      const e = ins[0]!;
      nodeSupply[v] = e >= 0 ? { kind: 'run', run: runs.runOf[e]! } : supplyAt(edgeFrom(g, e));
    }
    for (const e of g.outEdges[v]!) {
      if (e < 0) continue;
      const r = runs.runOf[e]!;
      if (runs.members[r]![0] !== e) continue;
      results[r] = judgeRun(r, supplyAt(v));
    }
  }
  for (let r = 0; r < runs.members.length; r++) {
    if (results[r]) continue;
    const from = g.conductorFrom[runs.members[r]![0]!]!;
    results[r] = incomplete(baseFacts[r]!, { kind: 'cycle', node: from }, 'unknown');
  }
  return results as RunVerdict[];

  function judgeRun(r: number, supply: Supply): RunVerdict {
    // The base facts are this stage's own copy: fill in the supply facts in place.
    const facts: RunFacts = baseFacts[r]!;
    const endNode = g.conductorTo[runs.members[r]![runs.members[r]!.length - 1]!]!;
    const endsAtTransformer = endNode >= 0 && g.nodes[endNode]!.kind === 'transformer';
    const feedsDevice = endNode >= 0 && (isOcpd(g.nodes[endNode]!) || below[endNode] === 1);
    const feederRole: ConductorRole = endsAtTransformer ? 'transformer-primary' : feedsDevice ? 'feeder' : 'branch';
    if (endsAtTransformer) {
      facts.transformer = transformerFacts(g, endNode, { ratingA: null, id: null });
      facts.secondaries = secondariesOf.get(endNode) ?? [];
    }
    switch (supply.kind) {
      case 'none':
      case 'several':
      case 'cycle':
        return incomplete(facts, supply, 'unknown');
      case 'utility':
        return fixed(facts, supply, serviceRule, 'service', 'service', -1, -1);
      case 'generator':
        facts.generator = generatorFacts(supply.node);
        return fixed(facts, supply, generatorRule, 'generator', 'generator', -1, supply.node);
      case 'ocpd':
        return fedByOcpd(facts, supply, supply.node, feederRole);
      case 'transformer':
        return secondary(facts, supply, supply.node);
      case 'run': {
        const up = results[supply.run]!;
        if (up.family === 'service') return fixed(facts, supply, serviceRule, 'service', 'service', -1, -1);
        if (up.family === 'generator') {
          facts.generator = generatorFacts(up.generatorNode);
          return fixed(facts, supply, generatorRule, 'generator', 'generator', -1, up.generatorNode);
        }
        if (up.verdict === 'incomplete') return incomplete(facts, supply, feederRole);
        if (up.verdict === 'protected' || up.verdict === 'protected-next-size') {
          return fedByOcpd(facts, supply, up.deviceNode, feederRole);
        }
        // The supply point lies on a tap or a secondary: 240.21 forbids tapping it again.
        facts.suppliedFrom = { conductorIds: up.facts.conductorIds, verdict: up.verdict };
        facts.supplyOcpdA = up.facts.supplyOcpdA;
        facts.supplyOcpdId = up.facts.supplyOcpdId;
        const trial = runRule(tapFromTap, facts);
        return { verdict: 'tap-from-tap', rule: tapFromTap, family: 'on-tap', role: feederRole, supply, deviceNode: up.deviceNode, generatorNode: -1, facts, tried: [trial], candidates: [] };
      }
    }
  }

  function generatorFacts(v: number): RunFacts['generator'] {
    const n = g.nodes[v]!;
    if (n.kind !== 'generator') return null;
    const nameplateA = n.phases === 3 ? (n.kva * 1000) / (Math.sqrt(3) * n.voltsLL) : (n.kva * 1000) / n.voltsLL;
    return { id: n.id, kva: n.kva, nameplateA, overloadPreventedByDesign: n.overloadPreventedByDesign };
  }

  function fixed(facts: RunFacts, supply: Supply, rule: Rule, verdict: Verdict, role: ConductorRole, device: number, gen: number): RunVerdict {
    const trial = runRule(rule, facts);
    return { verdict, rule, family: verdict === 'service' ? 'service' : 'generator', role, supply, deviceNode: device, generatorNode: gen, facts, tried: [trial], candidates: [] };
  }

  function incomplete(facts: RunFacts, supply: Supply, role: ConductorRole): RunVerdict {
    return { verdict: 'incomplete', rule: null, family: 'no-supply', role, supply, deviceNode: -1, generatorNode: -1, facts, tried: [], candidates: [] };
  }

  function fedByOcpd(facts: RunFacts, supply: Supply, device: number, role: ConductorRole): RunVerdict {
    const node = g.nodes[device]!;
    facts.supplyOcpdA = effectiveRatingA(node);
    facts.supplyOcpdId = node.id;
    facts.supplyOcpdKind = node.kind === 'fuse' ? 'fuse' : 'breaker';
    if (facts.transformer) facts.transformer = { ...facts.transformer, primaryOcpdA: facts.supplyOcpdA, primaryOcpdId: node.id };
    const tried: RuleTrial[] = [];
    let verdict: Verdict | null = null;
    let rule: Rule | null = null;
    for (let i = 0; i < PROTECTION_RULES.length && verdict === null; i++) {
      const r = PROTECTION_RULES[i]!;
      const t = protectionTrial(r, facts);
      tried.push(t);
      if (t.outcome === 'holds') {
        verdict = r.verdict!;
        rule = r;
      } else if (t.outcome === 'unknown' && i === 0) {
        // Without the ampacity or the rating nothing further can be decided.
        verdict = 'incomplete';
      }
    }
    let candidates = FED_BY_OCPD_RULES;
    if (verdict === null && role === 'branch') {
      // 240.21(B) covers feeder taps; a branch circuit (no OCPD below it) that 240.4 does not protect is simply unprotected.
      verdict = 'unprotected';
      candidates = PROTECTION_RULES;
    } else if (verdict === null) {
      const v = firstHolding(FEEDER_TAP_RULES, facts, tried);
      verdict = v.verdict;
      rule = v.rule;
    }
    return { verdict, rule, family: 'fed-by-ocpd', role, supply, deviceNode: device, generatorNode: -1, facts, tried, candidates };
  }

  function secondary(facts: RunFacts, supply: Supply, tx: number): RunVerdict {
    const primary = primarySupply(tx);
    const device = primary.device >= 0 ? g.nodes[primary.device]! : null;
    facts.transformer = transformerFacts(g, tx, { ratingA: device ? effectiveRatingA(device) : null, id: device?.id ?? null });
    // A transformer ahead of the service equipment (fed by service conductors, no OCPD) has service conductors on its secondary.
    if (primary.service) return fixed(facts, supply, serviceRule, 'service', 'service', -1, -1);
    const base = { family: 'secondary' as Family, role: 'transformer-secondary' as ConductorRole, supply, deviceNode: primary.device, generatorNode: -1, facts };
    if (primary.run) {
      const pv = primary.run.verdict;
      if (pv === 'incomplete') return { ...base, verdict: 'incomplete', rule: null, tried: [], candidates: [] };
      if (pv !== 'protected' && pv !== 'protected-next-size') {
        // 240.21(C)(5): a transformer supplied by a feeder tap is judged under 240.21(B)(3), on the primary.
        const trial = primary.run.tried.find((t) => t.ruleId === tapTransformer.id) ?? runRule(tapTransformer, primary.run.facts);
        const holds = pv === 'tap-transformer' && trial.outcome === 'holds';
        return { ...base, verdict: holds ? 'tap-transformer' : trial.outcome === 'unknown' ? 'incomplete' : 'unprotected', rule: holds ? tapTransformer : null, tried: [trial], candidates: [] };
      }
    }
    if (facts.transformer.primaryOcpdA === null) return { ...base, verdict: 'incomplete', rule: null, tried: [], candidates: SECONDARY_RULES };
    const tried: RuleTrial[] = [];
    const v = firstHolding(SECONDARY_RULES, facts, tried);
    return { ...base, verdict: v.verdict, rule: v.rule, tried, candidates: SECONDARY_RULES };
  }

  /** The device protecting a transformer's primary, and the primary run when there is one. */
  function primarySupply(tx: number): { device: number; run: RunVerdict | null; service: boolean } {
    const ins = g.inEdges[tx]!;
    if (ins.length !== 1) return { device: -1, run: null, service: false };
    const e = ins[0]!;
    let run: RunVerdict | null = null;
    if (e >= 0) run = results[runs.runOf[e]!] ?? null;
    else {
      const s = supplyAt(edgeFrom(g, e));
      if (s.kind === 'ocpd') return { device: s.node, run: null, service: false };
      if (s.kind === 'utility') return { device: -1, run: null, service: true };
      if (s.kind === 'run') run = results[s.run] ?? null;
    }
    return { device: run?.deviceNode ?? -1, run, service: run?.family === 'service' };
  }
}

/**
 * Protection trials depend on four numbers only, and a riser repeats the same
 * few combinations thousands of times (20 A on 12 AWG…), so equal trials are
 * shared. Trials are read-only.
 */
const protectionTrials = new Map<number, Map<number, RuleTrial>>();
const MAX_SHARED_TRIALS = 4096;
let sharedTrials = 0;

function protectionTrial(rule: Rule, f: RunFacts): RuleTrial {
  const R = f.supplyOcpdA;
  const A = f.ampacityA;
  // Two exact integers instead of a string: the facts the 240.4 rules read, packed.
  const r100 = R === null ? -1 : Math.round(R * 100);
  const a100 = A === null ? -1 : Math.round(A * 100);
  if (R === null || A === null || r100 !== R * 100 || a100 !== A * 100 || r100 >= 1e7 || a100 >= 1e7) return runRule(rule, f);
  const kind = f.supplyOcpdKind === 'fuse' ? 1 : f.supplyOcpdKind === 'breaker' ? 0 : 2;
  const outer =
    ((((rule === PROTECTION_RULES[0] ? 0 : 1) * 2 + (f.edition === 2020 ? 0 : 1)) * 3 + kind) * 2 + (f.multioutletCordAndPlug ? 1 : 0)) * 30 * 100 +
    sizeIndexOf(f.size) * 100 +
    (f.smallConductorMaxOcpdA ?? 0);
  const inner = r100 * 1e7 + a100;
  let byRA = protectionTrials.get(outer);
  if (!byRA) protectionTrials.set(outer, (byRA = new Map()));
  let t = byRA.get(inner);
  if (!t) {
    t = runRule(rule, f);
    if (++sharedTrials > MAX_SHARED_TRIALS) {
      protectionTrials.clear();
      sharedTrials = 0;
    }
    byRA.set(inner, t);
  }
  return t;
}

/** Try rules in code order; every rule is tried and kept, the first that holds names the verdict. */
function firstHolding(rules: readonly Rule[], facts: RunFacts, tried: RuleTrial[]): { verdict: Verdict; rule: Rule | null } {
  let winner: Rule | null = null;
  let unknown = false;
  for (const rule of rules) {
    const t = runRule(rule, facts);
    tried.push(t);
    if (t.outcome === 'holds' && winner === null) winner = rule;
    if (t.outcome === 'unknown') unknown = true;
  }
  if (winner) return { verdict: winner.verdict!, rule: winner };
  return { verdict: unknown ? 'incomplete' : 'unprotected', rule: null };
}

/** For each node: is there an OCPD or transformer anywhere on its load side? Decides feeder vs branch circuit. */
function ocpdBelow(g: Graph, order: Int32Array, count: number): Uint8Array {
  const below = new Uint8Array(g.nodes.length);
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    for (const e of g.outEdges[v]!) {
      const w = e >= 0 ? g.conductorTo[e]! : g.linkTo[-e - 1]!;
      const n = g.nodes[w]!;
      if (below[w] || isOcpd(n) || n.kind === 'transformer') {
        below[v] = 1;
        break;
      }
    }
  }
  return below;
}

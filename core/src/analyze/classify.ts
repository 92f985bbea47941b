import { runRule, type Rule } from '../rules/define';
import type { RunFacts } from '../rules/facts';
import { FEEDER_TAP_RULES, OWN_ARTICLE_RULES, PROTECTION_RULES, SECONDARY_RULES, generatorRule, serviceRule, tapFromTap, tapTransformer } from '../rules/index';
import { edgeFrom, KIND, type Graph } from '../topology/graph';
import { isJoint } from '../topology/runs';
import { joinFacts } from './runFacts';
import type { FactsContext } from './context';
import { deviceTypeOf, effectiveRatingA, generatorFacts, isOcpdKind, transformerFacts } from './equipment';
import { firstHolding, protectionTrial, triedList } from './trials';
import { FAILING_VERDICTS, type ConductorRole, type RuleTrial, type Verdict } from './types';

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

const FED_BY_OCPD_RULES: readonly Rule[] = [...PROTECTION_RULES, ...FEEDER_TAP_RULES];

/** The state of one classification pass: what each node is supplied by and each run's verdict so far. */
interface Walk {
  readonly ctx: FactsContext;
  readonly nodeSupply: Supply[];
  readonly results: (RunVerdict | undefined)[];
  /** Secondary runs of each transformer node. */
  readonly secondariesOf: ReadonlyMap<number, RunFacts[]>;
  /** Per node: an OCPD or transformer lies somewhere on its load side. */
  readonly below: Uint8Array;
  /** Runs judged as one (a tap or secondary continued through a joint), by their shared verdict. */
  readonly joined: Map<RunVerdict, number[]>;
  /** One read-only Supply per source node and per run, made when first asked for (not one per conductor). */
  readonly sources: (Supply | undefined)[];
  readonly onRuns: (Supply | undefined)[];
  /** The run being judged: one object rewritten for each run (no judge keeps it), see toJudge. */
  readonly judging: RunToJudge;
}

/** One run about to be judged: the one input of every judge below. */
interface RunToJudge {
  readonly walk: Walk;
  /** Run index. */
  run: number;
  supply: Supply;
  /** The base facts; this stage's own copy, so the judges fill in the supply facts in place. */
  facts: RunFacts;
  /** The role the run has if something protects it: feeder, branch circuit or transformer primary. */
  role: ConductorRole;
}

/** A walk of the classifier; `judging` starts out on no run. */
function newWalk(ctx: FactsContext, parts: Omit<Walk, 'ctx' | 'joined' | 'judging'>): Walk {
  const walk = { ctx, ...parts, joined: new Map(), judging: undefined as unknown as RunToJudge };
  walk.judging = { walk, run: -1, supply: NO_SUPPLY, facts: undefined as unknown as RunFacts, role: 'unknown' };
  return walk;
}
const NO_SUPPLY: Supply = Object.freeze({ kind: 'none', node: -1 });

/**
 * Stage: walks the network once in supply-to-load order. Each node learns
 * what supplies it; each run is judged when its supply node is reached, so
 * the run it may be tapped from is always judged first.
 */
export function classifyRuns(ctx: FactsContext): RunVerdict[] {
  return classifyRunsKeeping(ctx).verdicts;
}

/** What a classification pass learned about the network besides the verdicts, kept for re-judging runs (`rejudgeRuns`). */
export interface KeptWalk {
  readonly nodeSupply: readonly Supply[];
  /** Base facts of each transformer's secondary runs, by transformer node. */
  readonly secondariesOf: ReadonlyMap<number, RunFacts[]>;
  readonly below: Uint8Array;
}

/** `classifyRuns`, also returning what the walk learned (see KeptWalk). */
export function classifyRunsKeeping(ctx: FactsContext): { verdicts: RunVerdict[]; walk: KeptWalk } {
  const { graph: g, runs, order, count } = ctx;
  const { start, end } = runEnds(ctx);
  const walk = newWalk(ctx, {
    nodeSupply: new Array(g.nodes.length),
    results: new Array(runs.members.length),
    secondariesOf: secondariesByTransformer(ctx, start),
    below: ocpdBelow(g, order, count),
    sources: new Array(g.nodes.length),
    onRuns: new Array(runs.members.length),
  });
  // Supply-to-load: what supplies each node, and the point each run starts from.
  const runSupply = new Array<Supply | undefined>(runs.members.length);
  const onOtherRuns: number[] = [];
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    walk.nodeSupply[v] = nodeSupplyOf(walk, v);
    const outs = g.outEdges[v]!;
    for (let i = 0; i < outs.length; i++) {
      const e = outs[i]!;
      if (e < 0) continue;
      const r = runs.runOf[e]!;
      if (start[r] !== e) continue;
      const supply = supplyAt(walk, v);
      runSupply[r] = supply;
      if (supply.kind === 'run' || supply.kind === 'transformer') onOtherRuns.push(r);
    }
  }
  // A run supplied at an OCPD, a source or nothing reads no other run's verdict: those (most runs) are judged in
  // run order, which reads their facts and ends in the order they were made; then the runs supplied from another
  // run or a transformer, in supply-to-load order, so the run each reads is judged before it.
  for (let r = 0; r < runSupply.length; r++) {
    const supply = runSupply[r];
    if (supply && supply.kind !== 'run' && supply.kind !== 'transformer') walk.results[r] = judgeRun(toJudge(walk, r, supply, end[r]!));
  }
  for (const r of onOtherRuns) walk.results[r] = judgeRun(toJudge(walk, r, runSupply[r]!, end[r]!));
  for (let r = 0; r < runs.members.length; r++) {
    if (walk.results[r]) continue;
    const from = g.conductorFrom[start[r]!]!;
    walk.results[r] = incomplete({ walk, run: r, supply: { kind: 'cycle', node: from }, facts: ctx.facts[r]!, role: 'unknown' });
  }
  return { verdicts: walk.results as RunVerdict[], walk: { nodeSupply: walk.nodeSupply, secondariesOf: walk.secondariesOf, below: walk.below } };
}

/**
 * Judges runs `rs` again, in supply-to-load order, after their base facts (`ctx.facts[r]`) changed and
 * nothing else did: each is judged as the whole pass would, reading the verdicts of the runs it is
 * supplied from out of `verdicts`, where its own new verdict is written (see incremental.ts).
 */
export function rejudgeRuns(ctx: FactsContext, kept: KeptWalk, verdicts: RunVerdict[], rs: readonly number[]): void {
  const walk = newWalk(ctx, { nodeSupply: kept.nodeSupply as Supply[], results: verdicts, secondariesOf: kept.secondariesOf, below: kept.below, sources: [], onRuns: [] });
  const g = ctx.graph;
  for (const r of rs) {
    const members = ctx.runs.members[r]!;
    verdicts[r] = judgeRun(toJudge(walk, r, supplyAt(walk, g.conductorFrom[members[0]!]!), g.conductorTo[members[members.length - 1]!]!));
  }
}

/** What supplies node `v`, read against a kept walk: for a node added below what the walk has seen (incremental.ts). */
export function keptNodeSupply(ctx: FactsContext, kept: KeptWalk, v: number): Supply {
  return nodeSupplyOf(newWalk(ctx, { nodeSupply: kept.nodeSupply as Supply[], results: [], secondariesOf: kept.secondariesOf, below: kept.below, sources: [], onRuns: [] }), v);
}

/** What supplies node `v`: nothing, several supplies, a point on the run arriving at it, or what supplies the node bus-linked into it. */
function nodeSupplyOf(walk: Walk, v: number): Supply {
  const g = walk.ctx.graph;
  const ins = g.inEdges[v]!;
  if (ins.length === 0) return { kind: 'none', node: v };
  if (ins.length > 1) return { kind: 'several', node: v };
  const e = ins[0]!;
  return e >= 0 ? pointOnRun(walk, walk.ctx.runs.runOf[e]!) : supplyAt(walk, edgeFrom(g, e));
}

/**
 * Judges run `r` again on its own after its facts changed: a branch circuit fed straight from an
 * OCPD (`supply`), whose verdict depends on nothing upstream but the device (see incremental.ts).
 */
export function judgeFedByOcpd(ctx: FactsContext, r: number, supply: Supply, device: number, facts: RunFacts): RunVerdict {
  const walk = newWalk(ctx, { nodeSupply: [], results: [], secondariesOf: new Map(), below: new Uint8Array(0), sources: [], onRuns: [] });
  return fedByOcpd({ walk, run: r, supply, facts, role: 'branch' }, device);
}

/**
 * Each run's first conductor and the node it ends at, read in one pass in run order: the walk
 * below meets runs in supply-to-load order and then reads these instead of each run's member list.
 */
function runEnds(ctx: FactsContext): { start: Int32Array; end: Int32Array } {
  const { graph: g, runs } = ctx;
  const n = runs.members.length;
  const start = new Int32Array(n);
  const end = new Int32Array(n);
  for (let r = 0; r < n; r++) {
    const members = runs.members[r]!;
    start[r] = members[0]!;
    end[r] = g.conductorTo[members[members.length - 1]!]!;
  }
  return { start, end };
}

function secondariesByTransformer(ctx: FactsContext, start: Int32Array): Map<number, RunFacts[]> {
  const g = ctx.graph;
  const out = new Map<number, RunFacts[]>();
  for (let r = 0; r < start.length; r++) {
    const from = g.conductorFrom[start[r]!]!;
    if (from >= 0 && g.nodeKind[from] === KIND.transformer) {
      const list = out.get(from) ?? [];
      list.push(ctx.facts[r]!);
      out.set(from, list);
    }
  }
  return out;
}

function supplyAt(walk: Walk, v: number): Supply {
  const code = walk.ctx.graph.nodeKind[v]!;
  if (isOcpdKind(code)) return (walk.sources[v] ??= { kind: 'ocpd', node: v });
  if (code === KIND.utility) return (walk.sources[v] ??= { kind: 'utility', node: v });
  if (code === KIND.generator) return (walk.sources[v] ??= { kind: 'generator', node: v });
  if (code === KIND.transformer) return (walk.sources[v] ??= { kind: 'transformer', node: v });
  return walk.nodeSupply[v]!;
}

/** A point on run `r`. */
function pointOnRun(walk: Walk, r: number): Supply {
  return (walk.onRuns[r] ??= { kind: 'run', run: r });
}

/** The run's facts with what its load end (node `endNode`) says about it: the role it plays and the transformer it feeds. */
function toJudge(walk: Walk, r: number, supply: Supply, endNode: number): RunToJudge {
  const g = walk.ctx.graph;
  const facts: RunFacts = walk.ctx.facts[r]!;
  const endKind = endNode >= 0 ? g.nodeKind[endNode]! : -1;
  const endsAtTransformer = endKind === KIND.transformer;
  // Conductors into distribution equipment (a panelboard, switchboard, tap box…) are feeders even with nothing drawn below it.
  const feedsDevice = endNode >= 0 && (isOcpdKind(endKind) || endKind === KIND.bus || walk.below[endNode] === 1);
  if (endsAtTransformer) {
    facts.secondaries = walk.secondariesOf.get(endNode) ?? [];
    facts.transformer = transformerFacts(g, endNode, { ratingA: null, id: null }, facts.secondaries.map((s) => s.termination));
  }
  const j = walk.judging;
  j.run = r;
  j.supply = supply;
  j.facts = facts;
  j.role = endsAtTransformer ? 'transformer-primary' : feedsDevice ? 'feeder' : 'branch';
  return j;
}

function judgeRun(j: RunToJudge): RunVerdict {
  const { supply } = j;
  switch (supply.kind) {
    case 'none':
    case 'several':
    case 'cycle':
      return incomplete({ ...j, role: 'unknown' });
    case 'utility':
      return service(j);
    case 'generator':
      return generator(j, supply.node);
    case 'ocpd':
      return fedByOcpd(j, supply.node);
    case 'transformer':
      return secondary(j, supply.node);
    case 'run':
      return onRun(j, j.walk.results[supply.run]!);
  }
}

/** A run whose supply point lies on another run, judged already. */
function onRun(j: RunToJudge, up: RunVerdict): RunVerdict {
  const { facts } = j;
  const joined = continuedRun(j, up);
  if (joined) return joined;
  if (up.family === 'service') return service(j);
  if (up.family === 'generator') return generator(j, up.generatorNode);
  // A conductor whose only unknown is its own size stays incomplete itself; what is supplied through it (at
  // equipment, not a pass-through joint) is judged against the device ahead of it, so every other verdict comes out.
  if (up.verdict === 'incomplete' && isUnsizedOnOcpd(up) && !isJoint(j.walk.ctx.graph, j.walk.ctx.graph.conductorFrom[j.walk.ctx.runs.members[j.run]![0]!]!)) return fedByOcpd(j, up.deviceNode);
  if (up.verdict === 'incomplete') return incomplete(j);
  if (up.verdict === 'protected' || up.verdict === 'protected-next-size' || up.verdict === 'motor-circuit' || up.verdict === 'hvac-circuit') return fedByOcpd(j, up.deviceNode);
  facts.suppliedFrom = { conductorIds: up.facts.conductorIds, verdict: up.verdict };
  facts.supplyOcpdA = up.facts.supplyOcpdA;
  facts.supplyOcpdId = up.facts.supplyOcpdId;
  const trial = runRule(tapFromTap, facts);
  // The supply point lies on a tap or a secondary: 240.21 forbids tapping it again. On a conductor no rule
  // makes acceptable it is not a tap from a tap but fed from an unprotected conductor (the trial names it).
  const verdict: Verdict = FAILING_VERDICTS.has(up.verdict) ? 'unprotected' : 'tap-from-tap';
  return { verdict, rule: verdict === 'tap-from-tap' ? tapFromTap : null, family: 'on-tap', role: j.role, supply: j.supply, deviceNode: up.deviceNode, generatorNode: -1, facts, tried: [trial], candidates: [] };
}

/**
 * A tap or secondary that continues through a splice or tap box with no
 * branch, changing size there, is one run: judged again as a whole on its
 * weakest segment and total length, and both parts take that verdict.
 */
function continuedRun(j: RunToJudge, up: RunVerdict): RunVerdict | null {
  const { graph: g, runs } = j.walk.ctx;
  if (j.supply.kind !== 'run') return null;
  const upMembers = runs.members[j.supply.run]!;
  if (!isJoint(g, g.conductorTo[upMembers[upMembers.length - 1]!]!)) return null;
  const onTap = up.family === 'fed-by-ocpd' && up.verdict !== 'protected' && up.verdict !== 'protected-next-size' && up.verdict !== 'incomplete';
  const onSecondary = up.family === 'secondary' && up.verdict !== 'tap-transformer';
  if (!onTap && !onSecondary) return null;
  const whole: RunToJudge = { ...j, supply: up.supply, facts: joinFacts(up.facts, j.facts) };
  if (onSecondary) whole.facts.transformer = up.facts.transformer;
  const v = onTap ? fedByOcpd(whole, up.deviceNode) : secondary(whole, (up.supply as { node: number }).node);
  const together = [...(j.walk.joined.get(up) ?? [j.supply.run]), j.run];
  for (const r of together) j.walk.results[r] = v;
  j.walk.joined.delete(up);
  j.walk.joined.set(v, together);
  return v;
}

/** A run fed through a known OCPD that is incomplete because a segment has no size (so no ampacity). */
function isUnsizedOnOcpd(v: RunVerdict): boolean {
  return v.family === 'fed-by-ocpd' && v.facts.size === null && v.deviceNode >= 0 && v.facts.supplyOcpdA !== null;
}

function service(j: RunToJudge): RunVerdict {
  return single(j, serviceRule, { verdict: 'service', family: 'service', role: 'service', deviceNode: -1, generatorNode: -1 });
}

function generator(j: RunToJudge, gen: number): RunVerdict {
  j.facts.generator = generatorFacts(j.walk.ctx.graph, gen);
  return single(j, generatorRule, { verdict: 'generator', family: 'generator', role: 'generator', deviceNode: -1, generatorNode: gen });
}

/**
 * A run judged by one rule that names its verdict (service and generator conductors); without a size it is
 * incomplete, and its trial is kept so a condition that fails whatever the size is still reported.
 */
function single(j: RunToJudge, rule: Rule, v: Pick<RunVerdict, 'verdict' | 'family' | 'role' | 'deviceNode' | 'generatorNode'>): RunVerdict {
  const verdict = j.facts.size === null ? 'incomplete' : v.verdict;
  return { verdict, rule: verdict === 'incomplete' ? null : rule, family: v.family, role: v.role, supply: j.supply, deviceNode: v.deviceNode, generatorNode: v.generatorNode, facts: j.facts, tried: [runRule(rule, j.facts)], candidates: [] };
}

function incomplete(j: RunToJudge): RunVerdict {
  return { verdict: 'incomplete', rule: null, family: 'no-supply', role: j.role, supply: j.supply, deviceNode: -1, generatorNode: -1, facts: j.facts, tried: [], candidates: [] };
}

/** Fed through an OCPD: 240.4, then 240.4(B); only a run those do not protect is a tap, tried under every 240.21(B) rule. */
function fedByOcpd(j: RunToJudge, device: number): RunVerdict {
  const { facts, role } = j;
  const node = j.walk.ctx.graph.nodes[device]!;
  facts.supplyOcpdA = effectiveRatingA(node);
  facts.supplyOcpdId = node.id;
  facts.supplyOcpdKind = node.kind === 'fuse' ? 'fuse' : 'breaker';
  facts.supplyDeviceType = deviceTypeOf(node);
  if (facts.transformer) facts.transformer = { ...facts.transformer, primaryOcpdA: facts.supplyOcpdA, primaryOcpdId: node.id };
  // 240.4(G): the branch circuit of one motor or HVAC unit is protected as its own article says, instead of by 240.4.
  const own = role === 'branch' ? (facts.motor ? OWN_ARTICLE_RULES.motor : facts.hvac ? OWN_ARTICLE_RULES.hvac : null) : null;
  if (own) {
    const t = runRule(own, facts);
    const v: Verdict = t.outcome === 'holds' ? own.verdict! : t.outcome === 'unknown' ? 'incomplete' : 'unprotected';
    return { verdict: v, rule: v === own.verdict ? own : null, family: 'fed-by-ocpd', role, supply: j.supply, deviceNode: device, generatorNode: -1, facts, tried: [t], candidates: [own] };
  }
  const [atRating, nextSize] = PROTECTION_RULES as [Rule, Rule];
  const first = protectionTrial(atRating, facts);
  let tried: RuleTrial[];
  let verdict: Verdict | null = null;
  let rule: Rule | null = null;
  if (first.outcome === 'holds' || first.outcome === 'unknown') {
    tried = triedList(first);
    // Without the ampacity or the rating nothing further can be decided.
    verdict = first.outcome === 'holds' ? atRating.verdict! : 'incomplete';
    rule = first.outcome === 'holds' ? atRating : null;
  } else {
    const second = protectionTrial(nextSize, facts);
    tried = triedList(first, second);
    if (second.outcome === 'holds') {
      verdict = nextSize.verdict!;
      rule = nextSize;
    }
  }
  let candidates = FED_BY_OCPD_RULES;
  if (verdict === null && role === 'branch') {
    // 240.21(B) covers feeder taps; a branch circuit (no OCPD below it) that 240.4 does not protect is simply unprotected.
    verdict = 'unprotected';
    candidates = PROTECTION_RULES;
  } else if (verdict === null) {
    tried = [...tried];
    const v = firstHolding(FEEDER_TAP_RULES, facts, tried);
    verdict = v.verdict;
    rule = v.rule;
  }
  return { verdict, rule, family: 'fed-by-ocpd', role, supply: j.supply, deviceNode: device, generatorNode: -1, facts, tried, candidates };
}

/** A transformer secondary: 240.21(C), or (C)(5) back to 240.21(B)(3) when the primary is a feeder tap. */
function secondary(j: RunToJudge, tx: number): RunVerdict {
  const { facts } = j;
  const g = j.walk.ctx.graph;
  const primary = primarySupply(j.walk, tx);
  const device = primary.device >= 0 ? g.nodes[primary.device]! : null;
  const ends = (j.walk.secondariesOf.get(tx) ?? []).map((s) => s.termination);
  facts.transformer = transformerFacts(g, tx, { ratingA: device ? effectiveRatingA(device) : null, id: device?.id ?? null }, ends);
  // A transformer ahead of the service equipment (fed by service conductors, no OCPD) has service conductors on its secondary.
  if (primary.service) return service(j);
  // Fed straight from a generator (no OCPD): the secondary still runs from the generator to its first OCPD (445.13),
  // judged against the nameplate current seen through the transformer. Not a feeder tap: nothing ahead is a feeder device.
  if (primary.generator >= 0) {
    const gen = generatorFacts(g, primary.generator);
    facts.generator = gen && { ...gen, nameplateA: (gen.nameplateA * facts.transformer.primaryVoltsLL) / facts.transformer.secondaryVoltsLL };
    return single(j, generatorRule, { verdict: 'generator', family: 'generator', role: 'generator', deviceNode: -1, generatorNode: primary.generator });
  }
  const judged = (verdict: Verdict, rule: Rule | null, tried: RuleTrial[], candidates: readonly Rule[]): RunVerdict =>
    ({ verdict, rule, family: 'secondary', role: 'transformer-secondary', supply: j.supply, deviceNode: primary.device, generatorNode: -1, facts, tried, candidates });
  // A primary incomplete only for want of its size is judged on as if protected (its own verdict says incomplete).
  if (primary.run && !isUnsizedOnOcpd(primary.run)) {
    const pv = primary.run.verdict;
    if (pv === 'incomplete') return judged('incomplete', null, [], []);
    if (pv !== 'protected' && pv !== 'protected-next-size') {
      // 240.21(C)(5): a transformer supplied by a feeder tap is judged under 240.21(B)(3), on the primary.
      const trial = primary.run.tried.find((t) => t.ruleId === tapTransformer.id) ?? runRule(tapTransformer, primary.run.facts);
      const holds = pv === 'tap-transformer' && trial.outcome === 'holds';
      return judged(holds ? 'tap-transformer' : trial.outcome === 'unknown' ? 'incomplete' : 'unprotected', holds ? tapTransformer : null, [trial], []);
    }
  }
  if (facts.transformer.primaryOcpdA === null) return judged('incomplete', null, [], SECONDARY_RULES);
  const tried: RuleTrial[] = [];
  const v = firstHolding(SECONDARY_RULES, facts, tried);
  return judged(v.verdict, v.rule, tried, SECONDARY_RULES);
}

/** The device protecting a transformer's primary, the primary run when there is one, and a service or generator straight ahead. */
function primarySupply(walk: Walk, tx: number): { device: number; run: RunVerdict | null; service: boolean; generator: number } {
  const { graph: g, runs } = walk.ctx;
  const ins = g.inEdges[tx]!;
  const none = { device: -1, run: null, service: false, generator: -1 };
  if (ins.length !== 1) return none;
  const e = ins[0]!;
  let run: RunVerdict | null = null;
  if (e >= 0) run = walk.results[runs.runOf[e]!] ?? null;
  else {
    const s = supplyAt(walk, edgeFrom(g, e));
    if (s.kind === 'ocpd') return { ...none, device: s.node };
    if (s.kind === 'utility') return { ...none, service: true };
    if (s.kind === 'generator') return { ...none, generator: s.node };
    if (s.kind === 'run') run = walk.results[s.run] ?? null;
  }
  return { device: run?.deviceNode ?? -1, run, service: run?.family === 'service', generator: run?.family === 'generator' ? run.generatorNode : -1 };
}

/** For each node: is there an OCPD or transformer anywhere on its load side? Decides feeder vs branch circuit. */
function ocpdBelow(g: Graph, order: Int32Array, count: number): Uint8Array {
  const below = new Uint8Array(g.nodes.length);
  for (let k = count - 1; k >= 0; k--) below[order[k]!] = ocpdBelowAt(g, below, order[k]!);
  return below;
}

/** `below` of node `v` from what it supplies (theirs known): 1 when an OCPD or transformer lies on its load side. Also how incremental.ts updates a supply path. */
export function ocpdBelowAt(g: Graph, below: Uint8Array, v: number): number {
  const outs = g.outEdges[v]!;
  for (let i = 0; i < outs.length; i++) {
    const e = outs[i]!;
    const w = e >= 0 ? g.conductorTo[e]! : g.linkTo[-e - 1]!;
    const kind = g.nodeKind[w]!;
    if (below[w] || isOcpdKind(kind) || kind === KIND.transformer) return 1;
  }
  return 0;
}

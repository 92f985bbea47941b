import type { AnalysisContext, VerdictContext } from '../analyze/context';
import { VERDICTS, type Finding, type Severity } from '../analyze/types';
import { CONDUCTOR_SIZES, type CodeEdition, type ConductorId, type ConductorSize, type EquipmentNode, type Material, type NodeId, type Project } from '../model/schema';
import { atLeast, type Check, type Rule } from '../rules/define';
import { conductorWithstand } from '../rules/conductor-withstand';
import { equipmentSccr } from '../rules/equipment-sccr';
import { interruptingRating } from '../rules/interrupting-rating';
import type { InterruptingFacts, WithstandFacts } from '../rules/studyFacts';
import { voltageDropRule } from '../rules/voltage-drop';
import { defaultClearingTime } from '../tables/clearingTime';
import { conductorAreaCmil } from '../tables/conductorProperties';
import { finalTempC, withstandAreaCmil, withstandConstant, withstandTimeS } from '../tables/conductorWithstand';
import { insulationRating } from '../tables/insulation';
import { SIZE_INDEX_14 } from '../tables/sizes';
import { KIND, type Graph } from '../topology/graph';
import { studyFaultCurrent, type FaultStudy } from './faultCurrent/faultCurrent';
import { lazyTable } from './lazyTable';
import { studyColumns, type StudyColumns } from './columns';
import type { ConductorDrop, NodeFault, ServiceMarking, StudiesReport, WithstandResult } from './types';
import { studyVoltageDrop, type VoltageDropInputs, type VoltageDropStudy } from './voltageDrop/voltageDrop';

export type * from './types';

/** A tap or transformer secondary run and the device whose clearing it relies on (from the classifier). */
export interface TapRun {
  /** Conductor indices, supply end first. */
  conductors: readonly number[];
  /** The OCPD ahead (for a secondary: the primary device), or -1. */
  deviceNode: number;
}

export interface StudiesResult {
  report: StudiesReport;
  findings: Finding[];
  fault: FaultStudy;
  drop: VoltageDropStudy;
}

/** Default voltage-drop limits of the informational notes to 210.19 and 215.2, %. */
export const DEFAULT_VD_CIRCUIT_PCT = 3;
export const DEFAULT_VD_TOTAL_PCT = 5;
const MAX_RELATED = 50;

/**
 * The whole-network studies, after the classifier: available fault current at
 * every node, voltage drop on every conductor, and the rules that judge them
 * (110.9, 110.10, conductor withstand of taps and secondaries, voltage drop).
 * Linear in the size of the drawing.
 */
export function runStudies(ctx: VerdictContext): StudiesResult {
  const taps: TapRun[] = [];
  const { verdicts, runs } = ctx;
  for (let r = 0; r < verdicts.length; r++) {
    const v = verdicts[r]!;
    if (RELIES_ON_DEVICE_AHEAD.has(v.verdict)) taps.push({ conductors: runs.members[r]!, deviceNode: v.deviceNode });
  }
  return studyNetwork(ctx, taps);
}

/** The verdicts whose conductors rely on the device ahead to clear a fault (withstand is judged): taps, but a tap from a tap, and transformer secondaries. */
export const RELIES_ON_DEVICE_AHEAD: ReadonlySet<string> = new Set(VERDICTS.filter((v) => (v.startsWith('tap-') && v !== 'tap-from-tap') || v.startsWith('secondary-')));

/** The network the studies read: the project, its graph and order, the loads and each conductor's circuit. */
export type StudiedNetwork = Pick<AnalysisContext, 'project' | 'graph' | 'order' | 'count' | 'loads' | 'circuits'>;

/** The voltage-drop study on the supply tree and conductor impedances the fault study already read (and what it read of the network, `cols`). */
export function studyVoltageDropAfterFault(net: Omit<StudiedNetwork, 'project'>, fault: FaultStudy, cols?: StudyColumns): VoltageDropStudy {
  return studyVoltageDrop(net.graph, voltageDropInputs(net, fault), cols);
}

/** What the voltage-drop study reads: the network's and what the fault study found (supply tree, voltages, Table 9 values). */
export function voltageDropInputs(net: Omit<StudiedNetwork, 'project'>, fault: FaultStudy): VoltageDropInputs {
  return {
    order: net.order,
    count: net.count,
    voltsLL: fault.voltsLL,
    loads: net.loads,
    circuits: net.circuits,
    rOhmPerKft: fault.rOhmPerKft,
    xOhmPerKft: fault.xOhmPerKft,
    parent: fault.parent,
    parentEdge: fault.parentEdge,
  };
}

/** The studies over a network and the tap and secondary runs the classifier accepted. */
export function studyNetwork(net: StudiedNetwork, taps: readonly TapRun[]): StudiesResult {
  const { project, graph: g, order, count } = net;
  const edition = project.project.codeEdition;
  // Each node and conductor read once for both studies.
  const cols = studyColumns(g);
  const fault = studyFaultCurrent(g, order, count, cols);
  const drop = studyVoltageDropAfterFault(net, fault, cols);
  const findings: Finding[] = [];

  // 110.9 and 110.10, one pass over the equipment.
  const series = seriesByLoadSide(project);
  // The devices without a rating are counted; the finding names only the first MAX_RELATED.
  const noRating: NodeId[] = [];
  let noRatingCount = 0;
  for (let v = 0; v < g.nodes.length; v++) {
    // Only devices and buses are judged here: no other node object is read.
    const kind = g.nodeKind[v]!;
    if (kind !== KIND.breaker && kind !== KIND.fuse && kind !== KIND.bus) continue;
    const f = faultDutyFinding(edition, g, fault, series, v);
    if (f === NO_RATING) {
      if (noRatingCount++ < MAX_RELATED) noRating.push(g.nodes[v]!.id);
    } else if (f) findings.push(f);
  }
  if (noRatingCount > 0) findings.push(noRatingFinding(edition, noRatingCount, noRating));

  // Conductor withstand of taps and secondaries.
  const withstand: WithstandResult[] = [];
  for (const t of taps) {
    const w = tapWithstand(edition, g, fault, t);
    if (!w) continue;
    withstand.push(w.row);
    for (const f of w.findings) findings.push(f);
  }

  // Voltage drop: each circuit at its end, each load's total.
  const { circuitLimit, totalLimit } = dropLimits(project);
  for (let c = 0; c < g.conductors.length; c++) {
    const f = circuitDropFinding(edition, g, fault, drop, c, circuitLimit);
    if (f) findings.push(f);
  }
  for (let v = 0; v < g.nodes.length; v++) {
    const f = totalDropFinding(edition, g, drop, v, totalLimit);
    if (f) findings.push(f);
  }

  // The row tables are built when a report reads them (./lazyTable.ts); the key order stays as written here.
  const voltageDrop = { circuitLimitPct: circuitLimit, totalLimitPct: totalLimit, conductors: [] as ConductorDrop[] };
  lazyTable(voltageDrop, 'conductors', () => dropTable(g, fault, drop), [fault, drop]);
  const report: StudiesReport = {
    notes: [...fault.notes, ...drop.notes],
    faults: [],
    voltageDrop,
    serviceMarkings: serviceMarkings(project, g, fault),
    withstand,
  };
  lazyTable(report, 'faults', () => faultTable(g, fault), [fault]);
  return { report, findings, fault, drop };
}

/** The project's finding that counts the breakers and fuses with a known fault current and no interrupting rating, naming the first `MAX_RELATED` (`first`, in node order). */
export function noRatingFinding(edition: CodeEdition, count: number, first: readonly NodeId[]): Finding {
  return {
    id: NO_RATING_ID,
    ruleId: interruptingRating.id,
    messageId: 'no-rating',
    severity: 'info',
    cites: { code: 'NEC', edition, section: '110.9' },
    subject: { kind: 'project' },
    related: first.map((id) => ({ kind: 'node', id })),
    message: `${count} breaker${count === 1 ? '' : 's'} or fuse${count === 1 ? '' : 's'} with a known available fault current ha${count === 1 ? 's' : 've'} no interrupting rating, so 110.9 is not checked there: enter interruptingKA.`,
    data: { count },
    fixes: [],
  };
}
/** The id of `noRatingFinding`; how many it names at most. */
export const NO_RATING_ID = `${interruptingRating.id}:project:no-rating`;
export const NO_RATING_MAX_RELATED = MAX_RELATED;

/** The short-circuit table: a row per node, in file order. */
function faultTable(g: Graph, fault: FaultStudy): NodeFault[] {
  const rows: NodeFault[] = new Array(g.nodes.length);
  for (let v = 0; v < g.nodes.length; v++) rows[v] = nodeFault(g, fault, v);
  return rows;
}

/** The voltage-drop table: a row per conductor, in file order. */
function dropTable(g: Graph, fault: FaultStudy, drop: VoltageDropStudy): ConductorDrop[] {
  const rows: ConductorDrop[] = new Array(g.conductors.length);
  for (let c = 0; c < g.conductors.length; c++) rows[c] = conductorDropRow(g, fault, drop, c);
  return rows;
}

/** The series combination ratings by the id of their load-side device (110.9 reads a device's own). */
export function seriesByLoadSide(project: Project): ReadonlyMap<string, NonNullable<Project['seriesRatings']>[number]> {
  return new Map((project.seriesRatings ?? []).map((s) => [s.loadSideId as string, s]));
}

/** What `faultDutyFinding` returns for a device with a known fault current and no interrupting rating (one project finding counts them). */
export const NO_RATING = 'no-rating';

/**
 * Node `v` against the available fault current there: a breaker or fuse under 110.9 (its
 * interrupting rating, or a series combination rating), a bus with an SCCR under 110.10. Its finding,
 * null when it holds or the node is not judged here, or NO_RATING.
 */
export function faultDutyFinding(edition: CodeEdition, g: Graph, fault: FaultStudy, series: ReturnType<typeof seriesByLoadSide>, v: number): Finding | typeof NO_RATING | null {
  const node = g.nodes[v]!;
  const kA = Number.isNaN(fault.kA[v]!) ? null : fault.kA[v]!;
  const upperBound = fault.upperBound[v] === 1;
  if (node.kind === 'breaker' || node.kind === 'fuse') {
    if (node.interruptingKA === undefined) return kA !== null ? NO_RATING : null;
    const s = series.get(node.id);
    // The rule (rules/interrupting-rating.ts) fails only on this comparison (or a series rating when it
    // is not met): a device that holds, or cannot be judged without a series rating, builds no facts.
    const own = atLeast(node.interruptingKA, kA);
    if (own === true || (own === null && !s)) return null;
    const lineSide = s ? g.nodeIndex.get(s.lineSideId) ?? -1 : -1;
    const facts: InterruptingFacts = {
      edition,
      deviceId: node.id,
      device: label(node),
      interruptingKA: node.interruptingKA,
      faultKA: kA,
      upperBound,
      series: s ? { lineSideId: s.lineSideId, lineSide: lineSide >= 0 ? label(g.nodes[lineSide]!) : s.lineSideId, combinationKA: s.combinationKA, lineSideIsAhead: isAhead(fault, lineSide, v) } : null,
    };
    return studyFinding(edition, interruptingRating, 'violation', { kind: 'node', id: node.id }, interruptingRating.check(facts), s ? [{ kind: 'node', id: s.lineSideId }] : []);
  }
  if (node.kind === 'bus' && node.sccrKA !== undefined) {
    // Likewise 110.10 (rules/equipment-sccr.ts) fails only where this comparison does.
    if (atLeast(node.sccrKA, kA) !== false) return null;
    return studyFinding(edition, equipmentSccr, 'violation', { kind: 'node', id: node.id }, equipmentSccr.check({ edition, equipmentId: node.id, equipment: label(node), sccrKA: node.sccrKA, faultKA: kA, upperBound }));
  }
  return null;
}

/**
 * The short-circuit withstand of one tap or secondary run: its row of the table and its findings
 * (one per conductor of the run when it fails); null when no OCPD is ahead of it.
 */
export function tapWithstand(edition: CodeEdition, g: Graph, fault: FaultStudy, t: TapRun): { row: WithstandResult; findings: Finding[] } | null {
  const first = t.conductors[0];
  if (first === undefined || t.deviceNode < 0) return null;
  const device = g.nodes[t.deviceNode]!;
  if (device.kind !== 'breaker' && device.kind !== 'fuse') return null;
  const c = g.conductors[first]!;
  const supply = g.conductorFrom[first]!;
  const faultKA = supply >= 0 && !Number.isNaN(fault.kA[supply]!) ? fault.kA[supply]! : null;
  const rating = insulationRating(c.insulation);
  const k = withstandConstant(c.material, rating.tempC, finalTempC(rating.thermalClass));
  const clearing = clearingOf(device);
  const areaCmil = c.size === undefined ? null : conductorAreaCmil(c.size);
  const allowed = faultKA === null || areaCmil === null ? null : withstandTimeS(faultKA * 1000, areaCmil * c.parallelSets, k);
  const row: WithstandResult = { conductorIds: idsOf(g, t.conductors), faultKA, clearingTimeS: clearing.seconds, clearingBasis: clearing.basis, allowedS: allowed, withstands: allowed === null ? null : allowed >= clearing.seconds };
  const findings: Finding[] = [];
  // The rule fails only where the run does not withstand (the same figures, rules/conductor-withstand.ts): the others need no facts.
  if (row.withstands !== false) return { row, findings };
  const facts = withstandFacts(edition, g, t, device, faultKA, supply >= 0 && fault.upperBound[supply] === 1);
  const checks = conductorWithstand.check(facts);
  if (!checks.some((x) => x.status === 'fail')) return { row, findings };
  const extra = {
    ...(facts.smallestSize ? { smallestSize: facts.smallestSize } : {}),
    ...(allowed !== null ? { longestClearingS: Number(allowed.toPrecision(3)) } : {}),
  };
  for (const ci of t.conductors) {
    const f = studyFinding(edition, conductorWithstand, 'violation', { kind: 'conductor', id: g.conductors[ci]!.id }, checks, [{ kind: 'node', id: device.id }], extra);
    if (f) findings.push(f);
  }
  return { row, findings };
}

/** One node's row of the short-circuit table: one object shape for every row (the optional `unknownWhy` added after), so building 100 000 rows stays on the fast path. */
export function nodeFault(g: Graph, fault: FaultStudy, v: number): NodeFault {
  const p = fault.parent[v]!;
  const known = !Number.isNaN(fault.r[v]!);
  const node = g.nodes[v]!;
  const row: NodeFault = {
    nodeId: node.id,
    kind: node.kind,
    kA: Number.isNaN(fault.kA[v]!) ? null : fault.kA[v]!,
    xOverR: num(fault.xOverR[v]!),
    lineToGroundKA: num(fault.lineToGroundKA[v]!),
    motorKA: fault.motorKA[v]!,
    upperBound: fault.upperBound[v] === 1,
    voltsLL: num(fault.voltsLL[v]!),
    parentId: p >= 0 ? g.nodes[p]!.id : null,
    stepROhm: fault.stepR[v]!,
    stepXOhm: fault.stepX[v]!,
    rOhm: known ? fault.r[v]! : null,
    xOhm: known ? fault.x[v]! : null,
  };
  if (fault.unknownWhy[v]) row.unknownWhy = fault.unknownWhy[v];
  return row;
}

/** A study rule's finding from its checks, or null when none failed. */
function studyFinding(edition: CodeEdition, rule: Rule<string, never>, severity: Severity, subject: Finding['subject'], checks: readonly Check[], related: Finding['related'] = [], data: Finding['data'] = {}): Finding | null {
  const failed = checks.filter((c) => c.status === 'fail');
  if (failed.length === 0) return null;
  for (const c of failed) c.template = rule.messages[c.id as keyof typeof rule.messages] ?? c.id;
  const subjectId = subject.kind === 'project' ? 'project' : subject.id;
  return {
    id: `${rule.id}:${subjectId}:${failed[0]!.id}`,
    ruleId: rule.id,
    messageId: failed[0]!.id,
    severity,
    cites: { code: 'NEC', edition, section: rule.section },
    subject,
    related,
    message: `${failed.map((c) => c.text.replace(/\.$/, '')).join('; ')} (${rule.section}).`,
    data: { ...failed[0]!.data, ...data },
    fixes: [],
  };
}

function dropLimits(project: Project): { circuitLimit: number; totalLimit: number } {
  return { circuitLimit: project.project.voltageDropCircuitPct ?? DEFAULT_VD_CIRCUIT_PCT, totalLimit: project.project.voltageDropTotalPct ?? DEFAULT_VD_TOTAL_PCT };
}

/** Only a drop above its limit can fail the rule (pct ≤ limit holds), so the others build no checks. */
const over = (pct: number, limit: number) => pct > limit + 1e-9;

/** Conductor `c`'s row of the voltage-drop table: its own drop, and the sums at its load end when it is what supplies that end. */
export function conductorDropRow(g: Graph, fault: FaultStudy, drop: VoltageDropStudy, c: number): ConductorDrop {
  const to = g.conductorTo[c]!;
  const onTree = to >= 0 && fault.parentEdge[to] === c;
  return {
    conductorId: g.conductors[c]!.id,
    currentA: num(drop.currentA[c]!),
    powerFactor: num(drop.powerFactor[c]!),
    pct: num(drop.pct[c]!),
    circuitPct: onTree ? num(drop.circuitPct[to]!) : null,
    totalPct: onTree ? num(drop.totalPct[to]!) : null,
  };
}

/** The 3 % warning of the circuit conductor `c` ends (null when it passes or ends none). */
function circuitDropFinding(edition: CodeEdition, g: Graph, fault: FaultStudy, drop: VoltageDropStudy, c: number, limitPct: number): Finding | null {
  const to = g.conductorTo[c]!;
  if (to < 0 || fault.parentEdge[to] !== c) return null;
  const circuitPct = num(drop.circuitPct[to]!);
  if (circuitPct === null || !over(circuitPct, limitPct) || !endsCircuit(g, to)) return null;
  const cond = g.conductors[c]!;
  const checks = voltageDropRule.check({ edition, scope: 'circuit', subject: `Conductor ${cond.label ? `${cond.label} (${cond.id})` : cond.id}`, pct: circuitPct, limitPct });
  return studyFinding(edition, voltageDropRule, 'warning', { kind: 'conductor', id: cond.id }, checks);
}

/** The 5 % warning of load node `v` (null when it passes, is not a load or has no figure). */
function totalDropFinding(edition: CodeEdition, g: Graph, drop: VoltageDropStudy, v: number, limitPct: number): Finding | null {
  const total = drop.totalPct[v]!;
  if (g.nodeKind[v] !== KIND.load || !over(total, limitPct)) return null;
  const node = g.nodes[v]!;
  return studyFinding(edition, voltageDropRule, 'warning', { kind: 'node', id: node.id }, voltageDropRule.check({ edition, scope: 'total', subject: `Load ${label(node)}`, pct: total, limitPct }));
}

/**
 * The study findings again after the drops of some conductors and nodes moved (an incremental
 * re-check, analyze/incremental.ts): the voltage-drop warnings of the conductors marked in
 * `conductorMoved` and of the nodes marked in `nodeMoved` judged again, every other finding kept, in
 * the order a full run writes them (the voltage-drop warnings come last: circuits by conductor, then
 * totals by node). `conductorIndex` gives a conductor's index by id. `among`, when given, lists every
 * conductor and node that may be marked (the rest are not looked at).
 */
export function redoDropFindings(
  project: Project,
  g: Graph,
  fault: FaultStudy,
  drop: VoltageDropStudy,
  findings: readonly Finding[],
  conductorMoved: Uint8Array,
  nodeMoved: Uint8Array,
  conductorIndex: ReadonlyMap<string, number>,
  among?: { conductors: readonly number[]; nodes: readonly number[] },
): Finding[] {
  const edition = project.project.codeEdition;
  const { circuitLimit, totalLimit } = dropLimits(project);
  let first = findings.findIndex((f) => f.ruleId === voltageDropRule.id);
  if (first < 0) first = findings.length;
  const circuits: [number, Finding][] = [];
  const totals: [number, Finding][] = [];
  for (let k = first; k < findings.length; k++) {
    const f = findings[k]!;
    if (f.subject.kind === 'conductor') {
      const c = conductorIndex.get(f.subject.id)!;
      if (!conductorMoved[c]) circuits.push([c, f]);
    } else if (f.subject.kind === 'node') {
      const v = g.nodeIndex.get(f.subject.id)!;
      if (!nodeMoved[v]) totals.push([v, f]);
    }
  }
  const redoCircuit = (c: number) => {
    if (!conductorMoved[c]) return;
    const f = circuitDropFinding(edition, g, fault, drop, c, circuitLimit);
    if (f) circuits.push([c, f]);
  };
  const redoTotal = (v: number) => {
    if (!nodeMoved[v]) return;
    const f = totalDropFinding(edition, g, drop, v, totalLimit);
    if (f) totals.push([v, f]);
  };
  if (among) {
    for (const c of new Set(among.conductors)) redoCircuit(c);
    for (const v of new Set(among.nodes)) redoTotal(v);
  } else {
    for (let c = 0; c < conductorMoved.length; c++) redoCircuit(c);
    for (let v = 0; v < nodeMoved.length; v++) redoTotal(v);
  }
  const byIndex = (a: [number, Finding], b: [number, Finding]) => a[0] - b[0];
  return [...findings.slice(0, first), ...circuits.sort(byIndex).map((x) => x[1]), ...totals.sort(byIndex).map((x) => x[1])];
}

function label(node: EquipmentNode): string {
  return node.label && node.label.trim() !== '' ? `${node.label} (${node.id})` : node.id;
}

function num(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

/** Is `a` on the supply path of `b`? Walks b's supply chain (short: a series rating sits in one or two levels). */
function isAhead(f: FaultStudy, a: number, b: number): boolean {
  if (a < 0) return false;
  for (let w = f.parent[b]!, steps = 0; w >= 0 && steps < 10_000; w = f.parent[w]!, steps++) if (w === a) return true;
  return false;
}

/** Where a circuit ends for the 3 % check: a device, equipment or load, not a splice or disconnect it passes through. */
function endsCircuit(g: Graph, v: number): boolean {
  const kind = g.nodes[v]!.kind;
  return !((kind === 'splice' || kind === 'disconnect') && g.outEdges[v]!.length > 0);
}

function withstandFacts(edition: Project['project']['codeEdition'], g: Graph, t: TapRun, device: Extract<EquipmentNode, { kind: 'breaker' | 'fuse' }>, faultKA: number | null, upperBound: boolean): WithstandFacts {
  const c = g.conductors[t.conductors[0]!]!;
  const rating = insulationRating(c.insulation);
  const initialC = rating.tempC;
  const finalC = finalTempC(rating.thermalClass);
  const clearing = clearingOf(device);
  // The smallest conductor along the run governs; all members share material and size by construction of a run.
  return {
    edition,
    conductorIds: idsOf(g, t.conductors),
    material: c.material,
    size: c.size ?? null,
    parallelSets: c.parallelSets,
    areaCmil: c.size === undefined ? null : conductorAreaCmil(c.size),
    initialC,
    finalC,
    thermalClass: rating.thermalClass,
    device: `${device.kind} ${label(device)}`,
    clearingTimeS: clearing.seconds,
    clearingBasis: clearing.basis,
    faultKA,
    upperBound,
    smallestSize: faultKA === null ? null : smallestWithstandSize(c.material, c.parallelSets, faultKA * 1000, clearing.seconds, withstandConstant(c.material, initialC, finalC)),
  };
}

function idsOf(g: Graph, conductors: readonly number[]): ConductorId[] {
  const ids = new Array<ConductorId>(conductors.length);
  for (let i = 0; i < conductors.length; i++) ids[i] = g.conductors[conductors[i]!]!.id;
  return ids;
}

/** The device's clearing time and where it comes from, as the withstand row and the rule state it. */
function clearingOf(device: Extract<EquipmentNode, { kind: 'breaker' | 'fuse' }>): { seconds: number; basis: string } {
  if (device.clearingTimeS !== undefined) return { seconds: device.clearingTimeS, basis: 'entered' };
  const typical = defaultClearingTime(device.kind === 'fuse' ? { kind: 'fuse', currentLimiting: device.currentLimiting } : { kind: 'breaker', adjustableTrip: device.adjustableTrip });
  let basis = COMMON_PRACTICE.get(typical.basis);
  if (basis === undefined) COMMON_PRACTICE.set(typical.basis, (basis = `${typical.basis}, common practice`));
  return { seconds: typical.seconds, basis };
}

/** Each typical clearing basis with "common practice" added, made once. */
const COMMON_PRACTICE = new Map<string, string>();

/** Smallest size (14 AWG up) whose `sets` conductors together carry `currentA` for `timeS`; null when none does. */
export function smallestWithstandSize(_material: Material, sets: number, currentA: number, timeS: number, constant: number): ConductorSize | null {
  const need = withstandAreaCmil(currentA, timeS, constant) / sets;
  for (let i = SIZE_INDEX_14; i < CONDUCTOR_SIZES.length; i++) if (conductorAreaCmil(CONDUCTOR_SIZES[i]!) >= need) return CONDUCTOR_SIZES[i]!;
  return null;
}

/** 110.24(A): the first equipment a utility supplies, through service conductors and splices. */
function serviceMarkings(project: Project, g: Graph, f: FaultStudy): ServiceMarking[] {
  const out: ServiceMarking[] = [];
  const date = project.project.faultStudyDate ?? null;
  const kinds = g.nodeKind;
  for (let v = 0; v < g.nodes.length; v++) {
    const kind = kinds[v]!;
    if (kind === KIND.utility || kind === KIND.splice || kind === KIND.load || kind === KIND.transformer || kind === KIND.generator) continue;
    let u = f.parent[v]!;
    if (u < 0 || f.parentEdge[v]! < 0) continue;
    while (u >= 0 && kinds[u] === KIND.splice) u = f.parent[u]!;
    if (u < 0 || kinds[u] !== KIND.utility) continue;
    const node = g.nodes[v]!;
    out.push({ nodeId: node.id, label: label(node), kA: Number.isNaN(f.kA[v]!) ? null : f.kA[v]!, upperBound: f.upperBound[v] === 1, date });
  }
  return out;
}

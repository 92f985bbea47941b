import type { AnalysisReport } from '../analyze/types';
import { effectiveRatingA, nodeLabel } from '../analyze/equipment';
import { CAUTION } from '../caution';
import type { Project } from '../model/schema';
import { buildGraph, topologicalOrder, type Graph } from '../topology/graph';
import { conductorCircuits } from '../analyze/circuits';
import { rollUpLoads } from '../analyze/loads';
import { sizeEgc } from './egc';
import { racewayKindOf, sizeRaceway, type RacewayContent } from './raceway';
import { networkSystems, systemText, type NetworkSystems } from './system';
import type { CircuitMakeup, DeviceItem, EquipmentItem, Takeoff, TakeoffRun } from './types';

/** Makeup allowance at each end of every conductor when the project states none, ft (common practice). */
export const DEFAULT_MAKEUP_FT = 2;

/**
 * The estimator's takeoff of a checked project: for every drawn conductor run
 * the phase conductors, the neutral, the EGC and the raceway; the devices and
 * the equipment. Reads the analysis report for what it already decided (the
 * OCPD ahead, the role and the verdict of each run, the calculated load) and
 * never judges anything itself. Pure: the same inputs give the same takeoff.
 */
export function buildTakeoff(project: Project, report: AnalysisReport): Takeoff {
  const graph = buildGraph(project);
  const { order, count } = topologicalOrder(graph);
  const systems = networkSystems(graph, order, count, rollUpLoads(graph, order, count));
  const circuits = conductorCircuits(graph, systems);
  const edition = project.project.codeEdition;
  const makeupFt = project.project.makeupFtPerTermination ?? DEFAULT_MAKEUP_FT;

  const makeups: CircuitMakeup[] = new Array(graph.conductors.length);
  const runs: TakeoffRun[] = new Array(graph.conductors.length);
  for (let ci = 0; ci < graph.conductors.length; ci++) {
    const c = graph.conductors[ci]!;
    const r = report.conductors[ci]!;
    // The same circuit and 310.15(E) count the ampacity check used (analyze/circuits.ts).
    const { system, makeup, currentCarrying: ccc } = circuits[ci]!;
    makeups[ci] = makeup;
    const sets = c.parallelSets;
    const flags: string[] = [];
    if (system.arrangement === 'unknown') flags.push('supply system unknown: taken as 3-phase without a neutral');
    const egc = sizeEgc(c, r, ccc.adjustmentCount, edition);
    if (egc.problem) flags.push(egc.problem);
    const neutralSize = makeup.hasNeutral ? (c.neutralSize ?? c.size ?? null) : null;
    const neutralConductors = makeup.hasNeutral ? sets : 0;
    const contents: RacewayContent[] = [{ size: c.size ?? null, insulation: c.insulation, count: makeup.ungroundedPerSet }];
    if (neutralConductors > 0) contents.push({ size: neutralSize, insulation: c.insulation, count: 1 });
    if (egc.size !== null && egc.count > 0) contents.push({ size: egc.size, insulation: c.egcBare ? 'bare' : c.insulation, count: 1 });
    const raceway = sizeRaceway(racewayKindOf(c), contents, sets);
    if (raceway.problem) flags.push(raceway.problem);
    if (c.size === undefined) flags.push('size unknown: enter the conductor size; its feet are totalled under "size unknown"');
    if (c.lengthFt === undefined) flags.push('length missing: no feet counted');
    if (r.verdict === 'unprotected' || r.verdict === 'tap-from-tap') flags.push(`verdict ${r.verdict}: the design may change before it is built`);

    const L = c.lengthFt;
    const perConductorFt = L === undefined ? null : L + 2 * makeupFt;
    const phaseConductors = sets * makeup.ungroundedPerSet;
    runs[ci] = {
      conductorId: c.id,
      label: c.label ?? c.id,
      from: c.from,
      to: c.to,
      role: r.role,
      verdict: r.verdict,
      system,
      circuit: makeup,
      currentCarrying: ccc,
      lengthFt: L ?? null,
      material: c.material,
      insulation: c.insulation,
      size: c.size ?? null,
      parallelSets: sets,
      phaseConductors,
      neutralConductors,
      neutralSize,
      egc,
      egcBare: c.egcBare ?? false,
      raceway,
      phaseFt: feet(perConductorFt, phaseConductors),
      neutralFt: feet(perConductorFt, neutralConductors),
      egcFt: feet(perConductorFt, egc.size === null ? 0 : egc.count),
      racewayFt: L === undefined || raceway.kind === null ? null : round2(L * raceway.count),
      flags,
    };
  }

  return {
    projectName: project.project.name,
    edition,
    makeupFtPerTermination: makeupFt,
    runs,
    devices: listDevices(graph, systems, makeups),
    equipment: listEquipment(graph, systems, makeups),
    assumptions: takeoffAssumptions(makeupFt),
    caution: report.caution || CAUTION,
  };
}


function feet(perConductorFt: number | null, conductors: number): number | null {
  if (perConductorFt === null) return null;
  return round2(perConductorFt * conductors);
}

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

/**
 * Poles of the device or disconnect at node v: the ungrounded conductors of
 * the circuit it switches (the conductor leaving it), else of the system it
 * sits on (a main breaker feeding its bus).
 */
function polesAt(g: Graph, systems: NetworkSystems, makeups: readonly CircuitMakeup[], v: number): number | null {
  for (const e of g.outEdges[v]!) if (e >= 0) return makeups[e]!.ungroundedPerSet;
  const s = systems.at[v]!;
  if (s.phases === null) return null;
  if (s.phases === 3) return 3;
  return s.arrangement === 'single-2w' ? 1 : 2;
}

function listDevices(g: Graph, systems: NetworkSystems, makeups: readonly CircuitMakeup[]): DeviceItem[] {
  const out: DeviceItem[] = [];
  for (let v = 0; v < g.nodes.length; v++) {
    const n = g.nodes[v]!;
    if (n.kind !== 'breaker' && n.kind !== 'fuse') continue;
    out.push({
      id: n.id,
      kind: n.kind,
      label: nodeLabel(n),
      ratingA: effectiveRatingA(n),
      poles: polesAt(g, systems, makeups, v),
      interruptingKA: n.interruptingKA ?? null,
    });
  }
  return out;
}

function listEquipment(g: Graph, systems: NetworkSystems, makeups: readonly CircuitMakeup[]): EquipmentItem[] {
  const out: EquipmentItem[] = [];
  for (let v = 0; v < g.nodes.length; v++) {
    const n = g.nodes[v]!;
    if (n.kind === 'bus') {
      out.push({ kind: 'bus', id: n.id, label: nodeLabel(n), busType: n.busType, ratingA: n.busRatingA ?? null, system: systemText(systems.at[v]!) });
    } else if (n.kind === 'transformer') {
      out.push({
        kind: 'transformer',
        id: n.id,
        label: nodeLabel(n),
        kva: n.kva,
        primaryVoltsLL: n.primaryVoltsLL,
        secondaryVoltsLL: n.secondaryVoltsLL,
        phases: n.phases,
        connection: n.connection,
      });
    } else if (n.kind === 'disconnect') {
      // A fusible switch is drawn as a disconnect with its fuses bus-linked below it.
      const fused = g.outEdges[v]!.some((e) => e < 0 && g.nodes[g.linkTo[-e - 1]!]?.kind === 'fuse');
      out.push({ kind: 'disconnect', id: n.id, label: nodeLabel(n), ratingA: n.ratingA ?? null, poles: polesAt(g, systems, makeups, v), fused });
    }
  }
  return out;
}

function takeoffAssumptions(makeupFt: number): string[] {
  return [
    `Wire feet = run length × conductors + ${makeupFt} ft of makeup at each end of every conductor (project setting; ${DEFAULT_MAKEUP_FT} ft when unset, common practice). Raceway feet = run length × raceways; no allowance for bends, offsets or waste.`,
    'Each parallel set runs in its own raceway with its own neutral and a full-size EGC (310.10(G), 250.122(F)).',
    'A 3-phase source is taken as a 4-wire wye and a single-phase source as 3-wire (common practice); a transformer secondary follows its connection.',
    "Neutral 'auto' (common practice): carried where the supply has one and the run is the service or serves distribution equipment or a load connected line to neutral (the load's own connection, as the load calculation takes it); a run serving only single-phase loads is taken as their own circuit.",
    'Neutral and EGC are of the phase conductors\' material; the neutral and an EGC not marked bare are of their insulation (Table 5 area), a bare EGC counts at its Table 8 area (Chapter 9 Notes 3 and 8).',
    'Raceway kind: as stated on the run, else steel conduit as EMT, aluminum conduit as RMC, PVC conduit as PVC Schedule 40; cable, cable tray and open wiring get no raceway.',
    'Terminations: every conductor end is one termination (lug or device terminal).',
  ];
}

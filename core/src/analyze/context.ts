import type { CodeEdition, Project } from '../model/schema';
import type { RunFacts } from '../rules/facts';
import { buildGraph, topologicalOrder, type Graph } from '../topology/graph';
import { buildRuns, type Runs } from '../topology/runs';
import { conductorAmpacities, type ConductorAmpacity } from './ampacities';
import { conductorCircuits, networkSystems, type ConductorCircuit } from './circuits';
import type { RunVerdict } from './classify';
import { rollUpLoads, type SystemLoads } from './loads';
import type { Fix } from './types';

/**
 * What every stage of the analysis reads, built once and passed whole: the
 * project, its graph and order, the loads, the runs and the ampacities. Each
 * later stage takes one of these objects and returns one result; `analyze()`
 * only chains them.
 */
export interface AnalysisContext {
  readonly project: Project;
  readonly edition: CodeEdition;
  readonly graph: Graph;
  /** Nodes in supply-to-load order; the first `count` were reached, the rest lie on or below a loop. */
  readonly order: Int32Array;
  readonly count: number;
  readonly onCycle: Uint8Array;
  readonly loads: SystemLoads;
  readonly runs: Runs;
  /** Per conductor, by index: the system, the neutral and the 310.15(E) count (the ampacity, takeoff and voltage drop read it). */
  readonly circuits: readonly ConductorCircuit[];
  /** Per conductor, by index. */
  readonly ampacities: readonly ConductorAmpacity[];
}

/** The context once each run has its base facts (the classifier's input). */
export interface FactsContext extends AnalysisContext {
  /** Per run: the facts that do not depend on what supplies it; the classifier fills in the rest. */
  readonly facts: readonly RunFacts[];
}

/** The context once every run is judged (the input of fixes, findings and the report). */
export interface VerdictContext extends AnalysisContext {
  readonly verdicts: readonly RunVerdict[];
}

/** The context once fixes are known (the input of findings and the report). */
export interface FixedContext extends VerdictContext {
  /** Per run. */
  readonly fixes: readonly Fix[][];
}

/** The first stage: the graph, its order, loads, runs and ampacities of one project. */
export function prepareContext(project: Project): AnalysisContext {
  const edition = project.project.codeEdition;
  const graph = buildGraph(project);
  const { order, count, onCycle } = topologicalOrder(graph);
  const loads = rollUpLoads(graph, order, count);
  const circuits = conductorCircuits(graph, networkSystems(graph, order, count, loads));
  return {
    project,
    edition,
    graph,
    order,
    count,
    onCycle,
    loads,
    runs: buildRuns(graph),
    circuits,
    ampacities: conductorAmpacities({ graph, edition, terminationDefault: project.project.terminationDefault, circuits }),
  };
}

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadProject } from '../../../core/src/model/load';
import type { NodeId, Project } from '../../../core/src/model/schema';
import { buildGraph, type Graph } from '../../../core/src/topology/graph';
import { buildRuns } from '../../../core/src/topology/runs';

/**
 * The graph reuses the load step's look-ups of every node id and every conductor's and bus link's
 * ends (model/nodeIndex.ts) only while the lists still hold what was looked up: each end must name
 * the node the project says, after any change in place or a new list.
 */
const loaded = (): Project => {
  const r = loadProject(readFileSync(new URL('../../../samples/mixed-use.json', import.meta.url), 'utf8'));
  if (!r.ok) throw new Error('sample refused');
  return r.project;
};

/** Every end as the ids the project gives, next to the ids the graph's positions name. */
function ends(p: Project, g: Graph) {
  const id = (v: number) => (v < 0 ? null : g.nodes[v]!.id);
  return {
    project: [...p.conductors.map((c) => [c.from, c.to]), ...p.busLinks.map((l) => [l.from, l.to])],
    graph: [...p.conductors.map((_, i) => [id(g.conductorFrom[i]!), id(g.conductorTo[i]!)]), ...p.busLinks.map((_, j) => [id(g.linkFrom[j]!), id(g.linkTo[j]!)])],
  };
}

describe('graph ends from the load step', () => {
  it('as loaded', () => {
    const p = loaded();
    const e = ends(p, buildGraph(p));
    expect(e.graph).toEqual(e.project);
  });

  it('after a conductor and a bus link are reconnected in place', () => {
    const p = loaded();
    const c = p.conductors.at(-1)!;
    const l = p.busLinks[0]!;
    const other = p.nodes.find((n) => n.id !== c.to && n.kind === 'load')!;
    c.to = other.id;
    l.from = p.nodes.find((n) => n.id !== l.from && n.kind === 'bus')!.id;
    const e = ends(p, buildGraph(p));
    expect(e.graph).toEqual(e.project);
  });

  it('after the node list is replaced with the nodes in another order, and after an end names no node', () => {
    const p = loaded();
    const q: Project = { ...p, nodes: [...p.nodes].reverse() };
    const e = ends(q, buildGraph(q));
    expect(e.graph).toEqual(e.project);
    const r: Project = { ...p, conductors: p.conductors.map((c, i) => (i === 0 ? { ...c, from: 'no-such-node' as NodeId } : c)) };
    const g = buildGraph(r);
    expect(g.conductorFrom[0]).toBe(-1);
    expect(ends(r, g).graph.slice(1)).toEqual(ends(r, g).project.slice(1));
  });
});

/** Each node's edges arriving and leaving, read straight off the lists: conductors first, then bus links, each in file order. */
function listsOf(p: Project, g: Graph) {
  const at = (end: 'from' | 'to') =>
    g.nodes.map((n) => [
      ...p.conductors.flatMap((c, i) => (c[end] === n.id ? [i] : [])),
      ...p.busLinks.flatMap((l, j) => (l[end] === n.id ? [-(j + 1)] : [])),
    ]);
  return { inEdges: at('to'), outEdges: at('from') };
}

describe('edge lists shared where an edge is alone', () => {
  it('list every edge at both its ends, in file order, however they are shared', () => {
    const p = loaded();
    const g = buildGraph(p);
    expect({ inEdges: g.inEdges, outEdges: g.outEdges }).toEqual(listsOf(p, g));
    // A run of one conductor is listed by itself; every conductor is in exactly one run.
    const runs = buildRuns(g);
    expect(runs.members.flat().sort((a, b) => a - b)).toEqual(p.conductors.map((_, i) => i));
    for (const [r, members] of runs.members.entries()) for (const ci of members) expect(runs.runOf[ci]).toBe(r);
  });

  it('a node given a second edge gets a list of its own: the shared one still lists the first edge alone', () => {
    const p = loaded();
    const panel = p.nodes.find((n) => n.kind === 'bus' && p.conductors.filter((c) => c.from === n.id).length === 1)!;
    const only = p.conductors.findIndex((c) => c.from === panel.id);
    const load = p.nodes.find((n) => n.kind === 'load')!;
    const q: Project = { ...p, conductors: [...p.conductors, { ...p.conductors[only]!, id: 'added-branch' as Project['conductors'][number]['id'], from: panel.id, to: load.id }] };
    const g = buildGraph(q);
    expect({ inEdges: g.inEdges, outEdges: g.outEdges }).toEqual(listsOf(q, g));
  });
});

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadProject } from '../../../core/src/model/load';
import type { NodeId, Project } from '../../../core/src/model/schema';
import { buildGraph, type Graph } from '../../../core/src/topology/graph';

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

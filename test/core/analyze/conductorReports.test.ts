import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../../core/src/analyze/analyze';
import { loadProject } from '../../../core/src/model/load';
import type { ConductorId, Project } from '../../../core/src/model/schema';

/**
 * A report line lists the ids of the findings about its conductor. A loaded project's lines find
 * their conductors through the load step's index of conductor ids (model/nodeIndex.ts), which holds
 * only while the conductor list still has the ids it was built from; any other project is read
 * conductor by conductor. Both must list the same findings on the same lines.
 */
const loaded = (sample: string): Project => {
  const r = loadProject(readFileSync(new URL(`../../../samples/${sample}.json`, import.meta.url), 'utf8'));
  if (!r.ok) throw new Error('sample refused');
  return r.project;
};

const findingIdsOf = (p: Project) => analyze(p).conductors.map((c) => ({ id: c.id, findingIds: c.findingIds }));

describe('report lines list their findings', () => {
  it('every sample as loaded and as a copy the load step never saw', () => {
    let listed = 0;
    for (const sample of ['bottling-hall', 'cold-storage', 'demo-clinic', 'mixed-use', 'motor-shop', 'service-yard']) {
      const p = loaded(sample);
      const lines = findingIdsOf(p);
      listed += lines.filter((line) => line.findingIds.length > 0).length;
      expect(findingIdsOf(structuredClone(p))).toEqual(lines);
    }
    expect(listed).toBeGreaterThan(0);
  });

  it('after a conductor with findings is renamed in place', () => {
    const p = loaded('mixed-use');
    const before = analyze(p).conductors.findIndex((c) => c.findingIds.length > 0);
    const c = p.conductors[before]!;
    const old = c.id;
    c.id = `${old}-renamed` as ConductorId;
    const report = analyze(p);
    const line = report.conductors[before]!;
    expect(line.id).toBe(c.id);
    expect(line.findingIds.length).toBeGreaterThan(0);
    expect(line.findingIds.every((id) => report.findings.some((f) => f.id === id && (f.subject.kind === 'project' || f.subject.id === c.id || f.related.some((r) => r.kind === 'conductor' && r.id === c.id))))).toBe(true);
    expect(findingIdsOf(p)).toEqual(findingIdsOf(structuredClone(p)));
  });
});

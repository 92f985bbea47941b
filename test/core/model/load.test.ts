import { describe, expect, it } from 'vitest';
import { loadProject } from '@linewright/core';
import { diagram } from '../../helpers/builder';

describe('loadProject and fields it does not know', () => {
  it('sets an unknown field aside with a notice naming it and where, and still loads the drawing', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build() as Record<string, unknown>;
    input.$schema = './linewright-project.schema.json';
    (input.conductors as Record<string, unknown>[])[0]!.lenghtFt = 20;
    const r = loadProject(input);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.notices).toContainEqual(expect.stringContaining('"$schema"'));
    expect(r.notices).toContainEqual(expect.stringMatching(/"lenghtFt" at conductors\[0\]; check the spelling/));
    expect(r.project.conductors[0]).not.toHaveProperty('lenghtFt');
  });

  it('an unknown field beside a real error is reported with it, and nothing loads', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build() as Record<string, unknown>;
    const c = (input.conductors as Record<string, unknown>[])[0]!;
    c.lenghtFt = 20;
    c.lengthFt = -1;
    const r = loadProject(input);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual(expect.arrayContaining(['conductors[0].lengthFt', 'conductors[0]']));
  });
});

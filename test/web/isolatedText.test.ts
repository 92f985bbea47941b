import { describe, expect, it } from 'vitest';
import { emptyProject } from '../../web/src/editor/commands/newDrawing';
import { bidiHazards, isolateSegments } from '../../web/src/panels/bidi';

/** Unicode bidi isolation (UAX #9 §2.7, isolates; the HTML <bdi> element). */
describe('isolateSegments', () => {
  const rlo = 'LP\u202E1 feeder';
  it('isolates each occurrence of a hazardous label and leaves the rest of the message plain', () => {
    const segs = isolateSegments(`Conductor to ${rlo}: 600 A exceeds 200 A; ${rlo} again.`, [rlo]);
    expect(segs.filter((s) => s.isolate).map((s) => s.text)).toEqual([rlo, rlo]);
    expect(segs.map((s) => s.text).join('')).toBe(`Conductor to ${rlo}: 600 A exceeds 200 A; ${rlo} again.`);
    expect(segs.find((s) => s.text.includes('600 A'))!.isolate).toBe(false);
  });
  it('a bidi control outside any known label still isolates its own segment', () => {
    const segs = isolateSegments('abc \u202Edef', []);
    expect(segs).toEqual([{ text: 'abc \u202Edef', isolate: true }]);
  });
  it('finds hazards among labels and ids only when they hold RTL letters or bidi controls', () => {
    const doc = emptyProject();
    doc.nodes.push({ id: 'U1', kind: 'utility', label: 'plain', voltsLL: 480, phases: 3 } as (typeof doc.nodes)[number]);
    doc.nodes.push({ id: 'U2', kind: 'utility', label: 'לוח ראשי', voltsLL: 480, phases: 3 } as (typeof doc.nodes)[number]);
    doc.nodes.push({ id: 'X\u202E', kind: 'utility', voltsLL: 480, phases: 3 } as (typeof doc.nodes)[number]);
    expect(bidiHazards(doc).sort()).toEqual(['X\u202E', 'לוח ראשי'].sort());
  });
  it('after an element is replaced in place, the answer is that of the whole list read again', () => {
    const utility = (id: string, label: string) => ({ id, kind: 'utility', label, voltsLL: 480, phases: 3 }) as ReturnType<typeof emptyProject>['nodes'][number];
    const base = emptyProject();
    const nodes = [utility('U1', 'plain'), utility('U2', 'לוח ראשי'), utility('U3', 'also plain')];
    const docs = [
      { ...base, nodes },
      { ...base, nodes: [utility('U1', 'renamed'), nodes[1]!, nodes[2]!] },
      { ...base, nodes: [nodes[0]!, nodes[1]!, utility('U3', 'LP\u202E2')] },
      { ...base, nodes: [nodes[0]!, utility('U2', 'plain now'), utility('U3', 'LP\u202E2')] },
      { ...base, nodes: [nodes[0]!, utility('U2', 'plain now'), nodes[2]!] },
    ];
    const expected = [['לוח ראשי'], ['לוח ראשי'], ['לוח ראשי', 'LP\u202E2'], ['LP\u202E2'], []];
    docs.forEach((d, i) => expect(bidiHazards(d)).toEqual(expected[i]));
  });
});

import type { AnalysisReport, Conductor, ConductorReport, EquipmentNode, Severity, Verdict } from '@linewright/core';
import { indexReport } from '../analysis/reportIndex';
import { VERDICT_TEXT, conductorFamily, type VerdictFamily } from '../analysis/verdicts';
import { conductorLine, kindSpec, nodeFacts } from '../editor/equipment';
import type { EditorState } from '../editor/store';
import { useEditorState } from '../editor/useEditor';

/**
 * What a drawn element shows that the check decides (verdict, colour, finding flag) and the words
 * read out for it. The React Flow node and edge objects carry only ids, positions and geometry, so a
 * new report leaves them (and React Flow's lookups) untouched; each component reads its own look by
 * id from the editor store, the way xyflow's NodeRenderer subscribes to ids and lets each node select
 * itself. A look object is kept while nothing in it changed, so the selector's answer is stable and
 * only the elements whose look moved re-render.
 */
export interface ConductorLook {
  /** The user's name for the conductor, shown as a tooltip. */
  name: string | null;
  /** First label line: sets × size, material, length. */
  line: string;
  verdict: Verdict | null;
  verdictText: string;
  family: VerdictFamily;
  /** What a screen reader says for the conductor. */
  spoken: string;
}

export interface NodeLook {
  /** Most serious finding about this equipment, or null. */
  worst: Severity | null;
  findingCount: number;
  spoken: string;
}

const conductorMaps = new WeakMap<readonly Conductor[], Map<string, Conductor>>();
const nodeMaps = new WeakMap<readonly EquipmentNode[], Map<string, EquipmentNode>>();

function byId<T extends { id: string }>(cache: WeakMap<readonly T[], Map<string, T>>, list: readonly T[]): Map<string, T> {
  let m = cache.get(list);
  if (!m) {
    m = new Map();
    for (const x of list) m.set(x.id, x);
    cache.set(list, m);
  }
  return m;
}

const conductorLooks = new WeakMap<Conductor, ConductorLook>();
const nodeLooks = new WeakMap<EquipmentNode, NodeLook>();

/** The family a conductor is drawn in: one core answer for the alarm, so a violation on it shows whatever its verdict. */
export function familyOf(report: AnalysisReport | null, r: ConductorReport | undefined): VerdictFamily {
  return report && r ? conductorFamily(report, r) : 'pending';
}

/** The look of conductor `id` in this state, or null when the document has no such conductor. */
export function conductorLook(s: EditorState, id: string): ConductorLook | null {
  const c = byId(conductorMaps, s.doc.conductors).get(id);
  if (!c) return null;
  const report = s.report;
  const r = report ? indexReport(report).conductor.get(id) : undefined;
  const verdict = r?.verdict ?? null;
  const family = familyOf(report, r);
  const verdictText = verdict ? VERDICT_TEXT[verdict] : report ? 'not checked' : 'checking…';
  const prev = conductorLooks.get(c);
  if (prev && prev.verdict === verdict && prev.family === family && prev.verdictText === verdictText) return prev;
  const name = c.label ?? null;
  // The drawing shows the facts (sets × size, material, length); the conductor's own name is in the
  // details panel and the tooltip, so labels stay narrow enough to sit between columns of equipment.
  const line = prev?.line ?? conductorLine(c);
  const look: ConductorLook = { name, line, verdict, verdictText, family, spoken: `Conductor ${name ? `${name}: ` : ''}${line}, ${verdictText}` };
  conductorLooks.set(c, look);
  return look;
}

/** The look of equipment `id` in this state, or null when the document has no such piece. */
export function nodeLook(s: EditorState, id: string): NodeLook | null {
  const n = byId(nodeMaps, s.doc.nodes).get(id);
  if (!n) return null;
  const idx = indexReport(s.report);
  const worst = idx.worstByElement.get(id) ?? null;
  const findingCount = idx.findingsByElement.get(id)?.length ?? 0;
  const prev = nodeLooks.get(n);
  if (prev && prev.worst === worst && prev.findingCount === findingCount) return prev;
  const spec = kindSpec(n.kind);
  const spoken = `${spec.title} ${n.label || n.id}, ${nodeFacts(n)}${findingCount ? `, ${findingCount} finding${findingCount === 1 ? '' : 's'}` : ''}`;
  const look: NodeLook = { worst, findingCount, spoken };
  nodeLooks.set(n, look);
  return look;
}

export function useConductorLook(id: string): ConductorLook | null {
  return useEditorState((s) => conductorLook(s, id));
}

export function useNodeLook(id: string): NodeLook | null {
  return useEditorState((s) => nodeLook(s, id));
}

/**
 * The id of the hidden element that names a drawn element for screen readers (`aria-labelledby`):
 * the name changes with every verdict, the React Flow object carrying the reference does not.
 * Encoded so an id with spaces stays one reference.
 */
export function spokenNameId(kind: 'node' | 'conductor', id: string): string {
  return `lw-name-${kind === 'node' ? 'n' : 'c'}-${encodeURIComponent(id)}`;
}

import type { Project } from '../../model/schema';
import { layoutNodes, type Point } from '../layout';

/**
 * Beyond this distance from the origin (in drawing units; the editor places pieces within a few thousand)
 * a position is not a place on a drawing but a slip or damage: the schema accepts any finite number, so
 * the printed drawing must not depend on it.
 */
export const FAR_POSITION = 1_000_000;

export interface PrintPositions {
  positions: Map<string, Point>;
  /** Set when the file's positions were set aside and the drawing laid out anew; said on the sheet. */
  note: string | null;
}

/**
 * Where each piece is drawn in the PDF: the file's positions, or, when any lies beyond FAR_POSITION
 * (x = 1e9, y = -1e308), a fresh top-down layout of the whole drawing, so one stray number can neither
 * shrink the drawing to a dot nor make the sheet and label code walk an astronomical area.
 */
export function printPositions(project: Project): PrintPositions {
  const edges = [...project.conductors, ...project.busLinks];
  const far = project.nodes.find((n) => n.position && (Math.abs(n.position.x) > FAR_POSITION || Math.abs(n.position.y) > FAR_POSITION));
  if (!far) return { positions: layoutNodes(project.nodes, edges), note: null };
  return {
    positions: layoutNodes(project.nodes.map((n) => ({ id: n.id })), edges),
    note: `Equipment positions in the file lie beyond ${FAR_POSITION.toLocaleString('en-US')} drawing units (first: ${far.id}); this drawing was laid out anew for print. Fix the positions in the editor (Arrange) to print your own layout.`,
  };
}

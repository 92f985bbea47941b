import { conductorFindings } from './conductorFindings';
import type { FixedContext } from './context';
import { equipmentFindings } from './equipmentFindings';
import { panelboardFindings } from './panelboardFindings';
import { topologyFindings } from './topologyFindings';
import type { Finding } from './types';

/**
 * Stage: every finding, one sentence each with its citation, the elements
 * involved and the fixes. Order is stable: conductors in file order, then
 * equipment, then the shape of the network.
 */
export function collectFindings(ctx: FixedContext): Finding[] {
  return [...conductorFindings(ctx), ...equipmentFindings(ctx), ...panelboardFindings(ctx), ...topologyFindings(ctx)];
}

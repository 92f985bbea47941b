import { conductorFindings } from './conductorFindings';
import type { FixedContext } from './context';
import { equipmentFindings } from './equipmentFindings';
import { panelboardFindings } from './panelboardFindings';
import { topologyFindings } from './topologyFindings';
import type { Finding } from './types';

/**
 * Stage: every finding, one sentence each with its citation, the elements
 * involved and the fixes. Order is stable: conductors in file order, then
 * equipment, then the shape of the network. `conductorStart`, when given,
 * receives where each conductor's findings begin (see conductorFindings).
 */
export function collectFindings(ctx: FixedContext, conductorStart?: Int32Array): Finding[] {
  return [...conductorFindings(ctx, conductorStart), ...equipmentFindings(ctx), ...panelboardFindings(ctx), ...topologyFindings(ctx)];
}

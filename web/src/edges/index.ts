import { BusLinkEdge } from './BusLinkEdge';
import { ConductorEdge } from './ConductorEdge';

/** Module constant, like nodeTypes. */
export const edgeTypes = { conductor: ConductorEdge, busLink: BusLinkEdge };

export { networkSystems, systemHasNeutral, systemText, type NetworkSystems, type Serves } from '../analyze/circuits';

export * from './types';
export { buildTakeoff, DEFAULT_MAKEUP_FT } from './takeoff';
export { circuitMakeup, conductorCircuits, countCurrentCarrying } from '../analyze/circuits';
export { sizeEgc, proportionalEgcSize, minimumPhaseSize } from './egc';
export { sizeRaceway, racewayKindOf, type RacewayContent } from './raceway';
export { networkSystems, systemText, systemHasNeutral } from './system';
export { takeoffTotals, type TakeoffTotals } from './totals';
export { takeoffTables, type TakeoffTable, type TakeoffColumn, type TakeoffCell } from './tables';

export { sizeConductor, judge, type SizingOptions, type SizingResult, type SizingCandidate, type SizingChoice, type BindingLimit } from './sizeConductor';
export { COST_BASIS, costPerFt, MATERIAL_COST_FACTOR, INSTALLATION_KCMIL_PER_CONDUCTOR } from './cost';
export { configsByCost, MAX_PARALLEL_SETS } from './configs';
export type { SizingConfig } from './trial';
export { renderSizingText } from './text';

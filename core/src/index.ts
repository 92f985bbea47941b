export * from './model/schema';
export * from './analyze/types';
export { CAUTION, CAUTION_SHORT } from './caution';

export * from './model/schema';
export * from './analyze/types';
export { loadProject, formatPath, type LoadResult } from './model/load';
export { migrateToCurrent, MIGRATIONS, type Migration } from './model/migrations';
export { CAUTION, CAUTION_SHORT } from './caution';

/** Plan review: comments, dispositions of findings, submittal rounds and what changed between them. Pure functions. */
export * from './comments';
export * from './dispositions';
export * from './diff';
export * from './fingerprint';
export * from './rounds';
export { sameValue } from './values';
export * from './report';
export * from './letter';

export * from './types';
export { decideChange, type ChangeHead, type Decision, type DocHead } from './decideChange';
export { resolveConflict, type FreshIds, type ResolutionPlan } from './resolveConflict';

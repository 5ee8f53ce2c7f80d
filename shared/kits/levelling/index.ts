export type { LevellingNet, Station, LevelLine } from './LevellingNet';
export { LEVELLING_STANDARDS, DEFAULT_STANDARD_KEY, levellingStandard, customStandard, allowableMm, type LevellingStandard } from './LevellingStandard';
export { readLevellingCsv, type ReadNetResult } from './readLevellingCsv';
export { adjustLevellingNet, LEVELLING_CAUTION, DEFAULT_CRITICAL, type ResidualTest, type LevellingReport, type LoopCheck, type TraverseCheck, type LevellingOptions } from './adjustLevellingNet';
export { cycleBasis, shortestPath, type Cycle } from './cycleBasis';

export { runStudy, computeFeatureStage, FEATURE_COLUMNS, type RunOptions, type RunOutcome, type FeatureStage } from './run-study.ts';
export { checkStudy, type CheckReport } from './check-study.ts';
export { buildResults, RESULTS_SCHEMA_VERSION, type Results } from './results.ts';
export { studyWarnings, subjectsPerGroup, windowsAvailable, TIED_SHARE_WARNING } from './warnings.ts';
export { stageFolder, abandonActiveStaging, writeFileAtomic, type StagedFolder } from './output-folder.ts';
export { estimateStatisticsCost, resourceConcerns, formatDuration, MAX_SENSIBLE_SECONDS } from './cost.ts';
export { sha256File, sha256Text } from './hash.ts';
export { TOOL_VERSION } from './version.ts';

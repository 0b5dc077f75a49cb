/** The evaluation stage: statistics on a feature matrix. Re-exports only. */
export type { FeatureColumn, FeatureMatrix, ClassifierName, EvaluationSettings } from './types.ts';
export type { Classifier, Model, TrainingSet } from './classifier.ts';
export type { EvaluationResult, ColumnName } from './result.ts';
export { evaluateStudy, evaluateStudyWith, evaluateWithClassifier, prepareStudy, classifierFor, STOP_AFTER_EXCEEDANCES, type ProgressCallback, type PreparedStudy, type PermutationStage } from './evaluate.ts';
export { compareGroups, type UnivariateRow } from './univariate.ts';
export { aucFromScores, aucWithInterval } from './auc.ts';
export { mannWhitneyU } from './mann-whitney.ts';
export { hedgesG } from './hedges.ts';
export { benjaminiHochberg } from './fdr.ts';
export { midRanks } from './ranks.ts';
export { rocCurve, type RocPoint } from './roc.ts';
export { createForest, createLogistic } from './classifiers/index.ts';
export { permutedStatistics, permutedStatisticsRange, permutationPValue, runPermutationTest, type PermutablePipeline, type PermutationRun } from './permutation.ts';

/** The classifiers of the evaluation stage (re-exports only). */
export { createForest, fitForest } from './forest.ts';
export type { ForestModel, ForestOptions } from './forest.ts';
export { createLogistic, fitLogistic } from './logistic.ts';
export type { LogisticModel, LogisticOptions } from './logistic.ts';

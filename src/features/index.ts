/** The feature stage: ordinal-pattern features of one recording over a grid. Re-exports only. */
export * from './types.ts';
export { computeGridFeatures } from './grid-features.ts';
export { coarseGrain } from './coarse-grain.ts';
export { factorial } from './factorial.ts';
export { orderedBellNumber } from './ordered-bell.ts';
export { ordinalPatternCode, ordinalPatternFromCode, successorPatternCode } from './pattern-code.ts';
export { ordinalSymbolCode, ordinalSymbolFromCode, symbolCodeSpace } from './symbol-code.ts';
export { countOrdinalPatterns, type PatternCounts } from './count-patterns.ts';
export { scanOrdinalPatterns, type OrdinalScan, type TransitionEdges } from './ordinal-scan.ts';
export { shannonEntropy, normalizedEntropy } from './entropy.ts';
export { complexityConstant, jensenShannonToUniform, statisticalComplexity } from './complexity.ts';
export { complexityBounds, type PlanePoint } from './complexity-bounds.ts';
export { transitionFeatures, type NetworkFeatures } from './transition-features.ts';
export { featuresFromScan, type FeatureEstimate } from './scan-features.ts';
export { averageEstimates } from './average-estimates.ts';
export { dataResolution } from './data-resolution.ts';
export { jitterBelowResolution } from './jitter.ts';
export { FEATURE_DEFINITIONS_VERSION } from './version.ts';

import { statisticalComplexity } from './complexity.ts';
import { normalizedEntropy } from './entropy.ts';
import type { OrdinalScan } from './ordinal-scan.ts';
import { transitionFeatures } from './transition-features.ts';
import { FEATURE_NAMES, type FeatureName } from './types.ts';

/** Feature values of one scan, null where not computable, with the reason. */
export interface FeatureEstimate {
  values: Record<FeatureName, number | null>;
  reasons: Partial<Record<FeatureName, string>>;
}

/**
 * All nine features of shared/DESIGN.md from one scan: permutation_entropy,
 * weighted_permutation_entropy and statistical_complexity normalised with M = the scan's
 * alphabet size (m!, or the ordered Bell number under the `symbols` tie rule),
 * missing_patterns = (M - patterns seen) / M, and the transition-network features of
 * {@link transitionFeatures}.
 *
 * O(patterns seen + edges). Missing values: with no valid window every feature is null
 * ("no valid window"); with valid windows that all have zero variance, or one holding an
 * infinite value, the weighted entropy is null; with no two consecutive valid windows the five network features are null.
 *
 * @example featuresFromScan(scanOrdinalPatterns(Float64Array.of(4, 7, 9, 10, 6, 11, 3), 1, [3])[0])
 *   .values.permutation_entropy // 0.588762155916294
 */
export function featuresFromScan(scan: OrdinalScan): FeatureEstimate {
  const values = {} as Record<FeatureName, number | null>;
  const reasons: Partial<Record<FeatureName, string>> = {};
  const missing = (name: FeatureName, reason: string): void => {
    values[name] = null;
    reasons[name] = reason;
  };
  const M = scan.alphabetSize;
  if (scan.validWindows === 0) {
    const reason = `no valid window of order ${scan.order} at delay ${scan.delay}: the series is shorter than ${
      (scan.order - 1) * scan.delay + 1
    } samples or every window holds a missing sample`;
    for (const name of PATTERN_FEATURES) missing(name, reason);
  } else {
    values.permutation_entropy = normalizedEntropy(scan.counts, M);
    values.statistical_complexity = statisticalComplexity(scan.counts, M);
    values.missing_patterns = (M - scan.patterns.length) / M;
    const totalWeight = scan.weights.reduce((a, b) => a + b, 0);
    if (!Number.isFinite(totalWeight)) {
      missing('weighted_permutation_entropy', 'a window holds an infinite value, so its variance (the weight) is undefined');
    } else if (totalWeight > 0) {
      values.weighted_permutation_entropy = normalizedEntropy(scan.weights, M);
    } else {
      missing('weighted_permutation_entropy', 'every valid window has zero variance, so no window carries weight');
    }
  }
  const network = transitionFeatures(scan.transitions);
  if (network === null) {
    const reason = 'no two consecutive valid windows, so the ordinal network has no transition';
    for (const name of NETWORK_FEATURES) missing(name, reason);
  } else {
    values.transition_entropy = network.transitionEntropy;
    values.conditional_entropy = network.conditionalEntropy;
    values.outdegree_mean = network.outdegreeMean;
    values.outdegree_variance = network.outdegreeVariance;
    values.self_loop_fraction = network.selfLoopFraction;
  }
  const ordered = Object.fromEntries(FEATURE_NAMES.map((name) => [name, values[name]])) as FeatureEstimate['values'];
  return { values: ordered, reasons };
}

const PATTERN_FEATURES: readonly FeatureName[] = [
  'permutation_entropy',
  'weighted_permutation_entropy',
  'statistical_complexity',
  'missing_patterns',
];
const NETWORK_FEATURES: readonly FeatureName[] = [
  'transition_entropy',
  'conditional_entropy',
  'outdegree_mean',
  'outdegree_variance',
  'self_loop_fraction',
];

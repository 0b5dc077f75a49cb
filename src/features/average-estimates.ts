import type { FeatureEstimate } from './scan-features.ts';
import { FEATURE_NAMES } from './types.ts';

/**
 * Mean of several estimates of the same features: over jitter draws (tie rule `jitter`) or
 * over the s shifted coarse-grainings (composite form, Wu et al. 2013, Entropy 15, 1069).
 * A feature is null when it is null in any estimate, with that estimate's reason prefixed
 * by its label: a mean over part of the draws or offsets would be another estimator.
 *
 * O(estimates · features). An empty list gives every feature null ("nothing to average").
 *
 * @example averageEstimates([a, b], ['offset 0', 'offset 1']) // values = (a + b) / 2, feature by feature
 */
export function averageEstimates(estimates: readonly FeatureEstimate[], labels: readonly string[]): FeatureEstimate {
  if (estimates.length === 1) return estimates[0];
  const values = {} as FeatureEstimate['values'];
  const reasons: FeatureEstimate['reasons'] = {};
  for (const name of FEATURE_NAMES) {
    let sum = 0;
    let reason: string | undefined = estimates.length === 0 ? 'nothing to average' : undefined;
    estimates.forEach((estimate, i) => {
      const value = estimate.values[name];
      if (value === null) reason ??= `${labels[i]}: ${estimate.reasons[name] ?? 'not computable'}`;
      else sum += value;
    });
    values[name] = reason === undefined ? sum / estimates.length : null;
    if (reason !== undefined) reasons[name] = reason;
  }
  return { values, reasons };
}

/**
 * Hedges' g: the standardised mean difference with its small-sample correction and interval.
 */
import { normalQuantile } from './mann-whitney.ts';

/** Size, mean and sample standard deviation (denominator n − 1) of one group. */
export interface GroupMoments {
  n: number;
  mean: number;
  sd: number;
}

export interface HedgesG {
  /** Cohen's d with the pooled SD: (mean1 − mean0) / s_pooled. */
  d: number;
  /** Small-sample correction J = 1 − 3/(4·df − 1), df = n0 + n1 − 2. */
  correction: number;
  /** g = J·d, positive when group 1 has the larger mean. */
  g: number;
  /** Var(g) = J²·Var(d). */
  variance: number;
  se: number;
  /** Wald interval g ± z·se at the requested level. */
  low: number;
  high: number;
}

/** Why g could not be computed. */
export interface HedgesGMissing {
  reason: string;
}

/**
 * Hedges' g of group 1 against group 0 (Hedges 1981, J. Educ. Stat. 6, 107; Hedges & Olkin
 * 1985, Statistical Methods for Meta-Analysis; formulas as in Borenstein et al. 2009,
 * Introduction to Meta-Analysis, ch. 4):
 * s_pooled = √[((n0−1)s0² + (n1−1)s1²)/(n0+n1−2)], d = (m1 − m0)/s_pooled,
 * Var(d) = (n0+n1)/(n0·n1) + d²/(2(n0+n1)), J = 1 − 3/(4·df − 1), g = J·d, Var(g) = J²·Var(d),
 * interval g ± z·√Var(g) with z the (1 + level)/2 normal quantile.
 *
 * Returns `{ reason }` instead when a group has fewer than 2 values, a moment is not finite,
 * or the pooled SD is 0. Throws RangeError for a level outside (0, 1). O(1).
 *
 * @example hedgesG({ n: 50, mean: 100, sd: 4.5 }, { n: 50, mean: 103, sd: 5.5 })
 * // d 0.597022, correction 0.992327, g 0.592442, variance 0.041143, low 0.194885, high 0.989998
 */
export function hedgesG(group0: GroupMoments, group1: GroupMoments, level = 0.95): HedgesG | HedgesGMissing {
  if (!(level > 0 && level < 1)) throw new RangeError(`hedgesG: level must lie in (0, 1), got ${level}`);
  if (group0.n < 2 || group1.n < 2) return { reason: `needs at least 2 values per group (got ${group0.n} and ${group1.n})` };
  if (![group0.mean, group0.sd, group1.mean, group1.sd].every(Number.isFinite)) {
    return { reason: 'a group mean or standard deviation is not finite' };
  }
  const df = group0.n + group1.n - 2;
  const pooledVariance = ((group0.n - 1) * group0.sd ** 2 + (group1.n - 1) * group1.sd ** 2) / df;
  if (!(pooledVariance > 0)) return { reason: 'zero variance within both groups' };
  const d = (group1.mean - group0.mean) / Math.sqrt(pooledVariance);
  const nSum = group0.n + group1.n;
  const varianceD = nSum / (group0.n * group1.n) + (d * d) / (2 * nSum);
  const correction = 1 - 3 / (4 * df - 1);
  const g = correction * d;
  const variance = correction * correction * varianceD;
  const se = Math.sqrt(variance);
  const half = normalQuantile((1 + level) / 2) * se;
  return { d, correction, g, variance, se, low: g - half, high: g + half };
}

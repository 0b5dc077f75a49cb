/**
 * Area under the ROC curve from scores and 0/1 labels, with DeLong's standard error.
 */
import { rankWithTies } from './ranks.ts';
import { normalQuantile } from './mann-whitney.ts';

/**
 * AUC = U / (n1·n0): the share of (positive, negative) pairs in which the positive scores
 * higher, ties counting 1/2 (Bamber 1975, J. Math. Psychol. 12, 387; Hanley & McNeil 1982,
 * Radiology 143, 29). Labels: 1 = positive, 0 = negative. Computed from mid-ranks,
 * U = R1 − n1(n1+1)/2 with R1 the rank sum of the positives.
 *
 * Complexity O(n log n). Returns NaN when either class is empty or any score is NaN.
 * Throws RangeError when lengths differ or a label is neither 0 nor 1.
 *
 * @example aucFromScores([0.1, 0.4, 0.35, 0.8], [0, 0, 1, 1]) // 0.75
 */
export function aucFromScores(scores: ArrayLike<number>, labels: ArrayLike<number>): number {
  const parts = rankParts(scores, labels);
  return parts === null ? Number.NaN : parts.auc;
}

/** AUC with its standard error and a two-sided confidence interval. */
export interface AucInterval {
  auc: number;
  /** DeLong standard error; NaN when a class has fewer than 2 members. */
  se: number;
  low: number;
  high: number;
}

/**
 * AUC with the DeLong, DeLong & Clarke-Pearson (1988, Biometrics 44, 837) standard error,
 * computed from mid-ranks as in Sun & Xu (2014, IEEE Signal Process. Lett. 21, 1389):
 * for a positive i, V10_i = (R_i − R_i⁺)/n0 with R_i its rank among all scores and R_i⁺ its
 * rank among the positives; for a negative j, V01_j = 1 − (R_j − R_j⁻)/n1. Then
 * Var(AUC) = S10/n1 + S01/n0 with S10, S01 the sample variances (denominator n − 1) of the
 * V10 and V01.
 *
 * The interval is the plain (Wald) interval AUC ± z·SE on the AUC scale, clipped to [0, 1]
 * (not the logit-scale interval), with z the (1 + level)/2 normal quantile.
 *
 * Complexity O(n log n). When either class is empty everything is NaN; when a class has one
 * member the AUC is returned with se, low and high NaN. Throws RangeError for a level
 * outside (0, 1), unequal lengths or labels other than 0/1.
 *
 * @example aucWithInterval([1, 2, 3, 4, 5, 6], [0, 0, 1, 0, 1, 1])
 * // { auc: 0.888889, se: 0.157135, low: 0.580910, high: 1 } (rounded)
 */
export function aucWithInterval(scores: ArrayLike<number>, labels: ArrayLike<number>, level = 0.95): AucInterval {
  if (!(level > 0 && level < 1)) throw new RangeError(`aucWithInterval: level must lie in (0, 1), got ${level}`);
  const parts = rankParts(scores, labels);
  if (parts === null) return { auc: Number.NaN, se: Number.NaN, low: Number.NaN, high: Number.NaN };
  const se = delongStandardError(scores, labels, parts.ranks, parts.n1, parts.n0);
  if (!Number.isFinite(se)) return { auc: parts.auc, se: Number.NaN, low: Number.NaN, high: Number.NaN };
  const half = normalQuantile((1 + level) / 2) * se;
  return { auc: parts.auc, se, low: Math.max(0, parts.auc - half), high: Math.min(1, parts.auc + half) };
}

interface RankParts {
  auc: number;
  ranks: Float64Array;
  n1: number;
  n0: number;
}

function rankParts(scores: ArrayLike<number>, labels: ArrayLike<number>): RankParts | null {
  checkLabels(scores, labels);
  const n1 = countPositives(labels);
  const n0 = labels.length - n1;
  if (n1 === 0 || n0 === 0) return null;
  const { ranks, n } = rankWithTies(scores);
  if (n !== scores.length) return null; // a NaN score cannot be ranked
  let rankSum = 0;
  for (let i = 0; i < labels.length; i++) if (labels[i] === 1) rankSum += ranks[i];
  const u = rankSum - (n1 * (n1 + 1)) / 2;
  return { auc: u / (n1 * n0), ranks, n1, n0 };
}

function delongStandardError(
  scores: ArrayLike<number>,
  labels: ArrayLike<number>,
  ranks: Float64Array,
  n1: number,
  n0: number,
): number {
  if (n1 < 2 || n0 < 2) return Number.NaN;
  const positives = new Float64Array(n1);
  const negatives = new Float64Array(n0);
  const positiveRanks = new Float64Array(n1);
  const negativeRanks = new Float64Array(n0);
  for (let i = 0, p = 0, q = 0; i < labels.length; i++) {
    if (labels[i] === 1) {
      positives[p] = scores[i];
      positiveRanks[p++] = ranks[i];
    } else {
      negatives[q] = scores[i];
      negativeRanks[q++] = ranks[i];
    }
  }
  const withinPositives = rankWithTies(positives).ranks;
  const withinNegatives = rankWithTies(negatives).ranks;
  const v10 = new Float64Array(n1);
  for (let i = 0; i < n1; i++) v10[i] = (positiveRanks[i] - withinPositives[i]) / n0;
  const v01 = new Float64Array(n0);
  for (let j = 0; j < n0; j++) v01[j] = 1 - (negativeRanks[j] - withinNegatives[j]) / n1;
  return Math.sqrt(sampleVariance(v10) / n1 + sampleVariance(v01) / n0);
}

function sampleVariance(x: Float64Array): number {
  let mean = 0;
  let m2 = 0;
  for (let i = 0; i < x.length; i++) {
    const delta = x[i] - mean;
    mean += delta / (i + 1);
    m2 += delta * (x[i] - mean);
  }
  return m2 / (x.length - 1);
}

function checkLabels(scores: ArrayLike<number>, labels: ArrayLike<number>): void {
  if (scores.length !== labels.length) {
    throw new RangeError(`AUC: ${scores.length} scores but ${labels.length} labels — pass one label per score`);
  }
  for (let i = 0; i < labels.length; i++) {
    if (labels[i] !== 0 && labels[i] !== 1) {
      throw new RangeError(`AUC: label ${labels[i]} at position ${i} — labels must be 0 (negative) or 1 (positive)`);
    }
  }
}

function countPositives(labels: ArrayLike<number>): number {
  let n1 = 0;
  for (let i = 0; i < labels.length; i++) if (labels[i] === 1) n1++;
  return n1;
}

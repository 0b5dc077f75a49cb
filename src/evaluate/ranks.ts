/**
 * Mid-ranks (average ranks for ties), the common ground of the rank-sum test and the AUC.
 */

/** Ranks of a sample together with the sizes of its groups of tied values. */
export interface RankedSample {
  /** 1-based mid-ranks; NaN where the input was NaN. */
  ranks: Float64Array;
  /** Size of every group of equal values (groups of size 1 included), in ascending value order. */
  tieSizes: Int32Array;
  /** Number of values ranked (the input length minus its NaN values). */
  n: number;
}

/**
 * Mid-ranks of `values` with their tie groups: tied values all receive the mean of the ranks
 * they occupy (Kendall 1945, Biometrika 33, 239 — "mid-rank" convention, as in the Wilcoxon
 * rank-sum test). Ranks are 1-based. NaN values are left out of the ranking and get rank NaN;
 * `n` counts the values that were ranked. Ties are exact equality (0 and -0 tie); infinities
 * rank as the extreme values.
 *
 * Complexity O(n log n) time (one index sort), O(n) memory. Empty input gives empty arrays.
 *
 * @example rankWithTies([10, 20, 10, NaN]) // ranks [1.5, 3, 1.5, NaN], tieSizes [2, 1], n 3
 */
export function rankWithTies(values: ArrayLike<number>): RankedSample {
  const order = sortedIndicesWithoutNaN(values);
  const ranks = new Float64Array(values.length).fill(Number.NaN);
  const sizes: number[] = [];
  let start = 0;
  while (start < order.length) {
    let end = start + 1;
    const v = values[order[start]];
    while (end < order.length && values[order[end]] === v) end++;
    const midRank = (start + 1 + end) / 2; // mean of ranks start+1 .. end
    for (let k = start; k < end; k++) ranks[order[k]] = midRank;
    sizes.push(end - start);
    start = end;
  }
  return { ranks, tieSizes: Int32Array.from(sizes), n: order.length };
}

/**
 * 1-based mid-ranks of `values` (tied values share the mean of their ranks); see
 * {@link rankWithTies} for the conventions. NaN input gets rank NaN and is not counted.
 * O(n log n). Empty input gives an empty array.
 *
 * @example midRanks([3, 1, 3, 2]) // Float64Array [3.5, 1, 3.5, 2]
 */
export function midRanks(values: ArrayLike<number>): Float64Array {
  return rankWithTies(values).ranks;
}

/**
 * Σ (t³ − t) over the tie groups of a sample, the quantity that shrinks the variance of rank
 * statistics under ties (e.g. Lehmann 1975, Nonparametrics, eq. 1.45 [M]). 0 when no ties.
 *
 * @example tieCorrectionSum(Int32Array.from([2, 1, 3])) // 6 + 0 + 24 = 30
 */
export function tieCorrectionSum(tieSizes: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < tieSizes.length; i++) {
    const t = tieSizes[i];
    sum += t * t * t - t;
  }
  return sum;
}

/** True when at least one tie group has more than one member. */
export function hasTies(tieSizes: ArrayLike<number>): boolean {
  for (let i = 0; i < tieSizes.length; i++) if (tieSizes[i] > 1) return true;
  return false;
}

function sortedIndicesWithoutNaN(values: ArrayLike<number>): Uint32Array {
  let count = 0;
  for (let i = 0; i < values.length; i++) if (!Number.isNaN(values[i])) count++;
  const order = new Uint32Array(count);
  let k = 0;
  for (let i = 0; i < values.length; i++) if (!Number.isNaN(values[i])) order[k++] = i;
  return order.sort((a, b) => compareNumbers(values[a], values[b]));
}

function compareNumbers(a: number, b: number): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

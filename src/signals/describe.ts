/** Data-quality figures of one series, as read (before any coarse-graining). */
export interface SeriesSummary {
  /** Samples, missing included. */
  length: number;
  /** NaN samples. */
  missing: number;
  /** Longest run of consecutive NaN samples (0 when none). */
  longestGap: number;
  /** Distinct non-NaN values. */
  distinct: number;
  /**
   * Share of adjacent pairs (x_t, x_{t+1}), both present, with x_t == x_{t+1}; NaN when no
   * such pair exists. Equal neighbours make ties in ordinal patterns, which bias permutation
   * entropy down (Zunino et al. 2017, Phys. Lett. A 381, 1883).
   */
  tiedShare: number;
}

/**
 * Describes the quality of a series for ordinal-pattern analysis: length, missing samples,
 * the longest gap, the number of distinct values and the share of equal neighbours.
 *
 * Complexity O(n log n) (distinct values are counted on a sorted typed copy); the input
 * is not modified.
 *
 * @returns for empty input `{ length: 0, missing: 0, longestGap: 0, distinct: 0, tiedShare: NaN }`.
 * @example describeSeries(Float64Array.of(1, 1, NaN, NaN, 2, 2, 3))
 *   // { length: 7, missing: 2, longestGap: 2, distinct: 3, tiedShare: 2/3 } (present neighbours 1-1, 2-2, 2-3)
 */
export function describeSeries(values: Float64Array): SeriesSummary {
  let missing = 0;
  let run = 0;
  let longestGap = 0;
  let pairs = 0;
  let ties = 0;
  for (let i = 0; i < values.length; i++) {
    if (Number.isNaN(values[i])) {
      missing++;
      run++;
      if (run > longestGap) longestGap = run;
      continue;
    }
    run = 0;
    if (i > 0 && !Number.isNaN(values[i - 1])) {
      pairs++;
      if (values[i] === values[i - 1]) ties++;
    }
  }
  return { length: values.length, missing, longestGap, distinct: countDistinct(values), tiedShare: pairs === 0 ? NaN : ties / pairs };
}

function countDistinct(values: Float64Array): number {
  const sorted = values.filter((v) => !Number.isNaN(v)).sort();
  let distinct = sorted.length > 0 ? 1 : 0;
  for (let i = 1; i < sorted.length; i++) if (sorted[i] !== sorted[i - 1]) distinct++;
  return distinct;
}

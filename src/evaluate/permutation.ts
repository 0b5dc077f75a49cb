/**
 * Label-permutation test of a whole pipeline (Ojala & Garriga 2010, J. Mach. Learn. Res. 11,
 * 1833, test 1): the group labels of whole subjects are permuted and everything that depends
 * on them (fold split, preprocessing, training, selection) is rerun.
 *
 * Permutation k draws its labels from the stream deriveSeed(seed, 'permutation', k) alone, so
 * the statistic of permutation k is the same whichever worker computes it and in whatever
 * order: a pool may split the index range [0, B) freely and the p-value does not change.
 *
 * p = (1 + b) / (1 + B), b the number of permuted statistics at least as large as the observed
 * one (Phipson & Smyth 2010, Stat. Appl. Genet. Mol. Biol. 9, art. 39): never 0, and exact
 * for random permutations drawn with replacement.
 */
import { createRng, deriveSeed, shuffleInPlace } from '../shared/random.ts';

/**
 * A pipeline under test: maps subject labels to a vector of statistics, larger meaning
 * stronger evidence of a group difference. Entry 0 is the one the headline p-value and the
 * sequential stopping rule look at; the others (e.g. one per grid cell) ride along on the
 * same permutations.
 */
export interface PermutablePipeline {
  /** Observed subject labels (0/1). */
  subjectLabels: Uint8Array;
  /** Seed of the permutation streams. */
  seed: number;
  statistics(subjectLabels: Uint8Array): Float64Array;
}

/**
 * A uniformly random permutation of subject labels (Fisher–Yates with the given seed);
 * the input is not modified. O(S). Group sizes are kept.
 * Example: permuteSubjectLabels([0,0,1,1], 7) is some arrangement of two 0s and two 1s.
 */
export function permuteSubjectLabels(subjectLabels: Uint8Array, seed: number): Uint8Array {
  return shuffleInPlace(Uint8Array.from(subjectLabels), createRng(seed));
}

/**
 * The labels of permutation k: permuteSubjectLabels(labels, deriveSeed(seed, 'permutation', k)).
 * Example: permutationLabels(l, s, 3) is identical in every process and thread.
 */
export function permutationLabels(subjectLabels: Uint8Array, seed: number, k: number): Uint8Array {
  return permuteSubjectLabels(subjectLabels, deriveSeed(seed, 'permutation', k));
}

/**
 * Statistics of permutation k alone: the unit of work a worker pool distributes.
 * Cost: one run of the pipeline.
 */
export function permutedStatistics(pipeline: PermutablePipeline, k: number): Float64Array {
  return pipeline.statistics(permutationLabels(pipeline.subjectLabels, pipeline.seed, k));
}

/**
 * Statistics of permutations from (inclusive) to `to` (exclusive), in index order.
 * Returns one Float64Array per permutation.
 */
export function permutedStatisticsRange(pipeline: PermutablePipeline, from: number, to: number, onEach?: (k: number) => void): Float64Array[] {
  const out: Float64Array[] = [];
  for (let k = from; k < to; k++) {
    out.push(permutedStatistics(pipeline, k));
    onEach?.(k);
  }
  return out;
}

/** A permutation p-value with its Monte Carlo uncertainty. */
export interface PermutationPValue {
  /** (1 + b) / (1 + B), or Besag–Clifford h / L after early stopping. */
  p_value: number;
  /** Monte Carlo standard error sqrt(p (1 − p) / B) (binomial; common practice). */
  p_value_se: number;
  /** b: permuted statistics >= the observed one. */
  exceedances: number;
  /** B: permutations used. */
  permutations: number;
}

/**
 * p = (1 + b) / (1 + B) with b = #{k : null[k] >= observed}, following Phipson & Smyth (2010).
 * NaN null values count as exceedances (conservative). O(B).
 * Returns NaN p when the observed statistic is NaN; with B = 0, p = 1.
 * Example: observed 0.8, null [0.5, 0.9, 0.8, 0.1] -> b = 2, p = 3/5 = 0.6.
 */
export function permutationPValue(observed: number, nullStatistics: ArrayLike<number>): PermutationPValue {
  const B = nullStatistics.length;
  if (observed !== observed) return { p_value: NaN, p_value_se: NaN, exceedances: 0, permutations: B };
  let b = 0;
  for (let k = 0; k < B; k++) if (!(nullStatistics[k] < observed)) b++;
  return withStandardError((1 + b) / (1 + B), b, B);
}

function withStandardError(p: number, b: number, B: number): PermutationPValue {
  return { p_value: p, p_value_se: B > 0 ? Math.sqrt((p * (1 - p)) / B) : NaN, exceedances: b, permutations: B };
}

/** Outcome of a permutation run that may have stopped early. */
export interface PermutationRun {
  /** Statistics of every permutation run, in index order (length L <= B). */
  nullStatistics: Float64Array[];
  headline: PermutationPValue;
  stoppedEarly: boolean;
}

/**
 * Runs permutations 0..B-1 in order. With `stopAfter` = h, stops as soon as h permuted
 * headline statistics (entry 0) have reached the observed one, and reports p = h / L for
 * L permutations run (Besag & Clifford 1991, Biometrika 78, 301, sequential Monte Carlo
 * p-value); a test that runs to the end reports (1 + b) / (1 + B) as without stopping.
 * Stopping only ever cuts short clearly non-significant results: p >= h / B.
 *
 * Cost: up to B pipeline runs. `onEach(done, total)` reports progress.
 */
export function runPermutationTest(
  pipeline: PermutablePipeline,
  observed: Float64Array,
  B: number,
  stopAfter: number | null,
  onEach?: (done: number, total: number) => void,
): PermutationRun {
  const nullStatistics: Float64Array[] = [];
  let b = 0;
  for (let k = 0; k < B; k++) {
    const s = permutedStatistics(pipeline, k);
    nullStatistics.push(s);
    if (!(s[0] < observed[0])) b++;
    onEach?.(k + 1, B);
    if (stopAfter !== null && b >= stopAfter && k + 1 < B) {
      const L = k + 1;
      return { nullStatistics, headline: withStandardError(stopAfter / L, b, L), stoppedEarly: true };
    }
  }
  return { nullStatistics, headline: permutationPValue(observed[0], nullStatistics.map((s) => s[0])), stoppedEarly: false };
}

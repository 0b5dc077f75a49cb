/**
 * Bootstrap sample of a training set, as integer weights (internal to the forest).
 *
 * Efron (1979), "Bootstrap methods: another look at the jackknife", Annals of Statistics 7,
 * 1–26: n draws of a row with replacement. Breiman (2001, Machine Learning 45, 5–32) grows
 * each tree of a forest on one such sample; a row drawn k times weighs k.
 */
import type { Rng } from '../../shared/random.ts';

/**
 * Draws of one generator call: the largest k >= 1 with n^k <= 2^32 (1 for n <= 1).
 *
 * @example drawsPerCall(96) is 4 (96^4 ≈ 8.5e7, 96^5 ≈ 8.2e9).
 */
export function drawsPerCall(n: number): number {
  if (n <= 1) return 1;
  let k = 1;
  while (n ** (k + 1) <= 2 ** 32) k++;
  return k;
}

/**
 * Fills counts[0..n) with the number of times each of n rows is drawn in n draws with
 * replacement. The draws come k = drawsPerCall(n) at a time as the base-n digits of one
 * integer drawn with rng.int(n^k): the digits of an integer uniform below an exact power of n
 * are independent and uniform on 0..n-1 (rng.int(N) is uniform up to a relative error of
 * N / 2^53 <= 2^-21), so one generator call serves k draws.
 *
 * Complexity O(n). The counts sum to n; for n = 0 nothing is drawn.
 *
 * @example drawBootstrapCounts(rng, 3, counts) may give counts [1, 0, 2].
 */
export function drawBootstrapCounts(rng: Rng, n: number, counts: Int32Array): void {
  counts.fill(0, 0, n);
  const perCall = drawsPerCall(n);
  const range = n ** perCall;
  for (let k = 0; k < n; ) {
    let u = rng.int(range);
    for (let d = 0; d < perCall && k < n; d++, k++) {
      const q = Math.floor(u / n);
      counts[u - q * n]++;
      u = q;
    }
  }
}

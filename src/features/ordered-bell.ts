import { factorial } from './factorial.ts';

/**
 * The ordered Bell (Fubini) number a(m): the number of weak orderings of m labelled values,
 * i.e. the number of distinct ordinal symbols when tied values keep a symbol of their own
 * (Bian et al. 2012, Phys. Rev. E 85, 061902). Recurrence a(0) = 1,
 * a(n) = sum_{k=1..n} C(n, k) a(n - k) (Gross 1962, Amer. Math. Monthly 69, 4).
 *
 * O(m^2). Exact for m <= 15 (values below 2^53). Returns NaN for a negative or non-integer m.
 *
 * @example orderedBellNumber(3) // 13
 * @example orderedBellNumber(4) // 75
 */
export function orderedBellNumber(m: number): number {
  if (!Number.isInteger(m) || m < 0) return NaN;
  const a = [1];
  for (let n = 1; n <= m; n++) {
    let sum = 0;
    for (let k = 1; k <= n; k++) sum += (factorial(n) / (factorial(k) * factorial(n - k))) * a[n - k];
    a.push(sum);
  }
  return a[m];
}

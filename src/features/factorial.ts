/** Exact factorials 0! .. 18! (all below 2^53, so exact in a double). */
const EXACT_FACTORIALS: readonly number[] = (() => {
  const table = [1];
  for (let k = 1; k <= 18; k++) table.push(table[k - 1] * k);
  return table;
})();

/**
 * The factorial m! = 1 · 2 · … · m, the number of ordinal patterns of order m
 * (Bandt & Pompe 2002, Phys. Rev. Lett. 88, 174102).
 *
 * Exact for 0 <= m <= 18 (table look-up, O(1)); above 18 the product is formed in floating
 * point and is rounded. Returns NaN for a negative or non-integer m (no factorial exists).
 *
 * @example factorial(3) // 6
 * @example factorial(9) // 362880
 */
export function factorial(m: number): number {
  if (!Number.isInteger(m) || m < 0) return NaN;
  if (m < EXACT_FACTORIALS.length) return EXACT_FACTORIALS[m];
  let product = EXACT_FACTORIALS[EXACT_FACTORIALS.length - 1];
  for (let k = EXACT_FACTORIALS.length; k <= m; k++) product *= k;
  return product;
}

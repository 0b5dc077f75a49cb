/**
 * Keeps sums of very large samples finite. Block means (coarse-graining) and window
 * variances (weighted permutation entropy) add samples or their squares, which overflows to
 * Infinity for values near the largest double (about 1.8e308). When the largest finite |x|
 * exceeds 2^500, the series is multiplied by 2^-k, an exact operation in binary floating point
 * (IEEE 754-2019, scaleB) that keeps every order relation and tie; every feature here is
 * invariant under x -> c·x (c > 0), so the results are those of the unscaled series.
 * Only values below about 2^-550 could lose bits, which no recording pairs with 2^500.
 */
const LIMIT = 2 ** 500;

/**
 * The series itself when its values are safe to sum, else a scaled copy.
 * O(n). Example: safeRange(Float64Array.of(1e308, -1e308))[0] === 1e308 * 2 ** -524.
 */
export function safeRange(x: Float64Array): Float64Array {
  let largest = 0;
  for (let i = 0; i < x.length; i++) {
    const a = Math.abs(x[i]);
    if (a > largest && a !== Infinity) largest = a;
  }
  if (!(largest > LIMIT)) return x;
  const k = Math.ceil(Math.log2(largest));
  const factor = 2 ** -k;
  return x.map((v) => v * factor);
}

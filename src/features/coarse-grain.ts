/**
 * Coarse-graining of a series at scale s (Costa, Goldberger & Peng 2002, Phys. Rev. Lett.
 * 89, 068102, eq. 1): y_j = (1/s) · sum of x over the j-th block of s consecutive samples,
 * blocks not overlapping, the first block starting at `offset` (0 <= offset < s). The
 * shifted forms (offset > 0) are those averaged by the composite multiscale form (Wu et al.
 * 2013, Entropy 15, 1069). A block holding a NaN (missing sample) gives NaN.
 *
 * Returns a new array of floor((x.length - offset) / s) values; s = 1, offset 0 returns a
 * copy of x. An empty x, or an offset past the end, gives an empty array. Throws a
 * RangeError for a non-integer or non-positive scale, or an offset outside [0, s).
 * O(n) time, one pass, no allocation besides the result.
 *
 * @example coarseGrain(Float64Array.of(1, 2, 3, 4, 5), 2)    // [1.5, 3.5]
 * @example coarseGrain(Float64Array.of(1, 2, 3, 4, 5), 2, 1) // [2.5, 4.5]
 */
export function coarseGrain(x: Float64Array, scale: number, offset = 0): Float64Array {
  if (!Number.isInteger(scale) || scale < 1) {
    throw new RangeError(`coarseGrain: scale must be an integer >= 1, got ${scale}`);
  }
  if (!Number.isInteger(offset) || offset < 0 || offset >= scale) {
    throw new RangeError(`coarseGrain: offset must be an integer in [0, ${scale - 1}], got ${offset}`);
  }
  const length = Math.max(0, Math.floor((x.length - offset) / scale));
  const y = new Float64Array(length);
  if (scale === 1) {
    y.set(x.subarray(offset, offset + length));
    return y;
  }
  for (let j = 0, start = offset; j < length; j++, start += scale) {
    let sum = 0;
    for (let i = start; i < start + scale; i++) sum += x[i];
    y[j] = sum / scale;
  }
  return y;
}

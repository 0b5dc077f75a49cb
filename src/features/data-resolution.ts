/**
 * Resolution of a recording: the smallest positive difference between two distinct values
 * (the quantisation step of an 8-bit or integer-millisecond recording, for instance; Zunino
 * et al. 2017, Phys. Lett. A 381, 1883, on why it matters to ordinal methods). NaN and
 * infinite values are ignored.
 *
 * O(n log n) (sorts a copy of the finite values; y is not changed). Returns NaN when fewer
 * than two distinct finite values exist.
 *
 * @example dataResolution(Float64Array.of(3, 1, 1.5, 3, NaN)) // 0.5
 * @example dataResolution(Float64Array.of(2, 2))            // NaN
 */
export function dataResolution(y: Float64Array): number {
  const finite = y.filter((v) => Number.isFinite(v)).sort();
  let smallest = Infinity;
  for (let i = 1; i < finite.length; i++) {
    const step = finite[i] - finite[i - 1];
    if (step > 0 && step < smallest) smallest = step;
  }
  return Number.isFinite(smallest) ? smallest : NaN;
}

/**
 * Benjamini–Hochberg false-discovery-rate q-values.
 */

/**
 * Benjamini–Hochberg adjusted p-values ("q-values") of the step-up procedure (Benjamini &
 * Hochberg 1995, J. R. Stat. Soc. B 57, 289): with the m p-values sorted ascending,
 * q_(i) = min_{k >= i} min(1, p_(k)·m/k). Rejecting every hypothesis with q <= α is the BH
 * procedure at level α. The result is monotone in p and capped at 1; equal p-values get
 * equal q-values. Output is in input order.
 *
 * Missing p-values: NaN stays NaN and is left out of the family, so m counts only the
 * non-NaN p-values (a test that could not be run is not a hypothesis tested).
 *
 * Complexity O(m log m). Empty input gives an empty array. Throws RangeError for a p-value
 * outside [0, 1].
 *
 * @example benjaminiHochberg([0.01, 0.04, NaN, 0.03]) // [0.03, 0.04, NaN, 0.04]
 */
export function benjaminiHochberg(pValues: ArrayLike<number>): Float64Array {
  const q = new Float64Array(pValues.length).fill(Number.NaN);
  const order = indicesOfPresentSortedDescending(pValues);
  const m = order.length;
  let runningMin = 1;
  for (let r = 0; r < m; r++) {
    const rank = m - r; // 1-based rank in ascending order
    const i = order[r];
    runningMin = Math.min(runningMin, pValues[i] * (m / rank)); // m/rank >= 1 exactly, so q >= p survives rounding
    q[i] = runningMin;
  }
  return q;
}

function indicesOfPresentSortedDescending(pValues: ArrayLike<number>): Uint32Array {
  const present: number[] = [];
  for (let i = 0; i < pValues.length; i++) {
    const p = pValues[i];
    if (Number.isNaN(p)) continue;
    if (!(p >= 0 && p <= 1)) throw new RangeError(`benjaminiHochberg: p-value ${p} at position ${i} lies outside [0, 1]`);
    present.push(i);
  }
  return Uint32Array.from(present).sort((a, b) => pValues[b] - pValues[a]);
}

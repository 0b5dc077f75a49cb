/**
 * The integer code of an ordinal symbol under the `symbols` tie rule, where tied values keep
 * a symbol of their own (Bian et al. 2012, Phys. Rev. E 85, 061902): the symbol of a window
 * is its weak ordering, so (1, 2, 2) and (1, 2, 3) are different symbols.
 *
 * For a window (w_0, ..., w_{m-1}) and k = 1..m-1 let lt_k = #{ j < k : w_j < w_k } and
 * eq_k = 1 when some earlier w_j equals w_k, else 0. The digit d_k = 2·lt_k + eq_k lies in
 * 0 .. 2k+1, and code = sum_k d_k · W_k with W_k = 2^(k-1)·k!, so codes lie in
 * 0 .. 2^(m-1)·m! - 1 (see {@link symbolCodeSpace}); the ordered Bell number of codes among
 * them are used. As for ordinalPatternCode, the code of order m is the code of the first
 * m-1 samples plus a digit that only compares the newest sample with the others, which keeps
 * the scan incremental.
 *
 * O(m^2). Returns -1 when the window holds a NaN or has fewer than 2 values.
 *
 * @example ordinalSymbolCode([1, 2, 3]) // 18  (d_1 = 2, d_2 = 4: 2·1 + 4·4)
 * @example ordinalSymbolCode([2, 2, 2]) // 5   (d_1 = 1, d_2 = 1: 1·1 + 1·4)
 */
export function ordinalSymbolCode(window: ArrayLike<number>): number {
  const m = window.length;
  if (m < 2) return -1;
  let code = 0;
  let weight = 1;
  for (let k = 0; k < m; k++) {
    if (Number.isNaN(window[k])) return -1;
    if (k === 0) continue;
    let below = 0;
    let equal = 0;
    for (let j = 0; j < k; j++) {
      if (window[j] < window[k]) below++;
      else if (window[j] === window[k]) equal = 1;
    }
    code += (2 * below + equal) * weight;
    weight *= 2 * (k + 1);
  }
  return code;
}

/**
 * Size 2^(m-1)·m! of the code range of {@link ordinalSymbolCode} for order m (not the number
 * of symbols: that is the ordered Bell number).
 *
 * @example symbolCodeSpace(3) // 24
 */
export function symbolCodeSpace(order: number): number {
  let space = 1;
  for (let k = 1; k < order; k++) space *= 2 * (k + 1);
  return space;
}

/**
 * The weak ordering with a given symbol code, as dense ranks: rank[i] = number of distinct
 * values below w_i. Inverse of {@link ordinalSymbolCode}.
 *
 * O(m^2). Returns null for a code that no window produces.
 *
 * @example ordinalSymbolFromCode(18, 3) // [0, 1, 2]
 * @example ordinalSymbolFromCode(5, 3)  // [0, 0, 0]
 */
export function ordinalSymbolFromCode(code: number, order: number): number[] | null {
  if (!Number.isInteger(code) || code < 0 || code >= symbolCodeSpace(order)) return null;
  // classes: sizes of the tie classes in ascending order; classOf: class index of each sample
  const sizes: number[] = [1];
  const classOf: number[] = [0];
  let weight = 1;
  for (let k = 1; k < order; k++) {
    const digit = Math.floor(code / weight) % (2 * (k + 1));
    weight *= 2 * (k + 1);
    const below = digit >> 1;
    const equal = digit & 1;
    let c = 0;
    let cumulative = 0;
    while (c < sizes.length && cumulative < below) cumulative += sizes[c++];
    if (cumulative !== below) return null;
    if (equal === 1) {
      if (c === sizes.length) return null;
      sizes[c]++;
    } else {
      sizes.splice(c, 0, 1);
      for (let i = 0; i < classOf.length; i++) if (classOf[i] >= c) classOf[i]++;
    }
    classOf.push(c);
  }
  return classOf;
}

/**
 * Shannon entropy (Shannon 1948, Bell Syst. Tech. J. 27, 379) in nats of the distribution
 * p_i = c_i / sum(c) given by non-negative counts or weights: H = -sum p_i ln p_i, zeros
 * contributing nothing.
 *
 * O(k) for k counts. Returns NaN when the total is 0 or not finite (no distribution).
 *
 * @example shannonEntropy([1, 1]) // 0.6931471805599453 (ln 2)
 * @example shannonEntropy([5])    // 0
 * @example shannonEntropy([])     // NaN
 */
export function shannonEntropy(counts: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < counts.length; i++) total += counts[i];
  if (!(total > 0) || !Number.isFinite(total)) return NaN;
  let entropy = 0;
  for (let i = 0; i < counts.length; i++) {
    const p = counts[i] / total;
    if (p > 0) entropy -= p * Math.log(p);
  }
  return entropy;
}

/**
 * Normalised permutation entropy (Bandt & Pompe 2002, Phys. Rev. Lett. 88, 174102, eq. 2,
 * divided by its maximum): H / ln(M), M the number of possible patterns (m! by default),
 * in [0, 1]. With variance weights as `counts` this is the weighted permutation entropy
 * (Fadlallah et al. 2013, Phys. Rev. E 87, 022911).
 *
 * O(k). Returns NaN when the total is 0 or M < 2.
 *
 * @example normalizedEntropy([2, 2, 1], 6) // 0.588762155916294
 */
export function normalizedEntropy(counts: ArrayLike<number>, alphabetSize: number): number {
  if (!(alphabetSize >= 2)) return NaN;
  return shannonEntropy(counts) / Math.log(alphabetSize);
}

import { normalizedEntropy } from './entropy.ts';

/**
 * The normalising constant Q0 of the Jensen–Shannon statistical complexity (Lamberti et al.
 * 2004, Physica A 334, 119; Rosso et al. 2007, Phys. Rev. Lett. 99, 154102):
 * Q0 = -2 / [((M+1)/M) ln(M+1) - 2 ln(2M) + ln M], the reciprocal of the largest
 * Jensen–Shannon divergence to the uniform distribution over M states, reached by a
 * distribution on a single state.
 *
 * O(1). Returns NaN for M < 2.
 *
 * @example complexityConstant(6) // 2.203066987747817
 */
export function complexityConstant(alphabetSize: number): number {
  const M = alphabetSize;
  if (!(M >= 2)) return NaN;
  return -2 / (((M + 1) / M) * Math.log(M + 1) - 2 * Math.log(2 * M) + Math.log(M));
}

/**
 * Jensen–Shannon divergence J(P, U) = S((P+U)/2) - S(P)/2 - S(U)/2 (natural logs) between the
 * distribution given by `counts` over M states and the uniform U = 1/M. States not listed
 * in `counts` have probability 0: only the seen states need to be passed, plus M.
 *
 * O(k). Returns NaN when the total is 0, M < 2 or more counts than M are given.
 *
 * @example jensenShannonToUniform([1], 2) // 0.2157615543388357 (S(3/4, 1/4) - ln(2)/2)
 */
export function jensenShannonToUniform(counts: ArrayLike<number>, alphabetSize: number): number {
  const M = alphabetSize;
  if (!(M >= 2) || counts.length > M) return NaN;
  let total = 0;
  for (let i = 0; i < counts.length; i++) total += counts[i];
  if (!(total > 0)) return NaN;
  // J = (KL(P || mix) + KL(U || mix)) / 2 with mix = (P + U)/2: the same quantity as
  // S(mix) - S(P)/2 - S(U)/2, but every term vanishes exactly where p = 1/M, so the uniform
  // distribution gives 0 without cancellation.
  const u = 1 / M;
  let divergence = 0;
  for (let i = 0; i < counts.length; i++) {
    const p = counts[i] / total;
    const mix = (p + u) / 2;
    if (p > 0) divergence += p * Math.log(p / mix);
    divergence += u * Math.log(u / mix);
  }
  divergence += (M - counts.length) * u * Math.LN2;
  return Math.max(0, divergence / 2);
}

/**
 * Jensen–Shannon statistical complexity (Rosso et al. 2007, Phys. Rev. Lett. 99, 154102,
 * eq. 2-4): C = Q0 · J(P, U) · H, H the normalised permutation entropy and Q0 from
 * {@link complexityConstant}. It is 0 at the uniform and at a one-state distribution.
 *
 * O(k). Returns NaN when the total is 0 or M < 2.
 *
 * @example statisticalComplexity([2, 2, 1], 6) // 0.2899540...
 */
export function statisticalComplexity(counts: ArrayLike<number>, alphabetSize: number): number {
  const h = normalizedEntropy(counts, alphabetSize);
  const j = jensenShannonToUniform(counts, alphabetSize);
  return Math.max(0, complexityConstant(alphabetSize) * j * h);
}

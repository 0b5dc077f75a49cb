/**
 * The two-sided Mann–Whitney U (Wilcoxon rank-sum) test, with the normal distribution
 * functions its large-sample form needs.
 */
import { hasTies, rankWithTies, tieCorrectionSum } from './ranks.ts';

/** Up to this many values in both groups together (and no ties) the exact null distribution is used. */
export const EXACT_MAX_TOTAL = 50;

export type MannWhitneyMethod = 'auto' | 'exact' | 'normal';

export interface MannWhitneyOptions {
  /**
   * `auto` (default): exact null distribution when there are no ties and n0 + n1 <=
   * {@link EXACT_MAX_TOTAL}, the normal approximation otherwise. `exact` throws on ties and
   * above {@link EXACT_FORCED_MAX_TOTAL} values.
   */
  method?: MannWhitneyMethod;
  /** Continuity correction of the normal approximation (default true). */
  continuity?: boolean;
}

export interface MannWhitneyResult {
  /** Values used per group (NaN values are skipped). */
  n0: number;
  n1: number;
  /** U of group 1: pairs with group 1 above group 0, ties 1/2. NaN when a group is empty. */
  u: number;
  /** u / (n0·n1) = P(group 1 > group 0) + P(tie)/2. */
  auc: number;
  /**
   * Normal-approximation statistic (tie-corrected, continuity-corrected when asked), signed
   * positive when group 1 ranks higher; reported for both methods. NaN when not computable.
   */
  z: number;
  /** Two-sided p-value; NaN when not computable (see `reason`). */
  p: number;
  method: 'exact' | 'normal' | null;
  /** Why p is NaN, or null. */
  reason: string | null;
}

/**
 * Two-sided Mann–Whitney U test (Mann & Whitney 1947, Ann. Math. Stat. 18, 50) of group 1
 * against group 0. U1 = R1 − n1(n1+1)/2 from mid-ranks of the pooled sample.
 *
 * - exact: null distribution of U by the generating function Π_{i=1..n0} (1 − q^{n1+i})/(1 − q^i)
 *   (the q-binomial coefficient; Mann & Whitney 1947, recursion eq. 1 [M]), counted exactly in
 *   doubles; p = 2·min(P(U ≤ u), P(U ≥ u)), capped at 1.
 * - normal: mean n0·n1/2, variance n0·n1/12 · [(n+1) − Σ(t³−t)/(n(n−1))] (tie groups of size t),
 *   z = (|U1 − mean| − 1/2)/sd with continuity correction (0 if negative), p = 2·Φ(−|z|).
 *
 * NaN values are skipped and not counted. Complexity O(n log n) for the ranks plus
 * O(n0·n1·min(n0, n1)) for the exact distribution. An empty group gives u, auc, z, p NaN with
 * a reason; all values tied gives z, p NaN with a reason.
 *
 * @example mannWhitneyU([1, 2, 4], [3, 5, 6]) // u 8, auc 0.888889, p 0.2 (exact)
 */
export function mannWhitneyU(
  group0: ArrayLike<number>,
  group1: ArrayLike<number>,
  options: MannWhitneyOptions = {},
): MannWhitneyResult {
  const method = options.method ?? 'auto';
  const continuity = options.continuity ?? true;
  const pooled = pooledWithoutNaN(group0, group1);
  const { n0, n1 } = pooled;
  const empty = { n0, n1, u: Number.NaN, auc: Number.NaN, z: Number.NaN, p: Number.NaN, method: null };
  if (n0 === 0 || n1 === 0) return { ...empty, reason: `group ${n0 === 0 ? 0 : 1} has no values` };

  const { ranks, tieSizes } = rankWithTies(pooled.values);
  let rankSum1 = 0;
  for (let i = n0; i < n0 + n1; i++) rankSum1 += ranks[i];
  const u = rankSum1 - (n1 * (n1 + 1)) / 2;
  const auc = u / (n0 * n1);
  const tied = hasTies(tieSizes);
  const z = normalStatistic(u, n0, n1, tieCorrectionSum(tieSizes), continuity);

  if (method === 'exact' && tied) {
    throw new RangeError('mannWhitneyU: the exact null distribution assumes no ties — use method "normal" or "auto"');
  }
  if (method === 'exact' && n0 + n1 > EXACT_FORCED_MAX_TOTAL) {
    throw new RangeError(
      `mannWhitneyU: exact distribution limited to ${EXACT_FORCED_MAX_TOTAL} values, got ${n0 + n1} — use method "normal" or "auto"`,
    );
  }
  const useExact = method === 'exact' || (method === 'auto' && !tied && n0 + n1 <= EXACT_MAX_TOTAL);
  if (useExact) return { n0, n1, u, auc, z, p: exactTwoSidedP(u, n0, n1), method: 'exact', reason: null };
  if (Number.isNaN(z)) return { n0, n1, u, auc, z, p: Number.NaN, method: null, reason: 'all values are tied' };
  return { n0, n1, u, auc, z, p: Math.min(1, 2 * normalUpperTail(Math.abs(z))), method: 'normal', reason: null };
}

/** Largest n0 + n1 for which `method: 'exact'` may be forced (exact big-integer counts; cost grows as n³). */
export const EXACT_FORCED_MAX_TOTAL = 300;

/**
 * Counts of the Mann–Whitney U statistic under the null hypothesis (no ties): entry k is the
 * number of the C(n0+n1, n0) equally likely arrangements with U = k, k = 0..n0·n1. Computed as
 * the coefficients of the q-binomial coefficient [n0+n1 choose n0]_q, multiplying by
 * (1 − q^{n1+i}) and dividing by (1 − q^i) for i = 1..min(n0, n1) (the distribution is
 * symmetric in n0 and n1). In doubles the counts are exact while C(n0+n1, n0) < 2^52, which
 * holds for n0 + n1 <= 50; larger sizes are counted in BigInt and rounded at the end.
 * O(n0·n1·min(n0, n1)) time.
 *
 * @example exactUCounts(2, 2) // Float64Array [1, 1, 2, 1, 1]
 */
export function exactUCounts(n0: number, n1: number): Float64Array {
  if (n0 + n1 > EXACT_MAX_TOTAL) return Float64Array.from(qBinomialBig(n0, n1), Number);
  const small = Math.min(n0, n1);
  const large = Math.max(n0, n1);
  const maxU = n0 * n1;
  const poly = new Float64Array(maxU + small + 1);
  poly[0] = 1;
  let degree = 0;
  for (let i = 1; i <= small; i++) {
    const shift = large + i;
    for (let k = degree + shift; k >= shift; k--) poly[k] -= poly[k - shift];
    for (let k = i; k <= degree + shift; k++) poly[k] += poly[k - i];
    degree += large;
  }
  return poly.slice(0, maxU + 1);
}

/** The same recursion as {@link exactUCounts} in exact big-integer arithmetic. */
function qBinomialBig(n0: number, n1: number): bigint[] {
  const small = Math.min(n0, n1);
  const large = Math.max(n0, n1);
  const maxU = n0 * n1;
  const poly: bigint[] = new Array<bigint>(maxU + small + 1).fill(0n);
  poly[0] = 1n;
  let degree = 0;
  for (let i = 1; i <= small; i++) {
    const shift = large + i;
    for (let k = degree + shift; k >= shift; k--) poly[k] -= poly[k - shift];
    for (let k = i; k <= degree + shift; k++) poly[k] += poly[k - i];
    degree += large;
  }
  return poly.slice(0, maxU + 1);
}

function exactTwoSidedP(u: number, n0: number, n1: number): number {
  if (n0 + n1 > EXACT_MAX_TOTAL) return exactTwoSidedPBig(u, n0, n1);
  const counts = exactUCounts(n0, n1);
  let below = 0;
  let above = 0;
  let total = 0;
  for (let k = 0; k < counts.length; k++) {
    total += counts[k];
    if (k <= u) below += counts[k];
    if (k >= u) above += counts[k];
  }
  return Math.min(1, (2 * Math.min(below, above)) / total);
}

function exactTwoSidedPBig(u: number, n0: number, n1: number): number {
  const counts = qBinomialBig(n0, n1);
  let below = 0n;
  let above = 0n;
  let total = 0n;
  for (let k = 0; k < counts.length; k++) {
    total += counts[k];
    if (k <= u) below += counts[k];
    if (k >= u) above += counts[k];
  }
  const tail = below < above ? below : above;
  return Math.min(1, 2 * bigRatio(tail, total));
}

/** a/b for big integers 0 <= a <= b, to double precision even when b exceeds the double range. */
function bigRatio(a: bigint, b: bigint): number {
  const excessBits = Math.max(0, b.toString(2).length - 1000);
  const shift = BigInt(excessBits);
  return Number(a >> shift) / Number(b >> shift);
}

function normalStatistic(u: number, n0: number, n1: number, tieSum: number, continuity: boolean): number {
  const n = n0 + n1;
  const variance = ((n0 * n1) / 12) * (n + 1 - tieSum / (n * (n - 1)));
  if (!(variance > 0)) return Number.NaN;
  const distance = u - (n0 * n1) / 2;
  const corrected = Math.max(0, Math.abs(distance) - (continuity ? 0.5 : 0));
  return (Math.sign(distance) * corrected) / Math.sqrt(variance);
}

function pooledWithoutNaN(group0: ArrayLike<number>, group1: ArrayLike<number>) {
  const n0 = countNonNaN(group0);
  const n1 = countNonNaN(group1);
  const values = new Float64Array(n0 + n1);
  let k = 0;
  for (let i = 0; i < group0.length; i++) if (!Number.isNaN(group0[i])) values[k++] = group0[i];
  for (let i = 0; i < group1.length; i++) if (!Number.isNaN(group1[i])) values[k++] = group1[i];
  return { values, n0, n1 };
}

function countNonNaN(x: ArrayLike<number>): number {
  let n = 0;
  for (let i = 0; i < x.length; i++) if (!Number.isNaN(x[i])) n++;
  return n;
}

// ---------------------------------------------------------------------------------------------
// Standard normal distribution, accurate to near machine precision in relative terms, so that
// very small p-values keep their order for the Benjamini–Hochberg step.
// ---------------------------------------------------------------------------------------------

/**
 * Upper tail Q(z) = P(Z > z) = erfc(z/√2)/2 of the standard normal distribution. erfc by its
 * Maclaurin-type series erf(x) = (2/√π)·e^{−x²}·Σ 2ⁿx^{2n+1}/(1·3···(2n+1)) for x < 2.5 and by
 * Laplace's continued fraction erfc(x) = e^{−x²}/√π · 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + …))))
 * otherwise (Abramowitz & Stegun 1964, eqs. 7.1.6 and 7.1.14), the fraction evaluated by the
 * modified Lentz method (Thompson & Barnett 1986, J. Comput. Phys. 64, 490). Relative error
 * about 1e-13 or better. NaN in, NaN out.
 *
 * @example normalUpperTail(1.959963984540054) // 0.025
 */
export function normalUpperTail(z: number): number {
  return 0.5 * erfc(z / Math.SQRT2);
}

/**
 * Standard normal quantile: z with P(Z <= z) = p. Starts from the rational approximation of
 * Abramowitz & Stegun (1964) eq. 26.2.23 (error < 4.5e-4) and refines it with three Halley
 * steps on {@link normalUpperTail}. Returns −Infinity at 0, +Infinity at 1, NaN outside [0, 1].
 *
 * @example normalQuantile(0.975) // 1.959963984540054 (to about 1e-15)
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return Number.NaN;
  if (p === 0) return Number.NEGATIVE_INFINITY;
  if (p === 1) return Number.POSITIVE_INFINITY;
  // 1 − p is exact for p >= 0.5 (Sterbenz), so both halves solve Q(x) = q with q <= 0.5.
  return p < 0.5 ? -upperQuantile(p) : upperQuantile(1 - p);
}

/** x >= 0 with Q(x) = q, 0 < q <= 0.5: A&S 26.2.23 then Halley steps x += e/(1 − x·e/2), e = (Q(x) − q)/φ(x). */
function upperQuantile(q: number): number {
  let x = upperTailGuess(q);
  for (let step = 0; step < 3; step++) {
    const density = Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
    if (!(density > 0)) break;
    const e = (normalUpperTail(x) - q) / density;
    x += e / (1 - (x * e) / 2);
  }
  return x;
}

/** A&S 26.2.23: x with Q(x) ≈ q for 0 < q <= 0.5. */
function upperTailGuess(q: number): number {
  const t = Math.sqrt(-2 * Math.log(q));
  return t - (2.515517 + 0.802853 * t + 0.010328 * t * t) / (1 + 1.432788 * t + 0.189269 * t * t + 0.001308 * t * t * t);
}

function erfc(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  if (x < 0) return 2 - erfc(-x);
  if (x < 2.5) return 1 - erfSeries(x);
  return erfcContinuedFraction(x);
}

function erfSeries(x: number): number {
  if (x === 0) return 0;
  const x2 = x * x;
  let term = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    term *= (2 * x2) / (2 * n + 1);
    sum += term;
    if (term <= sum * 1e-17) break;
  }
  return (2 / Math.sqrt(Math.PI)) * Math.exp(-x2) * sum;
}

function erfcContinuedFraction(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = f;
  let d = 0;
  for (let k = 1; k < 5000; k++) {
    const a = k / 2;
    d = x + a * d;
    if (d === 0) d = tiny;
    d = 1 / d;
    c = x + a / c;
    if (c === 0) c = tiny;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / (Math.sqrt(Math.PI) * f);
}

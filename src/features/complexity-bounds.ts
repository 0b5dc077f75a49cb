import { assertOrder } from './check-arguments.ts';
import { complexityConstant } from './complexity.ts';
import { factorial } from './factorial.ts';

/** A point of the entropy–complexity plane: normalised entropy h, statistical complexity c. */
export interface PlanePoint {
  h: number;
  c: number;
}

/** A distribution written as groups of equal probabilities: `count` states at `p` each. */
interface Group {
  p: number;
  count: number;
}

/**
 * The curves of smallest and largest Jensen–Shannon statistical complexity at given
 * normalised entropy, for M = m! states (Martin, Plastino & Rosso 2006, Physica A 369, 439;
 * Rosso et al. 2007, Phys. Rev. Lett. 99, 154102, fig. 1). Minimum: one state at p in
 * [1/M, 1], the others at (1-p)/(M-1). Maximum: for n = 0..M-2, n states at 0, one at p in
 * [0, 1/(M-n)], the remaining M-n-1 at (1-p)/(M-n-1); consecutive families meet end to end,
 * so they trace one curve from (1, 0) to (0, 0). Every distribution over M states lies
 * between the two curves.
 *
 * `points` values of p on the minimum curve, evenly spaced. On the maximum curve, when M-1
 * families do not fit in `points`, the families are taken at numbers of non-zero states
 * M-n spaced evenly in log (so evenly in entropy), 4 points each, and the curve between them
 * is drawn straight; for orders up to 4 every family is drawn. Points are sorted by h.
 * `alphabetSize` replaces m! (e.g. the ordered Bell number under the `symbols` tie rule).
 *
 * O(points). Throws a RangeError for an order outside 2..9 or fewer than 2 points.
 *
 * @example complexityBounds(3, 200).max // peaks near { h: 0.613, c: 0.2915 } (derived, REFERENCES.md)
 */
export function complexityBounds(
  order: number,
  points: number,
  alphabetSize = factorial(order),
): { min: PlanePoint[]; max: PlanePoint[] } {
  assertOrder(order, 'complexityBounds');
  if (!Number.isInteger(points) || points < 2) {
    throw new RangeError(`complexityBounds: points must be an integer >= 2, got ${points}`);
  }
  const M = alphabetSize;
  const min: PlanePoint[] = [];
  for (let i = 0; i < points; i++) {
    const p = 1 / M + ((1 - 1 / M) * i) / (points - 1);
    min.push(planePoint([{ p, count: 1 }, { p: (1 - p) / (M - 1), count: M - 1 }], M));
  }
  const max: PlanePoint[] = [];
  const families = maxCurveFamilies(M, points);
  const perFamily = Math.max(2, Math.floor(points / families.length));
  for (const nonZero of families) {
    for (let i = 0; i < perFamily; i++) {
      const p = (i / (perFamily - 1)) * (1 / nonZero);
      max.push(planePoint([{ p, count: 1 }, { p: (1 - p) / (nonZero - 1), count: nonZero - 1 }], M));
    }
  }
  const byEntropy = (a: PlanePoint, b: PlanePoint): number => a.h - b.h || a.c - b.c;
  return { min: min.sort(byEntropy), max: max.sort(byEntropy) };
}

/** Numbers of non-zero states (M - n) of the maximum-curve families drawn. */
function maxCurveFamilies(M: number, points: number): number[] {
  if (M - 1 <= points / 4) return Array.from({ length: M - 1 }, (_, i) => M - i);
  const wanted = Math.max(2, Math.floor(points / 4));
  const chosen = new Set<number>();
  for (let i = 0; i < wanted; i++) chosen.add(Math.round(Math.exp((Math.log(M) - Math.log(2)) * (i / (wanted - 1)) + Math.log(2))));
  return [...chosen].sort((a, b) => b - a);
}

/** Normalised entropy and statistical complexity of a distribution given in groups. */
function planePoint(groups: Group[], M: number): PlanePoint {
  let entropy = 0;
  let entropyMix = 0;
  let listed = 0;
  for (const { p, count } of groups) {
    if (count <= 0) continue;
    if (p > 0) entropy -= count * p * Math.log(p);
    const mix = (p + 1 / M) / 2;
    entropyMix -= count * mix * Math.log(mix);
    listed += count;
  }
  const unlisted = M - listed;
  if (unlisted > 0) entropyMix -= (unlisted / (2 * M)) * Math.log(1 / (2 * M));
  const h = Math.min(1, Math.max(0, entropy / Math.log(M)));
  const divergence = entropyMix - entropy / 2 - Math.log(M) / 2;
  return { h, c: Math.max(0, complexityConstant(M) * divergence * h) };
}

import { factorial } from './factorial.ts';

/**
 * The integer code of an ordinal pattern, as used by every counting kernel of patternfold.
 *
 * For a window (w_0, ..., w_{m-1}) let e_k = #{ j < k : w_j <= w_k } for k = 1..m-1: the number
 * of earlier samples that rank below w_k, ties ranking the earlier sample lower (the stable
 * sort of the design brief). (e_1, ..., e_{m-1}) is an inversion table (Knuth 1998, TAOCP
 * vol. 3, §5.1.1), so the mixed-radix number code = sum_k e_k · k! is a bijection between the
 * m! ordinal patterns and 0 .. m!-1.
 *
 * Why this code: the code of a window of order m is the code of its first m-1 samples plus
 * e_{m-1} · (m-1)!, and e_{m-1} only compares the newest sample with the m-1 before it. A
 * scan therefore derives every order's code from the previous window of its chain in O(m)
 * per step, with no sort (the incremental encoding of Keller, Sinn & Emonds 2007,
 * Stoch. Dyn. 7, 247, in a form that serves all orders at once).
 *
 * O(m^2). Returns -1 when the window holds a NaN or has fewer than 2 values.
 *
 * @example ordinalPatternCode([4, 7, 9]) // 5  (rising: e_1 = 1, e_2 = 2, 1·1! + 2·2!)
 * @example ordinalPatternCode([9, 7, 4]) // 0  (falling)
 */
export function ordinalPatternCode(window: ArrayLike<number>): number {
  const m = window.length;
  if (m < 2) return -1;
  let code = 0;
  for (let k = 0; k < m; k++) {
    if (Number.isNaN(window[k])) return -1;
    let below = 0;
    for (let j = 0; j < k; j++) if (window[j] <= window[k]) below++;
    code += below * factorial(k);
  }
  return code;
}

/**
 * The ordinal pattern with a given code: the permutation (pi_0, ..., pi_{m-1}) of 0..m-1 that
 * sorts a window ascending, w_{pi_0} <= ... <= w_{pi_{m-1}} (Bandt & Pompe 2002, Phys. Rev.
 * Lett. 88, 174102). Inverse of {@link ordinalPatternCode}: sample k is inserted at position
 * e_k of the sorted list of samples 0..k-1.
 *
 * O(m^2). Returns null for a code outside 0 .. m!-1 or an order below 1.
 *
 * @example ordinalPatternFromCode(0, 3) // [2, 1, 0]  (strictly falling window)
 * @example ordinalPatternFromCode(5, 3) // [0, 1, 2]  (strictly rising window)
 */
export function ordinalPatternFromCode(code: number, order: number): number[] | null {
  if (!Number.isInteger(order) || order < 1 || !Number.isInteger(code) || code < 0 || code >= factorial(order)) {
    return null;
  }
  const sorted: number[] = [];
  for (let k = 0; k < order; k++) {
    const below = Math.floor(code / factorial(k)) % (k + 1);
    sorted.splice(below, 0, k);
  }
  return sorted;
}

/**
 * Code of the window that follows, under delay 1, the window with code `code`: drop the
 * oldest sample and append a newest one that ranks above exactly `rank` of the m-1 kept
 * samples (0 <= rank <= m-1). Used to name the targets of transitions counted by rank.
 *
 * O(m^2). Returns -1 for an invalid code or rank.
 *
 * @example successorPatternCode(5, 3, 2) // 5  (rising, then a new maximum: rising again)
 */
export function successorPatternCode(code: number, order: number, rank: number): number {
  const pattern = ordinalPatternFromCode(code, order);
  if (pattern === null || !Number.isInteger(rank) || rank < 0 || rank >= order) return -1;
  // ranks[i] = position of sample i in the sorted order
  const ranks = new Array<number>(order);
  pattern.forEach((sample, position) => (ranks[sample] = position));
  const kept = ranks.slice(1).map((r) => (r > ranks[0] ? r - 1 : r));
  const next = kept.map((r) => (r >= rank ? r + 1 : r));
  next.push(rank);
  return ordinalPatternCode(next);
}

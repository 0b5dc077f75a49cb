/**
 * In-place sort of a key array carrying a payload array along (internal to the forest:
 * column-ranks.ts sorts each column once per fit).
 *
 * Quicksort with median-of-three pivots (Hoare 1962, Comput. J. 5, 10–15; Sedgewick 1978,
 * Commun. ACM 21, 847–857) finishing with insertion sort on short ranges. Not stable: equal
 * keys end in unspecified order, which the forest never relies on. No allocation; O(n log n)
 * expected. (The engine's own TypedArray sort was measured slower here, once the rows
 * must be recovered by binary search.)
 */

const INSERTION_SORT_MAX = 16;

/**
 * Sorts keys[lo..hi] (inclusive) ascending, moving values[i] with keys[i]; keys hold no NaN.
 *
 * @example keys [0.5, -1, 0.25], values [0, 1, 2] become keys [-1, 0.25, 0.5], values [1, 2, 0].
 */
export function sortByFloat64Key(keys: Float64Array, values: Int32Array, lo: number, hi: number): void {
  while (hi - lo > INSERTION_SORT_MAX) {
    const a = keys[lo];
    const b = keys[(lo + hi) >>> 1];
    const c = keys[hi];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (keys[i] < pivot) i++;
      while (keys[j] > pivot) j--;
      if (i <= j) {
        const k = keys[i];
        keys[i] = keys[j];
        keys[j] = k;
        const v = values[i];
        values[i] = values[j];
        values[j] = v;
        i++;
        j--;
      }
    }
    // Recurse into the smaller side, loop on the larger: stack depth O(log n).
    if (j - lo < hi - i) {
      sortByFloat64Key(keys, values, lo, j);
      lo = i;
    } else {
      sortByFloat64Key(keys, values, i, hi);
      hi = j;
    }
  }
  for (let i = lo + 1; i <= hi; i++) {
    const k = keys[i];
    const v = values[i];
    let j = i - 1;
    while (j >= lo && keys[j] > k) {
      keys[j + 1] = keys[j];
      values[j + 1] = values[j];
      j--;
    }
    keys[j + 1] = k;
    values[j + 1] = v;
  }
}

/**
 * The best Gini split of one tree node in one column (internal to the forest).
 *
 * Breiman et al. (1984), Classification and Regression Trees, ch. 4: a split sends rows
 * with x <= threshold left; it is scored by the decrease of Gini impurity, and candidate
 * thresholds lie between consecutive distinct values of the node's rows (ch. 2).
 *
 * Each column is ranked once per fit (column-ranks.ts), so a row's value is replaced by its
 * dense rank, a whole number below n. The node's rows are not sorted: they are dropped into
 * buckets indexed by rank, and a two-level bitmap of the occupied buckets (one bit per
 * rank, one summary bit per 32-rank word) is read back in ascending order with
 * count-leading-zeros. This is a counting sort (Knuth 1998, TAOCP vol. 3, §5.2, Algorithm
 * D, distribution counting) whose empty buckets are skipped 32 or 1024 at a time; rows that
 * share a value fall into one bucket. The impurity scan runs while the buckets are read.
 *
 * Weights: a row's total weight w (bootstrap draws) and class-1 weight w1 travel as one
 * number, w + w1 · 2^26 (exact while the total weight stays below 2^26), so that each row
 * costs one read and one bucket update.
 */

/** Multiplier of the class-1 weight in a packed weight. */
export const CLASS1_UNIT = 2 ** 26;
const INVERSE_CLASS1_UNIT = 2 ** -26;

/** {@link ColumnSplitSearch.search} result: every row of the node has the same value, the column cannot split it. */
export const COLUMN_CONSTANT = 0;
/** {@link ColumnSplitSearch.search} result: searched, no threshold beat the best split so far. */
export const COLUMN_NOT_BETTER = 1;
/** {@link ColumnSplitSearch.search} result: a threshold beat the best split so far; the best* fields describe it. */
export const COLUMN_BETTER = 2;

/**
 * Split search in one column at a time, keeping the best split over the columns of one
 * node. Scratch buffers are sized for ranks below n and reused; each search leaves them
 * cleared.
 */
export class ColumnSplitSearch {
  /** Score numerator and denominator of the best split so far (numerator -1: none yet). */
  bestNumerator = -1;
  bestDenominator = 1;
  /** Largest rank that goes left, and the next occupied rank (which goes right). */
  bestRankLeft = 0;
  bestRankRight = 0;
  /** Class-0 and class-1 weight of the best split's left child. */
  bestLeft0 = 0;
  bestLeft1 = 0;
  /** Packed weight of the node's rows at each rank. */
  private readonly weightOfRank: Float64Array;
  private readonly bits: Int32Array;
  private readonly summary: Int32Array;

  /** Search buffers for ranks below `n` (n >= 0). */
  constructor(n: number) {
    this.weightOfRank = new Float64Array(n);
    const words = (n + 31) >>> 5;
    this.bits = new Int32Array(words);
    this.summary = new Int32Array((words + 31) >>> 5);
  }

  /** Forgets the best split, before the first column of a node. */
  reset(): void {
    this.bestNumerator = -1;
    this.bestDenominator = 1;
  }

  /**
   * Scans the node's rows samples[start, end) in the order of their ranks rank[offset +
   * row] and keeps the threshold with the lowest weighted Gini impurity if it beats the best
   * so far. `packedWeight[row]` is w + w1 · CLASS1_UNIT; c0 and c1 are the node's class
   * weights; both children must weigh at least minLeaf.
   *
   * Minimising the children's weighted Gini impurity, Σ_child w_child (1 − Σ_k p_k²), is
   * maximising Σ_child Σ_k w_k² / w_child = num / den with num = (l0² + l1²) nr +
   * (r0² + r1²) nl and den = nl nr. Weights are whole numbers, so candidates are compared
   * as num · bestDen > bestNum · den, exactly for totals up to about 1,500 rows. Among equal
   * scores the first found wins (the lowest threshold, then the earlier column).
   *
   * Complexity O(m + n / 1024 + d) for m rows holding d distinct values. An empty segment
   * counts as constant.
   *
   * @example ranks [0, 1, 2, 3] of rows 0..3, weight 1 each, classes [0, 0, 1, 1]
   * (packed [1, 1, 1 + 2^26, 1 + 2^26]), c0 = c1 = 2, minLeaf 1: COLUMN_BETTER, with rankLeft 1,
   * rankRight 2, left weights 2 and 0, score 4 / 4 (both children pure).
   */
  search(
    rank: Int32Array,
    offset: number,
    samples: Int32Array,
    start: number,
    end: number,
    packedWeight: Float64Array,
    c0: number,
    c1: number,
    minLeaf: number,
  ): number {
    this.fillBuckets(rank, offset, samples, start, end, packedWeight);
    return this.scanBuckets(c0, c1, minLeaf);
  }

  private fillBuckets(rank: Int32Array, offset: number, samples: Int32Array, start: number, end: number, packedWeight: Float64Array): void {
    const { weightOfRank, bits, summary } = this;
    if (summary.length === 1) {
      // Up to 1024 ranks: the summary word stays in a register. Two rows per pass, so that
      // the engine reloads each array's bounds and data pointer once per two rows.
      let words = 0;
      let k = start;
      for (; k + 1 < end; k += 2) {
        const s = samples[k];
        const t = samples[k + 1];
        const r = rank[offset + s];
        const q = rank[offset + t];
        weightOfRank[r] += packedWeight[s];
        weightOfRank[q] += packedWeight[t];
        bits[r >>> 5] |= 1 << (r & 31);
        bits[q >>> 5] |= 1 << (q & 31);
        words |= (1 << (r >>> 5)) | (1 << (q >>> 5));
      }
      if (k < end) {
        const s = samples[k];
        const r = rank[offset + s];
        weightOfRank[r] += packedWeight[s];
        bits[r >>> 5] |= 1 << (r & 31);
        words |= 1 << (r >>> 5);
      }
      summary[0] = words;
    } else {
      for (let k = start; k < end; k++) {
        const s = samples[k];
        const r = rank[offset + s];
        weightOfRank[r] += packedWeight[s];
        const word = r >>> 5;
        bits[word] |= 1 << (r & 31);
        summary[word >>> 5] |= 1 << (word & 31);
      }
    }
  }

  /** Reads the buckets back in ascending rank, scoring the threshold before each one, and clears them. */
  private scanBuckets(c0: number, c1: number, minLeaf: number): number {
    const { weightOfRank, bits, summary } = this;
    const total = c0 + c1;
    let bestNum = this.bestNumerator;
    let bestDen = this.bestDenominator;
    let better = false;
    let occupied = 0;
    let previous = -1; // last occupied rank read
    let left = 0; // packed weight of the buckets read so far
    for (let si = 0; si < summary.length; si++) {
      let words = summary[si];
      if (words === 0) continue;
      summary[si] = 0;
      while (words !== 0) {
        const lowWord = words & -words;
        words ^= lowWord;
        const word = (si << 5) | (31 - Math.clz32(lowWord));
        let set = bits[word];
        bits[word] = 0;
        while (set !== 0) {
          const low = set & -set;
          set ^= low;
          const r = (word << 5) | (31 - Math.clz32(low));
          if (previous >= 0) {
            // Candidate: ranks <= previous go left, r and above go right.
            const l1 = Math.floor(left * INVERSE_CLASS1_UNIT);
            const nl = left - l1 * CLASS1_UNIT;
            const nr = total - nl;
            if (nl >= minLeaf && nr >= minLeaf) {
              const l0 = nl - l1;
              const r0 = c0 - l0;
              const r1 = c1 - l1;
              const num = (l0 * l0 + l1 * l1) * nr + (r0 * r0 + r1 * r1) * nl;
              const den = nl * nr;
              if (num * bestDen > bestNum * den) {
                bestNum = num;
                bestDen = den;
                better = true;
                this.bestRankLeft = previous;
                this.bestRankRight = r;
                this.bestLeft0 = l0;
                this.bestLeft1 = l1;
              }
            }
          }
          left += weightOfRank[r];
          weightOfRank[r] = 0;
          previous = r;
          occupied++;
        }
      }
    }
    if (occupied < 2) return COLUMN_CONSTANT;
    if (!better) return COLUMN_NOT_BETTER;
    this.bestNumerator = bestNum;
    this.bestDenominator = bestDen;
    return COLUMN_BETTER;
  }
}

/**
 * Ordering a tree node's rows by one column without sorting (internal to the forest).
 *
 * Every column is ranked once per fit (column-ranks.ts), so its dense ranks are whole
 * numbers below n. A node's m rows are dropped into buckets indexed by rank, and a two-level
 * bitmap of the occupied buckets (one bit per rank, one summary bit per 32-rank word) is
 * read back in ascending order with count-leading-zeros: a counting sort (Knuth 1998, TAOCP
 * vol. 3, §5.2, Algorithm D, "distribution counting") whose empty buckets are skipped 32 or
 * 1024 at a time. This costs O(m + n / 1024 + occupied words) instead of O(m log m), and
 * merges rows that share a value, which is what a CART split scan needs (Breiman et al.
 * 1984, ch. 2: candidate thresholds lie between consecutive distinct values).
 */

/** Reusable buckets for ranks 0..n-1; all scratch is cleared again by each {@link RankBuckets.fill}. */
export class RankBuckets {
  /** After fill: the occupied ranks, ascending. */
  readonly bucketRank: Int32Array;
  /** After fill: total weight of the rows in each occupied rank, same order. */
  readonly bucketWeight: Int32Array;
  /** After fill: class-1 weight of the rows in each occupied rank, same order. */
  readonly bucketWeight1: Int32Array;
  private readonly weightOfRank: Int32Array;
  private readonly weight1OfRank: Int32Array;
  private readonly bits: Int32Array;
  private readonly summary: Int32Array;

  /** Buckets for ranks below `n` (n >= 0). */
  constructor(n: number) {
    this.bucketRank = new Int32Array(n);
    this.bucketWeight = new Int32Array(n);
    this.bucketWeight1 = new Int32Array(n);
    this.weightOfRank = new Int32Array(n);
    this.weight1OfRank = new Int32Array(n);
    const words = (n + 31) >>> 5;
    this.bits = new Int32Array(words);
    this.summary = new Int32Array((words + 31) >>> 5);
  }

  /**
   * Buckets the rows samples[start, end) by rank[offset + row], adding weight[row] and
   * weight1[row] per bucket, and writes the occupied buckets in ascending rank to
   * bucketRank, bucketWeight and bucketWeight1. Returns the number of occupied buckets
   * (0 for an empty segment). Complexity O(m + n / 1024 + d) for m rows in d buckets.
   *
   * @example ranks [2, 0, 2, 1] of rows 0..3, all four rows with weights [1, 2, 1, 1] and
   * class-1 weights [0, 2, 1, 0] give 3 buckets: ranks [0, 1, 2], weights [2, 1, 2],
   * class-1 weights [2, 0, 1].
   */
  fill(
    rank: Int32Array,
    offset: number,
    samples: Int32Array,
    start: number,
    end: number,
    weight: Int32Array,
    weight1: Int32Array,
  ): number {
    const { weightOfRank, weight1OfRank, bits, summary } = this;
    if (summary.length === 1) {
      // Up to 1024 ranks: the summary word stays in a register.
      let words = 0;
      for (let k = start; k < end; k++) {
        const s = samples[k];
        const r = rank[offset + s];
        weightOfRank[r] += weight[s];
        weight1OfRank[r] += weight1[s];
        const word = r >>> 5;
        bits[word] |= 1 << (r & 31);
        words |= 1 << word;
      }
      summary[0] = words;
    } else {
      for (let k = start; k < end; k++) {
        const s = samples[k];
        const r = rank[offset + s];
        weightOfRank[r] += weight[s];
        weight1OfRank[r] += weight1[s];
        const word = r >>> 5;
        bits[word] |= 1 << (r & 31);
        summary[word >>> 5] |= 1 << (word & 31);
      }
    }
    return this.collect();
  }

  /** Reads the occupied buckets back in ascending rank and clears the scratch; returns their count. */
  private collect(): number {
    const { weightOfRank, weight1OfRank, bits, summary, bucketRank, bucketWeight, bucketWeight1 } = this;
    let d = 0;
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
          bucketRank[d] = r;
          bucketWeight[d] = weightOfRank[r];
          bucketWeight1[d] = weight1OfRank[r];
          weightOfRank[r] = 0;
          weight1OfRank[r] = 0;
          d++;
        }
      }
    }
    return d;
  }
}

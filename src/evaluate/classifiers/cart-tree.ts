/**
 * Growing one CART classification tree on ranked columns (internal to the forest).
 *
 * Breiman et al. (1984), Classification and Regression Trees, ch. 4: binary splits chosen
 * by the largest decrease of Gini impurity; Breiman (2001), Machine Learning 45, 5–32:
 * each split considers a fresh random subset of `maxFeatures` columns, and each tree is
 * grown on a bootstrap sample. Bootstrap duplicates are carried as integer weights (a row
 * drawn k times counts k times), which gives the same tree as copying the row k times.
 *
 * Layout: nodes live in flat typed arrays shared by all trees of a forest ({@link NodeStore});
 * the two children of a node are stored next to each other, so only the left index is kept.
 * A node's rows are a contiguous segment of one Int32Array that is partitioned in place.
 * No object is allocated per node.
 */
import type { ColumnRanks } from './column-ranks.ts';
import type { Rng } from '../../shared/random.ts';
import { sortByInt32Key } from './sort-pairs.ts';

/** Settings of one tree, already validated and resolved against the table's width. */
export interface TreeSettings {
  /** Columns drawn per split, 1..nCols. */
  maxFeatures: number;
  /** Smallest total weight (bootstrap draws) allowed in a child. */
  minLeaf: number;
  /** Largest depth (root = 0); Infinity for none. */
  maxDepth: number;
  bootstrap: boolean;
}

/**
 * Nodes of a forest. For a split node, `feature` >= 0, `value` is the threshold (go left when
 * x[feature] <= value) and the children are `left` and `left + 1`. For a leaf, `feature` is
 * -1 and `value` is the leaf's (weighted) share of class 1.
 */
export class NodeStore {
  feature: Int32Array;
  left: Int32Array;
  value: Float64Array;
  size = 0;

  constructor(capacity: number) {
    this.feature = new Int32Array(capacity);
    this.left = new Int32Array(capacity);
    this.value = new Float64Array(capacity);
  }

  /** Makes room for `extra` more nodes. */
  reserve(extra: number): void {
    const need = this.size + extra;
    if (need <= this.feature.length) return;
    const capacity = Math.max(need, 2 * this.feature.length);
    const feature = new Int32Array(capacity);
    const left = new Int32Array(capacity);
    const value = new Float64Array(capacity);
    feature.set(this.feature.subarray(0, this.size));
    left.set(this.left.subarray(0, this.size));
    value.set(this.value.subarray(0, this.size));
    this.feature = feature;
    this.left = left;
    this.value = value;
  }
}

const STACK_SLOTS = 6; // node, start, end, depth, weight of class 0, weight of class 1

/** Grows trees one after another, reusing its scratch buffers. */
export class TreeGrower {
  private readonly nRows: number;
  private readonly nCols: number;
  private readonly weight: Int32Array;
  private readonly samples: Int32Array;
  /** Node that each in-bag row currently belongs to; -1 for rows left out of the bootstrap. */
  private readonly nodeOf: Int32Array;
  private readonly sortedRank: Int32Array;
  private readonly sortedSample: Int32Array;
  private readonly pool: Int32Array;
  private readonly stack: Int32Array;
  // Result of the last split search (fields, so that the hot path allocates nothing).
  private bestNumerator = -1;
  private bestDenominator = 1;
  private bestFeature = -1;
  private bestRankLeft = 0;
  private bestRankRight = 0;
  private bestLeft0 = 0;
  private bestLeft1 = 0;

  constructor(
    private readonly ranks: ColumnRanks,
    private readonly y: Uint8Array,
    private readonly settings: TreeSettings,
  ) {
    this.nRows = ranks.nRows;
    this.nCols = ranks.nCols;
    this.weight = new Int32Array(this.nRows);
    this.samples = new Int32Array(this.nRows);
    this.nodeOf = new Int32Array(this.nRows);
    this.sortedRank = new Int32Array(this.nRows);
    this.sortedSample = new Int32Array(this.nRows);
    this.pool = new Int32Array(this.nCols);
    for (let c = 0; c < this.nCols; c++) this.pool[c] = c;
    this.stack = new Int32Array(STACK_SLOTS * (this.nRows + 2));
  }

  /**
   * Grows one tree into `store` with randomness from `rng` (bootstrap draws first, then the
   * column draws of each split, depth first, left child before right). Returns the root's
   * index. Complexity about O(maxFeatures · n log² n) for a balanced tree on n rows.
   */
  grow(rng: Rng, store: NodeStore): number {
    const n = this.nRows;
    const { weight, samples, nodeOf, y, stack } = this;
    this.drawWeights(rng);
    const root = store.size;
    let m = 0;
    let w0 = 0;
    let w1 = 0;
    for (let i = 0; i < n; i++) {
      const w = weight[i];
      nodeOf[i] = w === 0 ? -1 : root;
      if (w === 0) continue;
      samples[m++] = i;
      if (y[i] === 1) w1 += w;
      else w0 += w;
    }
    store.reserve(2 * m - 1); // a binary tree with at most m leaves has at most 2m - 1 nodes
    store.size++;
    let top = 0;
    top = push(stack, top, root, 0, m, 0, w0, w1);
    while (top > 0) {
      top -= STACK_SLOTS;
      const node = stack[top];
      const start = stack[top + 1];
      const end = stack[top + 2];
      const depth = stack[top + 3];
      const c0 = stack[top + 4];
      const c1 = stack[top + 5];
      if (!this.shouldTrySplit(depth, c0, c1) || !this.findBestSplit(rng, node, start, end, c0, c1)) {
        store.feature[node] = -1;
        store.value[node] = c1 / (c0 + c1);
        continue;
      }
      const f = this.bestFeature;
      const left = store.size;
      const mid = this.partition(start, end, f, this.bestRankLeft, left);
      store.size += 2;
      store.feature[node] = f;
      store.left[node] = left;
      store.value[node] = this.threshold(f, this.bestRankLeft, this.bestRankRight);
      const l0 = this.bestLeft0;
      const l1 = this.bestLeft1;
      top = push(stack, top, left + 1, mid, end, depth + 1, c0 - l0, c1 - l1);
      top = push(stack, top, left, start, mid, depth + 1, l0, l1);
    }
    return root;
  }

  private drawWeights(rng: Rng): void {
    const n = this.nRows;
    if (!this.settings.bootstrap) {
      this.weight.fill(1);
      return;
    }
    this.weight.fill(0);
    for (let k = 0; k < n; k++) this.weight[rng.int(n)]++;
  }

  private shouldTrySplit(depth: number, c0: number, c1: number): boolean {
    return c0 > 0 && c1 > 0 && depth < this.settings.maxDepth && c0 + c1 >= 2 * this.settings.minLeaf;
  }

  /**
   * Searches the best Gini split of the node's rows samples[start, end). Columns are drawn
   * without replacement until `maxFeatures` columns that are not constant in the node have
   * been searched, or none is left (constant columns do not count, as in scikit-learn's
   * BestSplitter [M]). Zero-gain splits are allowed (an XOR needs one to start); among equal
   * splits the first found wins (columns in draw order, thresholds ascending).
   * Returns false when no column admits a split with both children >= minLeaf.
   */
  private findBestSplit(rng: Rng, node: number, start: number, end: number, c0: number, c1: number): boolean {
    const { pool } = this;
    const m = end - start;
    const small = m * m <= 4 * this.nRows;
    this.bestNumerator = -1;
    this.bestDenominator = 1;
    this.bestFeature = -1;
    let remaining = this.nCols;
    let searched = 0;
    while (remaining > 0 && searched < this.settings.maxFeatures) {
      const j = rng.int(remaining);
      const f = pool[j];
      remaining--;
      pool[j] = pool[remaining];
      pool[remaining] = f;
      if (small) this.sortNodeBy(f, start, end);
      else this.gatherNodeInOrder(f, node);
      if (this.scanSorted(f, m, c0, c1)) searched++;
    }
    return this.bestFeature >= 0;
  }

  /**
   * Scans the node's rows sorted by their rank in column f (sortedRank, sortedSample) for
   * the best threshold, and keeps it if it beats the best so far. Returns false when the
   * column is constant in the node.
   *
   * Minimising the children's weighted Gini impurity, Σ_child w_child (1 − Σ_k p_k²), is
   * maximising Σ_child Σ_k w_k² / w_child = num / den with num = (l0² + l1²) nr +
   * (r0² + r1²) nl and den = nl nr. Weights are whole numbers, so candidates are compared
   * as num · bestDen > bestNum · den, exactly for totals up to about 1,500 rows.
   */
  private scanSorted(f: number, m: number, c0: number, c1: number): boolean {
    const { sortedRank, sortedSample, weight, y } = this;
    if (m < 2 || sortedRank[0] === sortedRank[m - 1]) return false;
    const minLeaf = this.settings.minLeaf;
    const total = c0 + c1;
    let bestNum = this.bestNumerator;
    let bestDen = this.bestDenominator;
    let found = -1;
    let foundLeft = 0;
    let foundLeft1 = 0;
    let nl = 0;
    let l1 = 0;
    for (let k = 0; k < m - 1; k++) {
      const s = sortedSample[k];
      const w = weight[s];
      nl += w;
      l1 += w * y[s];
      if (sortedRank[k] === sortedRank[k + 1]) continue;
      const nr = total - nl;
      if (nl < minLeaf || nr < minLeaf) continue;
      const l0 = nl - l1;
      const r0 = c0 - l0;
      const r1 = c1 - l1;
      const num = (l0 * l0 + l1 * l1) * nr + (r0 * r0 + r1 * r1) * nl;
      const den = nl * nr;
      if (num * bestDen > bestNum * den) {
        bestNum = num;
        bestDen = den;
        found = k;
        foundLeft = nl;
        foundLeft1 = l1;
      }
    }
    if (found >= 0) {
      this.bestNumerator = bestNum;
      this.bestDenominator = bestDen;
      this.bestFeature = f;
      this.bestRankLeft = sortedRank[found];
      this.bestRankRight = sortedRank[found + 1];
      this.bestLeft0 = foundLeft - foundLeft1;
      this.bestLeft1 = foundLeft1;
    }
    return true;
  }

  /**
   * Fills the sorted buffers for a large node by walking column f's presorted order and
   * keeping the rows of this node, O(n) and branch-free (the write always happens, the
   * count only moves for members).
   */
  private gatherNodeInOrder(f: number, node: number): void {
    const { nodeOf, sortedRank, sortedSample } = this;
    const { order, rankInOrder } = this.ranks;
    const from = f * this.nRows;
    const to = from + this.nRows;
    let count = 0;
    for (let k = from; k < to; k++) {
      const s = order[k];
      sortedSample[count] = s;
      sortedRank[count] = rankInOrder[k];
      count += nodeOf[s] === node ? 1 : 0;
    }
  }

  /** Copies the node's rows with their ranks in column f into the sorted buffers, ascending. */
  private sortNodeBy(f: number, start: number, end: number): void {
    const { samples, sortedRank, sortedSample } = this;
    const rank = this.ranks.rank;
    const offset = f * this.nRows;
    const m = end - start;
    for (let k = 0; k < m; k++) {
      const s = samples[start + k];
      sortedSample[k] = s;
      sortedRank[k] = rank[offset + s];
    }
    sortByInt32Key(sortedRank, sortedSample, 0, m - 1);
  }

  /**
   * Moves rows with rank <= rankLeft in column f to the front of the segment, relabels them
   * as node `left` and the others as `left + 1`; returns the split point.
   */
  private partition(start: number, end: number, f: number, rankLeft: number, left: number): number {
    const { samples, nodeOf } = this;
    const rank = this.ranks.rank;
    const offset = f * this.nRows;
    let i = start;
    let j = end - 1;
    while (i <= j) {
      if (rank[offset + samples[i]] <= rankLeft) i++;
      else {
        const t = samples[i];
        samples[i] = samples[j];
        samples[j] = t;
        j--;
      }
    }
    for (let k = start; k < i; k++) nodeOf[samples[k]] = left;
    for (let k = i; k < end; k++) nodeOf[samples[k]] = left + 1;
    return i;
  }

  /** Midway between the two distinct values, falling back to the lower one when rounding reaches the upper. */
  private threshold(f: number, rankLeft: number, rankRight: number): number {
    const base = this.ranks.distinctStart[f];
    const a = this.ranks.distinct[base + rankLeft];
    const b = this.ranks.distinct[base + rankRight];
    const t = (a + b) / 2;
    return t === b || !Number.isFinite(t) ? a : t;
  }
}

function push(stack: Int32Array, top: number, node: number, start: number, end: number, depth: number, c0: number, c1: number): number {
  stack[top] = node;
  stack[top + 1] = start;
  stack[top + 2] = end;
  stack[top + 3] = Math.min(depth, 0x7fffffff);
  stack[top + 4] = c0;
  stack[top + 5] = c1;
  return top + STACK_SLOTS;
}

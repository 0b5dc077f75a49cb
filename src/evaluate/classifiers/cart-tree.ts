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
 * A node's rows are put in the order of a column by bucketing them by rank, not by sorting
 * ({@link ColumnSplitSearch}). No object is allocated per node or per tree.
 */
import type { ColumnRanks } from './column-ranks.ts';
import type { Rng } from '../../shared/random.ts';
import { drawBootstrapCounts } from './bootstrap.ts';
import { CLASS1_UNIT, COLUMN_BETTER, COLUMN_CONSTANT, ColumnSplitSearch } from './column-split.ts';

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
  /** Bootstrap draws of each row (0 for rows left out). */
  private readonly weight: Int32Array;
  /** weight[i] + weight[i] · y[i] · CLASS1_UNIT, the packed form the split search reads. */
  private readonly packedWeight: Float64Array;
  /** In-bag rows; each node owns a contiguous segment. */
  private readonly samples: Int32Array;
  private readonly search: ColumnSplitSearch;
  private readonly pool: Int32Array;
  private readonly stack: Int32Array;
  /** Column of the best split of the node being searched; -1 for none. */
  private bestFeature = -1;

  constructor(
    private readonly ranks: ColumnRanks,
    private readonly y: Uint8Array,
    private readonly settings: TreeSettings,
  ) {
    this.nRows = ranks.nRows;
    this.nCols = ranks.nCols;
    this.weight = new Int32Array(this.nRows);
    if (this.nRows >= CLASS1_UNIT) throw new RangeError(`forest.fit: at most ${CLASS1_UNIT - 1} rows, got ${this.nRows}`);
    this.packedWeight = new Float64Array(this.nRows);
    this.samples = new Int32Array(this.nRows);
    this.search = new ColumnSplitSearch(this.nRows);
    this.pool = new Int32Array(this.nCols);
    for (let c = 0; c < this.nCols; c++) this.pool[c] = c;
    this.stack = new Int32Array(STACK_SLOTS * (this.nRows + 2));
  }

  /**
   * Grows one tree into `store` with randomness from `rng` (bootstrap draws first, then the
   * column draws of each split, depth first, left child before right). Returns the root's
   * index. Complexity O(maxFeatures · (m + n / 1024)) per node of m rows, about
   * O(maxFeatures · n log n) for a balanced tree on n rows.
   */
  grow(rng: Rng, store: NodeStore): number {
    const n = this.nRows;
    const { weight, packedWeight, samples, y, stack, search } = this;
    this.drawWeights(rng);
    const root = store.size;
    let m = 0;
    let w0 = 0;
    let w1 = 0;
    for (let i = 0; i < n; i++) {
      const w = weight[i];
      packedWeight[i] = w + (y[i] === 1 ? w * CLASS1_UNIT : 0);
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
      if (!this.shouldTrySplit(depth, c0, c1) || !this.findBestSplit(rng, start, end, c0, c1)) {
        store.feature[node] = -1;
        store.value[node] = c1 / (c0 + c1);
        continue;
      }
      const f = this.bestFeature;
      const left = store.size;
      const mid = this.partition(start, end, f, search.bestRankLeft);
      store.size += 2;
      store.feature[node] = f;
      store.left[node] = left;
      store.value[node] = this.threshold(f, search.bestRankLeft, search.bestRankRight);
      const l0 = search.bestLeft0;
      const l1 = search.bestLeft1;
      top = push(stack, top, left + 1, mid, end, depth + 1, c0 - l0, c1 - l1);
      top = push(stack, top, left, start, mid, depth + 1, l0, l1);
    }
    return root;
  }

  private drawWeights(rng: Rng): void {
    if (this.settings.bootstrap) drawBootstrapCounts(rng, this.nRows, this.weight);
    else this.weight.fill(1);
  }

  private shouldTrySplit(depth: number, c0: number, c1: number): boolean {
    return c0 > 0 && c1 > 0 && depth < this.settings.maxDepth && c0 + c1 >= 2 * this.settings.minLeaf;
  }

  /**
   * Searches the best Gini split of the node's rows samples[start, end). Columns are drawn
   * without replacement until `maxFeatures` columns that are not constant in the node have
   * been searched, or none is left (constant columns do not count, as in scikit-learn's
   * BestSplitter [M]). Zero-gain splits are allowed (an XOR needs one to start); among equal
   * splits the first found wins (columns in draw order, thresholds ascending). The search
   * stops early at a split into two pure children: no later column can beat it (its score
   * num / den equals the node's weight, the largest possible), so the tree is the one the
   * full search would grow; only fewer column draws are taken from the stream.
   * Returns false when no column admits a split with both children >= minLeaf.
   */
  private findBestSplit(rng: Rng, start: number, end: number, c0: number, c1: number): boolean {
    const { pool, search, samples, packedWeight, nRows } = this;
    const { rank } = this.ranks;
    const { maxFeatures, minLeaf } = this.settings;
    search.reset();
    this.bestFeature = -1;
    const total = c0 + c1;
    let remaining = this.nCols;
    let searched = 0;
    while (remaining > 0 && searched < maxFeatures && search.bestNumerator !== total * search.bestDenominator) {
      const j = rng.int(remaining);
      const f = pool[j];
      remaining--;
      pool[j] = pool[remaining];
      pool[remaining] = f;
      const outcome = search.search(rank, f * nRows, samples, start, end, packedWeight, c0, c1, minLeaf);
      if (outcome === COLUMN_CONSTANT) continue;
      searched++;
      if (outcome === COLUMN_BETTER) this.bestFeature = f;
    }
    return this.bestFeature >= 0;
  }

  /** Moves rows with rank <= rankLeft in column f to the front of the segment; returns the split point. */
  private partition(start: number, end: number, f: number, rankLeft: number): number {
    const { samples } = this;
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

/**
 * Random forest of CART classification trees on typed arrays.
 *
 * Breiman (2001), "Random forests", Machine Learning 45, 5–32: each tree is grown on a
 * bootstrap sample of the rows, each split searches a fresh random subset of the columns
 * (floor(sqrt(p)) by default), trees are grown until their leaves are pure. Splits
 * minimise Gini impurity (Breiman et al. 1984, Classification and Regression Trees, ch. 4)
 * with thresholds midway between consecutive distinct values.
 *
 * The probability of class 1 is the mean over ALL trees of the class-1 share of the leaf a
 * row falls into (the "soft vote" of scikit-learn's RandomForestClassifier.predict_proba),
 * not a count of hard votes.
 */
import type { Classifier, Model, TrainingSet } from '../classifier.ts';
import { InputError } from '../../shared/errors.ts';
import { createRng, deriveSeed } from '../../shared/random.ts';
import { NodeStore, TreeGrower, type TreeSettings } from './cart-tree.ts';
import { rankColumns } from './column-ranks.ts';
import { checkPredictionInput, checkTrainingSet } from './check-input.ts';

export interface ForestOptions {
  /** Number of trees, a whole number >= 1. */
  trees: number;
  /** Columns searched per split; default floor(sqrt(p)), at least 1; values above p are capped at p. */
  maxFeatures?: number;
  /** Smallest number of bootstrap draws (rows counted with multiplicity) in a leaf; default 1. */
  minLeaf?: number;
  /** Largest tree depth (the root has depth 0); default unlimited. */
  maxDepth?: number;
  /** Grow each tree on a bootstrap sample (default true); false uses every row once. */
  bootstrap?: boolean;
}

/** A fitted forest: flat node arrays of all trees and the index of each tree's root. */
export interface ForestModel extends Model {
  readonly nCols: number;
  readonly roots: Int32Array;
  /** -1 for a leaf, else the split column. */
  readonly feature: Int32Array;
  /** Left child; the right child is left + 1. */
  readonly left: Int32Array;
  /** Threshold of a split node (left when x <= threshold), class-1 share of a leaf. */
  readonly value: Float64Array;
}

/**
 * A random-forest classifier (name 'forest') for {@link Classifier.fit}.
 *
 * Tree t draws from createRng(deriveSeed(seed, 'tree', t)), so a forest depends only on
 * the training set, the options and the seed. Throws InputError for options out of range.
 *
 * @example
 * const model = createForest({ trees: 100 }).fit({ X, nRows: 96, nCols: 60, y }, 7);
 * model.predict(Xtest, 24); // Float64Array of 24 probabilities of class 1
 */
export function createForest(options: ForestOptions): Classifier {
  checkForestOptions(options);
  return {
    name: 'forest',
    fit: (train: TrainingSet, seed: number) => fitForest(train, options, seed),
  };
}

/**
 * Fits a random forest (see {@link createForest}) and returns its flat node arrays.
 *
 * Complexity O(p n log n) to rank the columns once, then per tree O(n) for the bootstrap and
 * O(maxFeatures · (m + n / 1024)) per node of m rows (rank buckets, no sorting), about
 * O(maxFeatures · n log n) for a balanced tree; on a 96 x 60 table 100 trees take a few
 * milliseconds (docs/classifiers.md).
 * Throws Error when the training set is empty, malformed or holds NaN (the caller imputes).
 * A training set with one class gives a forest that predicts that class's share (0 or 1).
 *
 * @example fitForest({ X: Float64Array.of(0, 1, 2, 3), nRows: 4, nCols: 1, y: Uint8Array.of(0, 0, 1, 1) },
 *   { trees: 1, bootstrap: false }, 1).predict(Float64Array.of(0.2, 2.9), 2) gives [0, 1]
 *   (one split at 1.5).
 */
export function fitForest(train: TrainingSet, options: ForestOptions, seed: number): ForestModel {
  checkForestOptions(options);
  checkTrainingSet(train, 'forest');
  const { X, nRows, nCols, y } = train;
  const settings = resolveSettings(options, nCols);
  const ranks = rankColumns(X, nRows, nCols);
  const grower = new TreeGrower(ranks, y, settings);
  const store = new NodeStore(options.trees * Math.min(2 * nRows - 1, 64));
  const roots = new Int32Array(options.trees);
  for (let t = 0; t < options.trees; t++) {
    roots[t] = grower.grow(createRng(deriveSeed(seed, 'tree', t)), store);
  }
  const feature = store.feature.slice(0, store.size);
  const left = store.left.slice(0, store.size);
  const value = store.value.slice(0, store.size);
  return {
    nCols,
    roots,
    feature,
    left,
    value,
    predict: (Xnew: Float64Array, rows: number) => predictForest(roots, feature, left, value, nCols, Xnew, rows),
  };
}

/**
 * Mean over trees of the leaf class-1 share for each row; NaN for a row holding NaN.
 * Complexity O(rows · trees · depth).
 */
function predictForest(
  roots: Int32Array,
  feature: Int32Array,
  left: Int32Array,
  value: Float64Array,
  nCols: number,
  X: Float64Array,
  nRows: number,
): Float64Array {
  checkPredictionInput(X, nRows, nCols, 'forest');
  const out = new Float64Array(nRows);
  const trees = roots.length;
  for (let r = 0; r < nRows; r++) {
    const base = r * nCols;
    if (rowHasNaN(X, base, nCols)) {
      out[r] = NaN;
      continue;
    }
    let sum = 0;
    for (let t = 0; t < trees; t++) {
      let node = roots[t];
      let f = feature[node];
      while (f >= 0) {
        node = X[base + f] <= value[node] ? left[node] : left[node] + 1;
        f = feature[node];
      }
      sum += value[node];
    }
    out[r] = sum / trees;
  }
  return out;
}

function rowHasNaN(X: Float64Array, base: number, nCols: number): boolean {
  for (let c = 0; c < nCols; c++) if (Number.isNaN(X[base + c])) return true;
  return false;
}

function resolveSettings(options: ForestOptions, nCols: number): TreeSettings {
  const maxFeatures = options.maxFeatures ?? Math.max(1, Math.floor(Math.sqrt(nCols)));
  return {
    maxFeatures: Math.min(maxFeatures, nCols),
    minLeaf: options.minLeaf ?? 1,
    maxDepth: options.maxDepth ?? Infinity,
    bootstrap: options.bootstrap ?? true,
  };
}

function checkForestOptions(options: ForestOptions): void {
  checkWholeNumber('trees', options.trees, 1);
  if (options.maxFeatures !== undefined) checkWholeNumber('maxFeatures', options.maxFeatures, 1);
  if (options.minLeaf !== undefined) checkWholeNumber('minLeaf', options.minLeaf, 1);
  if (options.maxDepth !== undefined && options.maxDepth !== Infinity) checkWholeNumber('maxDepth', options.maxDepth, 0);
}

function checkWholeNumber(key: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min || value > 0x7fffffff) {
    throw new InputError(`forest option ${key}: must be a whole number >= ${min}, got ${String(value)} — set ${key} to ${min} or more`);
  }
}

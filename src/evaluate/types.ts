/**
 * Contract of the evaluation stage: a feature matrix in, statistics out. No I/O.
 */

/** One column of the feature matrix: a feature at one grid cell. */
export interface FeatureColumn {
  feature: string;
  order: number;
  delay: number;
  scale: number;
}

/**
 * Rows are recordings. Several rows may share a subject; cross-validation then keeps a
 * subject's rows together. `values` is row-major (rows x columns); NaN marks a missing value.
 */
export interface FeatureMatrix {
  rowIds: string[];
  subjects: string[];
  /** 0 for groupNames[0], 1 for groupNames[1]. */
  labels: Uint8Array;
  groupNames: [string, string];
  columns: FeatureColumn[];
  values: Float64Array;
}

export type ClassifierName = 'forest' | 'logistic';

export interface EvaluationSettings {
  folds: number;
  repeats: number;
  permutations: number;
  classifier: ClassifierName;
  /** Trees of the random forest. */
  trees: number;
  /** L2 penalty strength of the logistic regression (sklearn's 1/C convention is NOT used: this is lambda). */
  l2: number;
  /** Besag & Clifford (1991) sequential stopping of the permutation test; off by default. */
  stopEarly: boolean;
  seed: number;
}

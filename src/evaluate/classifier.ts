/**
 * The interface every classifier implements. Inputs are already imputed and scaled inside
 * the training fold (no NaN). Row-major Float64Array, labels 0/1.
 */
export interface TrainingSet {
  X: Float64Array;
  nRows: number;
  nCols: number;
  y: Uint8Array;
}

export interface Model {
  /** Probability of class 1 for each of nRows rows of X (row-major, same nCols as training). */
  predict(X: Float64Array, nRows: number): Float64Array;
}

export interface Classifier {
  readonly name: string;
  /** Deterministic given the training set and seed. */
  fit(train: TrainingSet, seed: number): Model;
}

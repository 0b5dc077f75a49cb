/**
 * Test helpers for the classifier checks: fixture loading, out-of-fold predictions on the
 * fixture's fixed folds, and an AUC by brute-force pair counting that shares no code with
 * the library (Hanley & McNeil 1982, Radiology 143, 29: AUC = P(score of a class-1 row >
 * score of a class-0 row) + P(tie)/2).
 */
import { readFileSync } from 'node:fs';
import type { Classifier, TrainingSet } from '../../../src/evaluate/classifier.ts';

export interface FixtureTable {
  source: string;
  table: string;
  nRows: number;
  nCols: number;
  X: number[];
  y: number[];
  folds: number[];
  forest: { n_estimators: number; random_states: number[]; oof_auc: number[]; oof_auc_mean: number };
  logistic: { lambda: number; oof_auc: number; oof_probability: number[]; intercept: number; weights: number[] }[];
  trees: { max_depth: number | null; min_samples_leaf: number; probability: number[] }[];
}

export const TABLES = ['linear', 'interaction', 'noisy', 'tied'] as const;

export function loadFixture(name: string): FixtureTable {
  return JSON.parse(readFileSync(new URL(`./fixtures/${name}.json`, import.meta.url), 'utf8')) as FixtureTable;
}

export function wholeTable(t: FixtureTable): TrainingSet {
  return { X: Float64Array.from(t.X), nRows: t.nRows, nCols: t.nCols, y: Uint8Array.from(t.y) };
}

/** Rows of a row-major table whose mask entry is true, as a new table. */
export function selectRows(X: Float64Array, nCols: number, rows: number[]): Float64Array {
  const out = new Float64Array(rows.length * nCols);
  rows.forEach((r, k) => out.set(X.subarray(r * nCols, (r + 1) * nCols), k * nCols));
  return out;
}

/** Out-of-fold probability of class 1 for every row, using the fixture's fold assignment. */
export function outOfFold(
  t: FixtureTable,
  fitPredict: (train: TrainingSet, Xtest: Float64Array, nTest: number, fold: number) => ArrayLike<number>,
): Float64Array {
  const X = Float64Array.from(t.X);
  const prob = new Float64Array(t.nRows).fill(NaN);
  const nFolds = Math.max(...t.folds) + 1;
  for (let k = 0; k < nFolds; k++) {
    const trainRows = t.folds.flatMap((f, i) => (f === k ? [] : [i]));
    const testRows = t.folds.flatMap((f, i) => (f === k ? [i] : []));
    const train: TrainingSet = {
      X: selectRows(X, t.nCols, trainRows),
      nRows: trainRows.length,
      nCols: t.nCols,
      y: Uint8Array.from(trainRows.map((i) => t.y[i])),
    };
    const p = fitPredict(train, selectRows(X, t.nCols, testRows), testRows.length, k);
    testRows.forEach((r, j) => (prob[r] = p[j]));
  }
  return prob;
}

export function classifierOutOfFold(t: FixtureTable, classifier: Classifier, seed: number): Float64Array {
  return outOfFold(t, (train, Xtest, nTest, fold) => classifier.fit(train, seed * 1000 + fold).predict(Xtest, nTest));
}

/** AUC by counting all (class-1, class-0) pairs; ties count one half. O(n1 · n0). */
export function bruteForceAuc(score: ArrayLike<number>, y: ArrayLike<number>): number {
  let wins = 0;
  let pairs = 0;
  for (let i = 0; i < y.length; i++) {
    if (y[i] !== 1) continue;
    for (let j = 0; j < y.length; j++) {
      if (y[j] !== 0) continue;
      pairs++;
      if (score[i] > score[j]) wins += 1;
      else if (score[i] === score[j]) wins += 0.5;
    }
  }
  return wins / pairs;
}

export function mean(values: number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

/**
 * Out-of-fold class probabilities for one column subset: for each fold, preprocessing is
 * fitted on the training rows (preprocess.ts), the classifier is trained on them, and the
 * held-out rows are predicted. Every row is predicted exactly once per repeat, by a model
 * that never saw its subject (Stone 1974, J. R. Stat. Soc. B 36, 111; grouped folds from cv.ts).
 */
import { aucFromScores } from './auc.ts';
import type { Classifier } from './classifier.ts';
import { rowFolds } from './cv.ts';
import { applyPreprocessing, fitPreprocessing } from './preprocess.ts';
import { deriveSeed } from '../shared/random.ts';

/** The numbers cross-validation works on: a row-major matrix and its subject structure. */
export interface Design {
  values: Float64Array;
  nRows: number;
  nCols: number;
  /** Subject number of every row. */
  ofRow: Int32Array;
  nSubjects: number;
}

/** Training and test row numbers of one fold. */
export interface FoldRows {
  train: Int32Array;
  test: Int32Array;
}

/**
 * Splits rows by fold number: fold f's test rows are the rows with rowFold === f.
 * O(rows · folds). Example: rowFold [0,1,0], folds 2 -> [{train [1], test [0,2]}, {train [0,2], test [1]}].
 */
export function foldRows(rowFold: Int32Array, folds: number): FoldRows[] {
  const out: FoldRows[] = [];
  for (let f = 0; f < folds; f++) {
    let nTest = 0;
    for (let r = 0; r < rowFold.length; r++) if (rowFold[r] === f) nTest++;
    const test = new Int32Array(nTest);
    const train = new Int32Array(rowFold.length - nTest);
    for (let r = 0, a = 0, b = 0; r < rowFold.length; r++) {
      if (rowFold[r] === f) test[a++] = r;
      else train[b++] = r;
    }
    out.push({ train, test });
  }
  return out;
}

/**
 * Fits preprocessing and the classifier on one fold's training rows and returns the
 * probabilities of class 1 for its test rows, in the order of `fold.test`.
 *
 * When no column survives preprocessing (all missing or constant in training) the model has
 * nothing to learn from and every test row gets the training share of class 1.
 */
export function predictFold(
  design: Design,
  columns: Int32Array,
  rowLabels: Uint8Array,
  fold: FoldRows,
  classifier: Classifier,
  fitSeed: number,
): Float64Array {
  const prep = fitPreprocessing(design.values, design.nCols, columns, fold.train);
  const yTrain = new Uint8Array(fold.train.length);
  for (let i = 0; i < fold.train.length; i++) yTrain[i] = rowLabels[fold.train[i]];
  const k = prep.columns.length;
  if (k === 0) {
    let ones = 0;
    for (let i = 0; i < yTrain.length; i++) ones += yTrain[i];
    return new Float64Array(fold.test.length).fill(ones / yTrain.length);
  }
  const X = applyPreprocessing(design.values, design.nCols, prep, fold.train);
  const model = classifier.fit({ X, nRows: fold.train.length, nCols: k, y: yTrain }, fitSeed);
  return model.predict(applyPreprocessing(design.values, design.nCols, prep, fold.test), fold.test.length);
}

/**
 * Out-of-fold probability of class 1 for every row, one cross-validation pass.
 * Fold f's model is trained with seed deriveSeed(fitSeed, f).
 *
 * Cost: `folds` classifier fits. Returns a Float64Array with one probability per row.
 * Example: with a classifier that predicts its training share, every row gets the share of
 * class 1 among the other folds' rows.
 */
export function outOfFoldProbabilities(
  design: Design,
  columns: Int32Array,
  rowLabels: Uint8Array,
  rowFold: Int32Array,
  folds: number,
  classifier: Classifier,
  fitSeed: number,
): Float64Array {
  const out = new Float64Array(design.nRows).fill(NaN);
  const splits = foldRows(rowFold, folds);
  for (let f = 0; f < folds; f++) {
    const { test } = splits[f];
    if (test.length === 0) continue;
    const p = predictFold(design, columns, rowLabels, splits[f], classifier, deriveSeed(fitSeed, f));
    for (let i = 0; i < test.length; i++) out[test[i]] = p[i];
  }
  return out;
}

/** Each row's label: the label of the subject it belongs to. Example: ofRow [0, 0, 1], labels [1, 0] -> [1, 1, 0]. */
export function rowLabelsOf(design: Design, subjectLabels: Uint8Array): Uint8Array {
  const rowLabels = new Uint8Array(design.nRows);
  for (let r = 0; r < design.nRows; r++) rowLabels[r] = subjectLabels[design.ofRow[r]];
  return rowLabels;
}

/**
 * Mean of row values per subject (a subject with several recordings gets the mean of their
 * out-of-fold probabilities, so the AUC counts subjects, not recordings).
 * Example: values [0.2, 0.4, 0.9], ofRow [0,0,1] -> [0.3, 0.9].
 */
export function subjectMeans(rowValues: Float64Array, ofRow: Int32Array, nSubjects: number): Float64Array {
  const sum = new Float64Array(nSubjects);
  const count = new Float64Array(nSubjects);
  for (let r = 0; r < rowValues.length; r++) {
    sum[ofRow[r]] += rowValues[r];
    count[ofRow[r]]++;
  }
  for (let s = 0; s < nSubjects; s++) sum[s] /= count[s];
  return sum;
}

/** One repeated cross-validation of one column subset. */
export interface CrossValidation {
  /** Subject-level AUC of each repeat's out-of-fold probabilities. */
  aucByRepeat: Float64Array;
  /** Mean of aucByRepeat: the score the permutation tests use. */
  score: number;
  /** Subject-level out-of-fold probability of each repeat (repeats x subjects, row-major). */
  subjectProbabilities: Float64Array;
}

/**
 * Repeated cross-validation of `columns`: for repeat r the subjects' folds are
 * `subjectFolds[r]` and the fits use seeds derived from deriveSeed(seed, 'fit', r).
 * The score is the mean over repeats of the subject-level out-of-fold AUC.
 *
 * Cost: repeats x folds classifier fits. NaN score only when a class is absent.
 * Example: a column equal to the label scores 1 with any sensible classifier.
 */
export function crossValidate(
  design: Design,
  columns: Int32Array,
  subjectLabels: Uint8Array,
  subjectFolds: readonly Int32Array[],
  folds: number,
  classifier: Classifier,
  seed: number,
): CrossValidation {
  const repeats = subjectFolds.length;
  const rowLabels = rowLabelsOf(design, subjectLabels);
  const aucByRepeat = new Float64Array(repeats);
  const subjectProbabilities = new Float64Array(repeats * design.nSubjects);
  let total = 0;
  for (let rep = 0; rep < repeats; rep++) {
    const rowFold = rowFolds(subjectFolds[rep], design.ofRow);
    const rowP = outOfFoldProbabilities(design, columns, rowLabels, rowFold, folds, classifier, deriveSeed(seed, 'fit', rep));
    const subjectP = subjectMeans(rowP, design.ofRow, design.nSubjects);
    subjectProbabilities.set(subjectP, rep * design.nSubjects);
    aucByRepeat[rep] = aucFromScores(subjectP, subjectLabels);
    total += aucByRepeat[rep];
  }
  return { aucByRepeat, score: total / repeats, subjectProbabilities };
}

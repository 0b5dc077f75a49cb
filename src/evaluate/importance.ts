/**
 * Permutation importance on held-out folds (Breiman 2001, Machine Learning 45, 5, sec. 10;
 * model-agnostic form in Fisher, Rudin & Dominici 2019, J. Mach. Learn. Res. 20(177)):
 * for each fold's fitted model, one column of the test rows is shuffled among those rows and
 * the rows are predicted again. A column's importance is the drop in subject-level
 * out-of-fold AUC caused by shuffling it, averaged over repeats. Computed on held-out rows
 * only, so a model that memorised its training rows earns no importance from them.
 */
import { aucFromScores } from './auc.ts';
import type { Classifier } from './classifier.ts';
import { rowFolds } from './cv.ts';
import { foldRows, rowLabelsOf, subjectMeans } from './crossval.ts';
import type { Design } from './crossval.ts';
import { applyPreprocessing, fitPreprocessing } from './preprocess.ts';
import type { FeatureColumn } from './types.ts';
import { createRng, deriveSeed } from '../shared/random.ts';
import { finishSteps, type Steps } from './steps.ts';

/**
 * AUC drop of each design column (index as in the design), averaged over repeats.
 * Shuffles use deriveSeed(seed, 'importance', repeat, fold, column); fits use the same
 * seeds as crossValidate, so the baseline equals the headline cross-validation.
 *
 * Cost: repeats · folds fits plus repeats · folds · columns predictions. A column left out
 * of a fold (missing or constant in its training rows) keeps that fold's baseline
 * predictions. Example: a column that equals the label, beside noise, gets an importance
 * near the full AUC gain over 0.5.
 */
export function permutationImportance(...args: Parameters<typeof permutationImportanceSteps>): Float64Array {
  return finishSteps(permutationImportanceSteps(...args));
}

/** {@link permutationImportance} as steps, one per repeat (see ./steps.ts). */
export function* permutationImportanceSteps(
  design: Design,
  subjectLabels: Uint8Array,
  subjectFolds: readonly Int32Array[],
  folds: number,
  classifier: Classifier,
  seed: number,
): Steps<Float64Array> {
  const nCols = design.nCols;
  const nRows = design.nRows;
  const all = Int32Array.from({ length: nCols }, (_, i) => i);
  const rowLabels = rowLabelsOf(design, subjectLabels);
  const importance = new Float64Array(nCols);
  for (let rep = 0; rep < subjectFolds.length; rep++) {
    const splits = foldRows(rowFolds(subjectFolds[rep], design.ofRow), folds);
    const fitSeed = deriveSeed(seed, 'fit', rep);
    const baseline = new Float64Array(nRows);
    const shuffled = new Float64Array(nCols * nRows); // column-major: predictions with column j shuffled
    for (let f = 0; f < folds; f++) {
      const { train, test } = splits[f];
      if (test.length === 0) continue;
      const prep = fitPreprocessing(design.values, nCols, all, train);
      const k = prep.columns.length;
      let basePredictions: Float64Array;
      let model = null;
      let Xtest: Float64Array = new Float64Array(0);
      if (k === 0) {
        let ones = 0;
        for (let i = 0; i < train.length; i++) ones += rowLabels[train[i]];
        basePredictions = new Float64Array(test.length).fill(ones / train.length);
      } else {
        const yTrain = new Uint8Array(train.length);
        for (let i = 0; i < train.length; i++) yTrain[i] = rowLabels[train[i]];
        model = classifier.fit({ X: applyPreprocessing(design.values, nCols, prep, train), nRows: train.length, nCols: k, y: yTrain }, deriveSeed(fitSeed, f));
        Xtest = applyPreprocessing(design.values, nCols, prep, test);
        basePredictions = model.predict(Xtest, test.length);
      }
      for (let i = 0; i < test.length; i++) {
        baseline[test[i]] = basePredictions[i];
        for (let j = 0; j < nCols; j++) shuffled[j * nRows + test[i]] = basePredictions[i];
      }
      if (model === null) continue;
      const work = new Float64Array(Xtest.length);
      for (let j = 0; j < k; j++) {
        work.set(Xtest);
        shuffleColumn(work, test.length, k, j, deriveSeed(seed, 'importance', rep, f, prep.columns[j]));
        const p = model.predict(work, test.length);
        const base = prep.columns[j] * nRows;
        for (let i = 0; i < test.length; i++) shuffled[base + test[i]] = p[i];
      }
    }
    const baseAuc = aucFromScores(subjectMeans(baseline, design.ofRow, design.nSubjects), subjectLabels);
    for (let j = 0; j < nCols; j++) {
      const permutedAuc = aucFromScores(subjectMeans(shuffled.subarray(j * nRows, (j + 1) * nRows), design.ofRow, design.nSubjects), subjectLabels);
      importance[j] += (baseAuc - permutedAuc) / subjectFolds.length;
    }
    yield;
  }
  return importance;
}

/** Fisher–Yates shuffle of column j of a row-major nRows x nCols matrix, in place. */
function shuffleColumn(X: Float64Array, nRows: number, nCols: number, j: number, seed: number): void {
  const rng = createRng(seed);
  for (let i = nRows - 1; i > 0; i--) {
    const r = rng.int(i + 1);
    const t = X[i * nCols + j];
    X[i * nCols + j] = X[r * nCols + j];
    X[r * nCols + j] = t;
  }
}

/** Importance of a group of columns: the mean of its columns' importances. */
export interface GroupImportance {
  importance: number;
  columns: number;
}

/**
 * Mean importance per feature name, in order of first appearance.
 * Example: importances [0.2, 0.0, 0.1] of features a, b, a -> a 0.15 (2 columns), b 0 (1).
 */
export function importanceByFeature(columns: readonly FeatureColumn[], importance: Float64Array): ({ feature: string } & GroupImportance)[] {
  return meanBy(columns, importance, (c) => c.feature).map(([c, g]) => ({ feature: c.feature, ...g }));
}

/**
 * Mean importance per grid cell (order, delay, scale), in order of first appearance.
 * Example: importances [0.2, 0.4] of two features at cell (3,1,1) -> 0.3 (2 columns).
 */
export function importanceByCell(columns: readonly FeatureColumn[], importance: Float64Array): ({ order: number; delay: number; scale: number } & GroupImportance)[] {
  return meanBy(columns, importance, (c) => `${c.order}|${c.delay}|${c.scale}`).map(([c, g]) => ({ order: c.order, delay: c.delay, scale: c.scale, ...g }));
}

function meanBy(columns: readonly FeatureColumn[], importance: Float64Array, key: (c: FeatureColumn) => string): [FeatureColumn, GroupImportance][] {
  const groups = new Map<string, [FeatureColumn, { sum: number; n: number }]>();
  columns.forEach((c, i) => {
    const k = key(c);
    const g = groups.get(k) ?? [c, { sum: 0, n: 0 }];
    g[1].sum += importance[i];
    g[1].n++;
    groups.set(k, g);
  });
  return [...groups.values()].map(([c, { sum, n }]) => [c, { importance: sum / n, columns: n }]);
}

/**
 * Cross-check against scikit-learn: out-of-fold probabilities of
 * Pipeline(SimpleImputer(median), StandardScaler, LogisticRegression(C)) on committed folds,
 * produced by scripts/fixtures/pipeline/make_fixture.py with Debian's python3-sklearn [S: the
 * fixture records the sklearn version]. Our preprocessing and fold handling, with a Newton
 * logistic regression in sklearn's penalty convention defined in the test, must reproduce the
 * probabilities; our metrics must reproduce roc_auc_score, balanced_accuracy_score,
 * recall_score and confusion_matrix.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createLogistic } from '../../../src/evaluate/classifiers/index.ts';
import { outOfFoldProbabilities } from '../../../src/evaluate/crossval.ts';
import { classificationMetrics } from '../../../src/evaluate/metrics.ts';
import { newtonLogistic } from './helpers.ts';

interface Case {
  name: string;
  C: number;
  folds: number;
  nRows: number;
  nCols: number;
  values: (number | null)[];
  labels: number[];
  rowFold: number[];
  probabilities: number[];
  auc: number;
  balancedAccuracy: number;
  sensitivity: number;
  specificity: number;
  confusion: [number, number, number, number];
}

const fixture = JSON.parse(readFileSync(new URL('./fixtures/sklearn-oof.json', import.meta.url), 'utf8')) as { cases: Case[] };

describe('out-of-fold probabilities match scikit-learn (make_fixture.py)', () => {
  for (const c of fixture.cases) {
    it(c.name, () => {
      const design = {
        values: Float64Array.from(c.values, (v) => (v === null ? NaN : v)),
        nRows: c.nRows,
        nCols: c.nCols,
        ofRow: Int32Array.from({ length: c.nRows }, (_, i) => i),
        nSubjects: c.nRows,
      };
      const columns = Int32Array.from({ length: c.nCols }, (_, i) => i);
      const p = outOfFoldProbabilities(design, columns, Uint8Array.from(c.labels), Int32Array.from(c.rowFold), c.folds, newtonLogistic(c.C), 1);
      // Both sides solve the same convex problem by Newton steps to tol 1e-12: agreement to
      // 5e-9 in probability. A preprocessing difference (e.g. medians over all rows) moves
      // probabilities by 1e-2 or more.
      for (let i = 0; i < c.nRows; i++) expect(p[i]).toBeCloseTo(c.probabilities[i], 8);
      const m = classificationMetrics(p, c.labels);
      expect(m.auc).toBeCloseTo(c.auc, 9);
      expect(m.balanced_accuracy).toBeCloseTo(c.balancedAccuracy, 9);
      expect(m.sensitivity).toBeCloseTo(c.sensitivity, 9);
      expect(m.specificity).toBeCloseTo(c.specificity, 9);
      const [tn, fp, fn, tp] = c.confusion;
      expect(m.confusion).toEqual({ true_negative: tn, false_positive: fp, false_negative: fn, true_positive: tp });
    });
    it(`${c.name}: production createLogistic({ l2: 1/C }) through the same folds`, () => {
      const design = {
        values: Float64Array.from(c.values, (v) => (v === null ? NaN : v)),
        nRows: c.nRows,
        nCols: c.nCols,
        ofRow: Int32Array.from({ length: c.nRows }, (_, i) => i),
        nSubjects: c.nRows,
      };
      const columns = Int32Array.from({ length: c.nCols }, (_, i) => i);
      const p = outOfFoldProbabilities(design, columns, Uint8Array.from(c.labels), Int32Array.from(c.rowFold), c.folds, createLogistic({ l2: 1 / c.C }), 1);
      // logistic.ts documents penalty (l2/2)·||w||², i.e. sklearn's C = 1/l2; its own Newton tolerance sets the 5e-7 here.
      for (let i = 0; i < c.nRows; i++) expect(p[i]).toBeCloseTo(c.probabilities[i], 6);
      expect(classificationMetrics(p, c.labels).auc).toBeCloseTo(c.auc, 9);
    });
  }
});

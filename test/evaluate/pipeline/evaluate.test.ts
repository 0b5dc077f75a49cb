/**
 * The whole pipeline on seeded synthetic tables (test classifiers from helpers.ts, so these
 * checks do not depend on the production classifiers):
 * - no leakage: with 40 subjects and 400 pure-noise columns, selecting columns on all rows
 *   before cross-validation scores high, while selection inside the classifier (training
 *   rows only) stays near AUC 0.5 (the effect shown by Ambroise & McLachlan 2002, PNAS 99,
 *   6562, and Varma & Simon 2006);
 * - a known-signal table gives a small headline p and flags the signal cell after
 *   Westfall–Young adjustment; a null table does not;
 * - determinism under a seed; subjects with several recordings; dropped columns; errors.
 */
import { describe, expect, it } from 'vitest';
import type { Classifier, Model, TrainingSet } from '../../../src/evaluate/classifier.ts';
import { crossValidate } from '../../../src/evaluate/crossval.ts';
import { indexSubjects, repeatedSubjectFolds } from '../../../src/evaluate/cv.ts';
import { evaluateStudy, evaluateStudyWith, evaluateWithClassifier, prepareStudy, type PermutationStage } from '../../../src/evaluate/evaluate.ts';
import { runPermutationTest } from '../../../src/evaluate/permutation.ts';
import { InputError } from '../../../src/shared/errors.ts';
import { nearestMean, quickSettings, syntheticMatrix } from './helpers.ts';

/** Nearest class mean on the k columns with the largest |mean difference| in its own training rows. */
function selectingNearestMean(k: number): Classifier {
  return {
    name: 'select-then-nearest-mean',
    fit(train: TrainingSet, seed: number): Model {
      const chosen = topColumns(train, k);
      const sub = (X: Float64Array, n: number): Float64Array => {
        const out = new Float64Array(n * k);
        for (let i = 0; i < n; i++) chosen.forEach((c, j) => (out[i * k + j] = X[i * train.nCols + c]));
        return out;
      };
      const model = nearestMean.fit({ X: sub(train.X, train.nRows), nRows: train.nRows, nCols: k, y: train.y }, seed);
      return { predict: (X, n) => model.predict(sub(X, n), n) };
    },
  };
}

function topColumns(train: TrainingSet, k: number): number[] {
  const diff: number[] = [];
  for (let c = 0; c < train.nCols; c++) {
    const sum = [0, 0];
    const n = [0, 0];
    for (let i = 0; i < train.nRows; i++) {
      sum[train.y[i]] += train.X[i * train.nCols + c];
      n[train.y[i]]++;
    }
    diff.push(Math.abs(sum[1] / n[1] - sum[0] / n[0]));
  }
  return diff.map((d, c) => [d, c]).sort((a, b) => b[0] - a[0]).slice(0, k).map(([, c]) => c);
}

describe('no leakage', () => {
  const noise = syntheticMatrix({ seed: 77, perGroup: [20, 20], cells: [[3, 1, 1]], features: Array.from({ length: 400 }, (_, i) => `f${i}`) });
  const subjects = indexSubjects(noise.subjects, noise.labels);
  const folds = repeatedSubjectFolds(subjects.labels, 5, 5, 1);
  const design = { values: noise.values, nRows: 40, nCols: 400, ofRow: subjects.ofRow, nSubjects: 40 };

  it('selection inside the training folds keeps pure noise near AUC 0.5', () => {
    const honest = crossValidate(design, Int32Array.from({ length: 400 }, (_, i) => i), subjects.labels, folds, 5, selectingNearestMean(10), 1);
    // With 40 subjects the SE of one repeat's AUC under the null is about 0.09 [D: Hanley & McNeil
    // 1982 at A = 0.5, n = 20 + 20]; averaged over 5 repeats, |AUC − 0.5| < 0.2 is a wide margin.
    expect(Math.abs(honest.score - 0.5)).toBeLessThan(0.2);
  });

  it('while selecting on all rows first (the leak) scores high on the same noise', () => {
    const all = { X: noise.values, nRows: 40, nCols: 400, y: noise.labels };
    const leaked = Int32Array.from(topColumns(all, 10));
    const leaky = crossValidate(design, leaked, subjects.labels, folds, 5, nearestMean, 1);
    expect(leaky.score).toBeGreaterThan(0.85);
  });

  it('the classifier never sees a test subject, and test rows are imputed with training medians', () => {
    const m = syntheticMatrix({ seed: 3, perGroup: [10, 10], cells: [[3, 1, 1]], features: ['a', 'b'] });
    m.values[0] = NaN; // row 0, column a
    const seen: Float64Array[] = [];
    const spy: Classifier = {
      name: 'spy',
      fit(train) {
        seen.push(Float64Array.from(train.X));
        return { predict: (X, n) => new Float64Array(n).fill(X[0]) };
      },
    };
    const s = { ...quickSettings, folds: 5, repeats: 1, permutations: 0 };
    const study = prepareStudy(m, s, spy);
    const folds1 = repeatedSubjectFolds(study.subjects.labels, 5, 1, s.seed);
    const cv = crossValidate(study.design, study.allColumns, study.subjects.labels, folds1, 5, spy, s.seed);
    // training matrices are standardised on their own rows: every column mean 0, population SD 1
    for (const X of seen) {
      const n = X.length / 2;
      for (let c = 0; c < 2; c++) {
        let sum = 0;
        let sq = 0;
        for (let i = 0; i < n; i++) sum += X[i * 2 + c];
        for (let i = 0; i < n; i++) sq += (X[i * 2 + c] - sum / n) ** 2;
        expect(sum / n).toBeCloseTo(0, 12);
        expect(sq / n).toBeCloseTo(1, 12);
      }
    }
    // row 0 is the first test row of its fold; its missing 'a' becomes the training median [D by hand]
    const f = folds1[0][0];
    const trainA: number[] = [];
    for (let r = 0; r < 20; r++) if (folds1[0][r] !== f) trainA.push(m.values[r * 2]);
    trainA.sort((x, y) => x - y);
    const median = (trainA[trainA.length / 2 - 1] + trainA[trainA.length / 2]) / 2; // 16 training rows
    const mean = trainA.reduce((x, y) => x + y, 0) / trainA.length;
    const sd = Math.sqrt(trainA.reduce((x, y) => x + (y - mean) ** 2, 0) / trainA.length);
    expect(cv.subjectProbabilities[0]).toBeCloseTo((median - mean) / sd, 12);
  });
});

describe('evaluateWithClassifier', () => {
  const grid: [number, number, number][] = [
    [3, 1, 1],
    [4, 1, 1],
    [3, 2, 1],
    [4, 2, 1],
  ];
  const features = ['permutation_entropy', 'transition_entropy', 'self_loop_fraction'];
  const settings = { ...quickSettings, permutations: 99, repeats: 2 };

  it('finds a known difference: small headline p, the signal cell survives Westfall–Young, nested CV picks it', () => {
    const m = syntheticMatrix({ seed: 101, perGroup: [25, 25], cells: grid, features, signal: (cell, f) => (cell === 2 && f === 0 ? 1.5 : 0) });
    const r = evaluateWithClassifier(m, settings, nearestMean);
    // 1.5 SD shift: population AUC Phi(1.5/sqrt 2) = 0.856 [D] for that column alone
    expect(r.headline.p_value).toBeLessThanOrEqual(0.05);
    // cells come sorted by order, delay, scale: (3,1,1), (3,2,1), (4,1,1), (4,2,1)
    expect(r.cells.map((c) => [c.order, c.delay])).toEqual([[3, 1], [3, 2], [4, 1], [4, 2]]);
    const signal = r.cells[1];
    expect(signal.auc).toBeGreaterThan(0.7);
    expect(signal.p_adjusted).toBe(1 / 100);
    for (const [i, c] of r.cells.entries()) {
      expect(c.p_adjusted).toBeGreaterThanOrEqual(c.p_value as number);
      if (i !== 1) expect(c.p_adjusted).toBeGreaterThan(0.05);
    }
    expect(r.nested?.selected_cells.map((c) => [c.order, c.delay])).toEqual([[3, 2]]);
    expect(r.nested?.auc).toBeGreaterThan(0.7);
    const top = [...r.importance.by_column].sort((a, b) => (b.importance ?? 0) - (a.importance ?? 0))[0];
    expect([top.feature, top.order, top.delay]).toEqual(['permutation_entropy', 3, 2]);
    expect(r.importance.by_cell.map((c) => c.columns)).toEqual([3, 3, 3, 3]);
  });

  it('finds nothing in a null table: headline p not small, AUC near 0.5, naive best cell optimistic', () => {
    const m = syntheticMatrix({ seed: 202, perGroup: [25, 25], cells: grid, features });
    const r = evaluateWithClassifier(m, settings, nearestMean);
    expect(r.headline.p_value).toBeGreaterThan(0.05);
    expect(Math.abs((r.headline.auc as number) - 0.5)).toBeLessThan(0.2);
    for (const c of r.cells) expect(c.p_adjusted).toBeGreaterThan(0.05);
    expect(r.nested?.naive_best_auc).toBeGreaterThanOrEqual(r.nested?.auc as number);
  });

  it('evaluateStudyWith pauses after the headline, each cell, each outer fold and each importance repeat, and gives evaluateStudy\'s numbers', async () => {
    const m = syntheticMatrix({ seed: 31, perGroup: [10, 10], cells: grid, features });
    const s = { ...quickSettings, permutations: 9 };
    let pauses = 0;
    const inThread: PermutationStage = async (study, observed, B, stopAfter, onEach) => runPermutationTest(study.pipeline, observed, B, stopAfter, onEach);
    const paused = await evaluateStudyWith(m, s, inThread, undefined, async () => void pauses++);
    expect(paused).toEqual(evaluateStudy(m, s));
    // 1 (headline) + 4 cells + repeats x folds = 2 x 5 outer folds + 2 importance repeats [D from the step boundaries]
    expect(pauses).toBe(1 + 4 + 10 + 2);
  });

  it('is deterministic under the seed and changes with it', () => {
    const m = syntheticMatrix({ seed: 9, perGroup: [12, 14], recordings: 2, cells: grid.slice(0, 2), features });
    const s = { ...quickSettings, folds: 4, permutations: 19 };
    const a = evaluateWithClassifier(m, s, nearestMean);
    expect(evaluateWithClassifier(m, s, nearestMean)).toEqual(a);
    expect(JSON.parse(JSON.stringify(a))).toEqual(a); // JSON-clean: no NaN, no typed arrays
    expect(evaluateWithClassifier(m, { ...s, seed: s.seed + 1 }, nearestMean).headline.auc_by_repeat).not.toEqual(a.headline.auc_by_repeat);
    expect(a.data).toMatchObject({ rows: 52, subjects: 26, group_sizes: [12, 14] });
    expect(a.subjects).toHaveLength(26);
  });

  it('observed statistics equal the permutable pipeline applied to the observed labels', () => {
    const m = syntheticMatrix({ seed: 10, perGroup: [15, 15], cells: grid.slice(0, 3), features });
    const s = { ...quickSettings, permutations: 0 };
    const r = evaluateWithClassifier(m, s, nearestMean);
    const study = prepareStudy(m, s, nearestMean);
    const stats = study.pipeline.statistics(study.subjects.labels);
    expect(stats[0]).toBe(r.headline.auc);
    expect(Array.from(stats.subarray(1))).toEqual(r.cells.map((c) => c.auc));
    expect(r.headline.p_value).toBeNull();
  });

  it('drops all-missing and constant columns with a note', () => {
    const m = syntheticMatrix({ seed: 4, perGroup: [10, 10], cells: [[3, 1, 1]], features: ['a', 'b', 'c'] });
    for (let r = 0; r < 20; r++) {
      m.values[r * 3 + 1] = NaN;
      m.values[r * 3 + 2] = r === 5 ? NaN : 0.25;
    }
    const r = evaluateWithClassifier(m, { ...quickSettings, permutations: 0 }, nearestMean);
    expect(r.data.columns_dropped).toEqual([
      { feature: 'b', order: 3, delay: 1, scale: 1, reason: 'all values missing' },
      { feature: 'c', order: 3, delay: 1, scale: 1, reason: 'constant across all rows' },
    ]);
    expect(r.data.columns_used).toBe(1);
    expect(r.notes[0]).toContain('2 column(s) left out before modelling');
    expect(r.nested).toBeNull();
    expect(r.nested_reason).toBe('the grid has one cell, so there is no cell to pick');
  });

  it('refuses a group smaller than the folds with an InputError suggesting fewer folds', () => {
    const m = syntheticMatrix({ seed: 4, perGroup: [3, 10], cells: [[3, 1, 1]], features: ['a'] });
    const run = (): unknown => evaluateWithClassifier(m, quickSettings, nearestMean);
    expect(run).toThrow(InputError);
    expect(run).toThrow('settings folds: group "control" has 3 subject(s), fewer than the 5 folds, so some folds would have none of it — use folds: 3 or fewer');
  });

  it('stops early only when asked, and then says so', () => {
    const m = syntheticMatrix({ seed: 202, perGroup: [15, 15], cells: grid.slice(0, 2), features });
    const r = evaluateWithClassifier(m, { ...quickSettings, permutations: 199, stopEarly: true }, nearestMean);
    expect(r.headline.stopped_early).toBe(true);
    expect(r.headline.p_value).toBe(10 / r.headline.permutations);
    expect(r.notes.some((n) => n.startsWith('Sequential stopping'))).toBe(true);
  });
});

/**
 * Grid scan: which grid cells (order, delay, scale) separate the groups, with inference that
 * accounts for having looked at every cell.
 *
 * - Each cell is scored by repeated cross-validation on its own columns only.
 * - Family-wise adjusted p-values come from the same label permutations as the headline
 *   test: the step-down max-T procedure of Westfall & Young (1993, Resampling-Based Multiple
 *   Testing, Wiley, Algorithm 2.8; Ge, Dudoit & Speed 2003, Test 12, 1, eq. 11), with the
 *   (1 + count) / (1 + B) convention of Phipson & Smyth (2010).
 * - "Pick the best cell" is itself a learning step, so its honest score comes from nested
 *   cross-validation: inside each outer training set an inner cross-validation picks the
 *   cell, and the outer test subjects score that choice (Varma & Simon 2006, BMC
 *   Bioinformatics 7, 91). The naive best observed cell score is reported beside it.
 */
import { aucFromScores } from './auc.ts';
import type { Classifier } from './classifier.ts';
import { stratifiedSubjectFolds } from './cv.ts';
import { foldRows, crossValidate, predictFold, rowLabelsOf, subjectMeans } from './crossval.ts';
import type { Design } from './crossval.ts';
import type { FeatureColumn } from './types.ts';
import { deriveSeed } from '../shared/random.ts';
import { finishSteps, type Steps } from './steps.ts';

/** A grid cell and the design columns that belong to it. */
export interface GridCell {
  order: number;
  delay: number;
  scale: number;
  columns: Int32Array;
}

/**
 * Groups columns by (order, delay, scale), cells sorted by order, then delay, then scale.
 * O(C log C). Example: columns at (3,1,1), (4,1,1), (3,1,1) -> cells (3,1,1) [0,2] and (4,1,1) [1].
 */
export function gridCellsOf(columns: readonly FeatureColumn[]): GridCell[] {
  const byKey = new Map<string, { order: number; delay: number; scale: number; columns: number[] }>();
  columns.forEach((c, i) => {
    const key = `${c.order}|${c.delay}|${c.scale}`;
    let cell = byKey.get(key);
    if (!cell) {
      cell = { order: c.order, delay: c.delay, scale: c.scale, columns: [] };
      byKey.set(key, cell);
    }
    cell.columns.push(i);
  });
  return [...byKey.values()]
    .sort((a, b) => a.order - b.order || a.delay - b.delay || a.scale - b.scale)
    .map((c) => ({ ...c, columns: Int32Array.from(c.columns) }));
}

/**
 * Raw per-cell permutation p-values (1 + b_c) / (1 + B). NaN for a cell whose observed score is NaN.
 * O(B · C). Example: observed [0.9], null [[0.5], [0.95]] -> [2/3].
 */
export function rawCellPValues(observed: ArrayLike<number>, nullScores: readonly ArrayLike<number>[]): Float64Array {
  const C = observed.length;
  const out = new Float64Array(C);
  for (let c = 0; c < C; c++) {
    if (observed[c] !== observed[c]) {
      out[c] = NaN;
      continue;
    }
    let b = 0;
    for (const row of nullScores) if (!(row[c] < observed[c])) b++;
    out[c] = (1 + b) / (1 + nullScores.length);
  }
  return out;
}

/**
 * Westfall–Young step-down max-T adjusted p-values. Cells are ranked by observed score,
 * largest first (r_1..r_m); for each permutation the successive maxima
 * u_i = max(t_{r_i}, ..., t_{r_m}) of the permuted scores are formed; the adjusted p of r_i is
 * (1 + #{k : u_{k,i} >= t_{r_i}}) / (1 + B), then made monotone along the ranking by a running
 * maximum. Cells with a NaN observed score are left out (NaN); a NaN permuted score counts as
 * -Infinity.
 *
 * Properties: adjusted >= raw p of the same cell, and a higher observed score never gets a
 * larger adjusted p. O(B · C + C log C).
 * Example: observed [0.9, 0.6], null [[0.7, 0.8], [0.5, 0.65]] -> [1/3, 1].
 */
export function westfallYoungMaxT(observed: ArrayLike<number>, nullScores: readonly ArrayLike<number>[]): Float64Array {
  const C = observed.length;
  const B = nullScores.length;
  const adjusted = new Float64Array(C).fill(NaN);
  const ranked: number[] = [];
  for (let c = 0; c < C; c++) if (observed[c] === observed[c]) ranked.push(c);
  ranked.sort((a, b) => observed[b] - observed[a] || a - b);
  const m = ranked.length;
  const counts = new Float64Array(m);
  for (let k = 0; k < B; k++) {
    const row = nullScores[k];
    let u = -Infinity;
    for (let i = m - 1; i >= 0; i--) {
      const t = row[ranked[i]];
      if (t > u) u = t;
      if (u >= observed[ranked[i]]) counts[i]++;
    }
  }
  let running = 0;
  for (let i = 0; i < m; i++) {
    running = Math.max(running, (1 + counts[i]) / (1 + B));
    adjusted[ranked[i]] = running;
  }
  return adjusted;
}

/** Scores of every cell, same folds and fit seeds as the headline model. */
export function cellScores(...args: Parameters<typeof cellScoreSteps>): Float64Array {
  return finishSteps(cellScoreSteps(...args));
}

/** {@link cellScores} as steps, one per cell (see ./steps.ts). */
export function* cellScoreSteps(
  design: Design,
  cells: readonly GridCell[],
  subjectLabels: Uint8Array,
  subjectFolds: readonly Int32Array[],
  folds: number,
  classifier: Classifier,
  seed: number,
): Steps<Float64Array> {
  const out = new Float64Array(cells.length);
  for (let c = 0; c < cells.length; c++) {
    out[c] = crossValidate(design, cells[c].columns, subjectLabels, subjectFolds, folds, classifier, seed).score;
    yield;
  }
  return out;
}

/** Result of nested cross-validation of "pick the best cell". */
export interface NestedSelection {
  /** Mean over repeats of the subject-level outer out-of-fold AUC. */
  auc: number;
  aucByRepeat: Float64Array;
  /** How often each cell was picked (index as in `cells`), over repeats x outer folds. */
  timesSelected: Int32Array;
  /** Inner folds used (settings' folds, reduced when an outer training set is too small). */
  innerFolds: number;
}

/**
 * Nested cross-validation of the best-cell rule. For repeat r and outer fold f, the outer
 * training subjects are split into inner folds (stream deriveSeed(seed, 'nested', r, f)),
 * every cell is scored by inner cross-validation, the highest-scoring cell (first in grid
 * order on ties) is refitted on the whole outer training set and predicts the outer test
 * subjects (fit seed as in crossValidate, so a one-cell grid reproduces the plain CV).
 *
 * Cost: repeats · folds · (cells · innerFolds + 1) fits. Returns null when an outer training
 * set has fewer than 2 subjects of a group, so no inner cross-validation is possible.
 */
export function nestedBestCell(...args: Parameters<typeof nestedBestCellSteps>): NestedSelection | null {
  return finishSteps(nestedBestCellSteps(...args));
}

/** {@link nestedBestCell} as steps, one per outer fold (see ./steps.ts). */
export function* nestedBestCellSteps(
  design: Design,
  cells: readonly GridCell[],
  subjectLabels: Uint8Array,
  subjectFolds: readonly Int32Array[],
  folds: number,
  classifier: Classifier,
  seed: number,
  onFold?: (done: number, total: number) => void,
): Steps<NestedSelection | null> {
  const innerFolds = feasibleInnerFolds(subjectLabels, subjectFolds, folds);
  if (innerFolds < 2) return null;
  const repeats = subjectFolds.length;
  const rowLabels = rowLabelsOf(design, subjectLabels);
  const timesSelected = new Int32Array(cells.length);
  const aucByRepeat = new Float64Array(repeats);
  let done = 0;
  for (let rep = 0; rep < repeats; rep++) {
    const rowFold = new Int32Array(design.nRows);
    for (let r = 0; r < design.nRows; r++) rowFold[r] = subjectFolds[rep][design.ofRow[r]];
    const splits = foldRows(rowFold, folds);
    const rowP = new Float64Array(design.nRows);
    const fitSeed = deriveSeed(seed, 'fit', rep);
    for (let f = 0; f < folds; f++) {
      const inner = restrictToSubjects(design, subjectLabels, subjectFolds[rep], f);
      const innerFold = stratifiedSubjectFolds(inner.labels, innerFolds, deriveSeed(seed, 'nested', rep, f));
      const scores = cellScores(inner.design, cells, inner.labels, [innerFold], innerFolds, classifier, deriveSeed(seed, 'nested-fit', rep, f));
      const best = argmaxFirst(scores);
      timesSelected[best]++;
      const p = predictFold(design, cells[best].columns, rowLabels, splits[f], classifier, deriveSeed(fitSeed, f));
      for (let i = 0; i < splits[f].test.length; i++) rowP[splits[f].test[i]] = p[i];
      onFold?.(++done, repeats * folds);
      yield;
    }
    aucByRepeat[rep] = aucFromScores(subjectMeans(rowP, design.ofRow, design.nSubjects), subjectLabels);
  }
  let sum = 0;
  for (let rep = 0; rep < repeats; rep++) sum += aucByRepeat[rep];
  return { auc: sum / repeats, aucByRepeat, timesSelected, innerFolds };
}

/** Index of the largest value, the first one on ties; NaN counts as smallest. */
function argmaxFirst(values: Float64Array): number {
  let best = 0;
  for (let i = 1; i < values.length; i++) if (values[i] > values[best] || values[best] !== values[best]) best = i;
  return best;
}

/** Largest inner fold count <= folds that every outer training set can stratify. */
function feasibleInnerFolds(subjectLabels: Uint8Array, subjectFolds: readonly Int32Array[], folds: number): number {
  let smallest = Infinity;
  for (const assignment of subjectFolds) {
    for (let f = 0; f < folds; f++) {
      const counts = [0, 0];
      for (let s = 0; s < subjectLabels.length; s++) if (assignment[s] !== f) counts[subjectLabels[s]]++;
      smallest = Math.min(smallest, counts[0], counts[1]);
    }
  }
  return Math.min(folds, smallest);
}

/** The outer training part of a design (subjects not in `testFold`), subjects renumbered. */
function restrictToSubjects(design: Design, subjectLabels: Uint8Array, subjectFold: Int32Array, testFold: number): { design: Design; labels: Uint8Array } {
  const newNumber = new Int32Array(subjectLabels.length).fill(-1);
  const labels: number[] = [];
  for (let s = 0; s < subjectLabels.length; s++) {
    if (subjectFold[s] !== testFold) {
      newNumber[s] = labels.length;
      labels.push(subjectLabels[s]);
    }
  }
  const rows: number[] = [];
  for (let r = 0; r < design.nRows; r++) if (newNumber[design.ofRow[r]] >= 0) rows.push(r);
  const values = new Float64Array(rows.length * design.nCols);
  const ofRow = new Int32Array(rows.length);
  rows.forEach((r, i) => {
    values.set(design.values.subarray(r * design.nCols, (r + 1) * design.nCols), i * design.nCols);
    ofRow[i] = newNumber[design.ofRow[r]];
  });
  return { design: { values, nRows: rows.length, nCols: design.nCols, ofRow, nSubjects: labels.length }, labels: Uint8Array.from(labels) };
}

/**
 * evaluateStudy: the whole cross-validated, permutation-tested answer to "do the groups
 * differ, and where in the grid?" for one feature matrix. No I/O.
 *
 * Order of work: label-free column screening; headline cross-validation (all columns) and
 * one cross-validation per grid cell; label permutations of the whole pipeline (fold split,
 * preprocessing, training — everything that sees labels); metrics; Westfall–Young adjusted
 * cell p-values; nested cross-validation of the best-cell rule; permutation importance.
 * docs/evaluation.md describes each step and its sources.
 */
import type { Classifier } from './classifier.ts';
import { createForest, createLogistic } from './classifiers/index.ts';
import { checkFoldsFeasible, countByLabel, indexSubjects, repeatedSubjectFolds } from './cv.ts';
import type { SubjectIndex } from './cv.ts';
import { crossValidate } from './crossval.ts';
import type { CrossValidation, Design } from './crossval.ts';
import { cellScores, cellScoreSteps, gridCellsOf, nestedBestCellSteps, rawCellPValues, westfallYoungMaxT } from './grid-scan.ts';
import type { GridCell } from './grid-scan.ts';
import { importanceByCell, importanceByFeature, permutationImportanceSteps } from './importance.ts';
import { driveSteps, finishSteps, type Steps } from './steps.ts';
import { classificationMetrics } from './metrics.ts';
import { runPermutationTest } from './permutation.ts';
import type { PermutationRun } from './permutation.ts';
import { rocCurve } from './roc.ts';
import type { PermutablePipeline } from './permutation.ts';
import type { EvaluationResult } from './result.ts';
import type { EvaluationSettings, FeatureColumn, FeatureMatrix } from './types.ts';
import { InputError } from '../shared/errors.ts';

/** Exceedances after which Besag & Clifford (1991) sequential stopping ends the test (their examples use h = 10 and 20 [M]). */
export const STOP_AFTER_EXCEEDANCES = 10;

export type ProgressCallback = (stage: string, done: number, total: number) => void;

/** Everything the pipeline needs, prepared once; a worker can rebuild it from (matrix, settings). */
export interface PreparedStudy {
  design: Design;
  subjects: SubjectIndex;
  /** Columns that entered the design (index = design column). */
  columns: FeatureColumn[];
  dropped: EvaluationResult['data']['columns_dropped'];
  cells: GridCell[];
  allColumns: Int32Array;
  settings: EvaluationSettings;
  classifier: Classifier;
  /** Statistics vector: entry 0 the headline score, then one score per cell when the grid has 2 or more cells. */
  pipeline: PermutablePipeline;
}

/**
 * Computes the full evaluation of a feature matrix with the classifier named in settings
 * (the forest or the L2 logistic regression of ./classifiers).
 *
 * Cost: (1 + B) · repeats · folds · (1 + cells) fits for the permutation tests, plus
 * repeats · folds · (cells · innerFolds + 1) for the nested CV. Throws InputError for a
 * malformed matrix, bad settings or a group with fewer subjects than folds.
 * Example: two groups of 20 subjects whose first column differs by 2 SD -> headline AUC
 * near 0.9 and a p-value near 1/(1 + B).
 */
export function evaluateStudy(matrix: FeatureMatrix, settings: EvaluationSettings, onProgress?: ProgressCallback): EvaluationResult {
  return evaluateWithClassifier(matrix, settings, classifierFor(settings), onProgress);
}

/** The classifier settings ask for. */
export function classifierFor(settings: EvaluationSettings): Classifier {
  return settings.classifier === 'logistic' ? createLogistic({ l2: settings.l2 }) : createForest({ trees: settings.trees });
}

/**
 * evaluateStudy with an explicit classifier (tests and cross-checks plug in their own).
 * Same contract as {@link evaluateStudy}.
 */
export function evaluateWithClassifier(
  matrix: FeatureMatrix,
  settings: EvaluationSettings,
  classifier: Classifier,
  onProgress?: ProgressCallback,
): EvaluationResult {
  const observed = finishSteps(observeSteps(matrix, settings, classifier, onProgress));
  const run = runPermutationTest(observed.study.pipeline, observed.statistics, settings.permutations, stopAfterOf(settings), (done, total) =>
    onProgress?.('permutations', done, total),
  );
  return finishSteps(concludeSteps(matrix, observed, run, onProgress));
}

/**
 * Runs the permutations of a prepared study: must return what runPermutationTest(study.pipeline,
 * observed, B, stopAfter) returns (a worker pool computes the same permutations k elsewhere).
 */
export type PermutationStage = (
  study: PreparedStudy,
  observed: Float64Array,
  B: number,
  stopAfter: number | null,
  onEach: (done: number, total: number) => void,
) => Promise<PermutationRun>;

/**
 * evaluateStudy with the permutation stage handed to `permute` (e.g. a worker pool); every
 * other step runs here, awaiting `pause()` (when given) after the headline cross-validation,
 * each grid cell, each outer fold of the nested cross-validation and each repeat of the
 * importance, so that an event loop can serve signals in between. Gives the same result as {@link evaluateStudy} when `permute` keeps its
 * contract. Same errors.
 */
export async function evaluateStudyWith(
  matrix: FeatureMatrix,
  settings: EvaluationSettings,
  permute: PermutationStage,
  onProgress?: ProgressCallback,
  pause?: () => Promise<void>,
): Promise<EvaluationResult> {
  const observed = await driveSteps(observeSteps(matrix, settings, classifierFor(settings), onProgress), pause);
  const run = await permute(observed.study, observed.statistics, settings.permutations, stopAfterOf(settings), (done, total) =>
    onProgress?.('permutations', done, total),
  );
  return driveSteps(concludeSteps(matrix, observed, run, onProgress), pause);
}

const stopAfterOf = (settings: EvaluationSettings): number | null => (settings.stopEarly ? STOP_AFTER_EXCEEDANCES : null);

/** The prepared study and its observed scores (headline CV and one CV per grid cell). */
interface ObservedStudy {
  study: PreparedStudy;
  observedFolds: ReturnType<typeof repeatedSubjectFolds>;
  headlineCv: CrossValidation;
  observedCells: Float64Array;
  /** The statistics vector of the observed labels (see PreparedStudy.pipeline). */
  statistics: Float64Array;
}

function* observeSteps(matrix: FeatureMatrix, settings: EvaluationSettings, classifier: Classifier, onProgress?: ProgressCallback): Steps<ObservedStudy> {
  const study = prepareStudy(matrix, settings, classifier);
  const { design, subjects, cells } = study;
  const gridScanned = cells.length >= 2;

  onProgress?.('cross-validation', 0, 1);
  const observedFolds = repeatedSubjectFolds(subjects.labels, settings.folds, settings.repeats, settings.seed);
  const headlineCv = crossValidate(design, study.allColumns, subjects.labels, observedFolds, settings.folds, classifier, settings.seed);
  yield;
  const observedCells = gridScanned
    ? yield* cellScoreSteps(design, cells, subjects.labels, observedFolds, settings.folds, classifier, settings.seed)
    : Float64Array.of(headlineCv.score);
  const statistics = Float64Array.of(headlineCv.score, ...(gridScanned ? observedCells : []));
  onProgress?.('cross-validation', 1, 1);
  return { study, observedFolds, headlineCv, observedCells, statistics };
}

function* concludeSteps(matrix: FeatureMatrix, observed: ObservedStudy, run: PermutationRun, onProgress?: ProgressCallback): Steps<EvaluationResult> {
  const { study, observedFolds, headlineCv, observedCells } = observed;
  const { design, subjects, cells, settings, classifier } = study;
  const gridScanned = cells.length >= 2;
  const B = run.nullStatistics.length;
  const nullCells = run.nullStatistics.map((s) => (gridScanned ? s.subarray(1) : s.subarray(0, 1)));
  const rawP = rawCellPValues(observedCells, nullCells);
  const adjustedP = westfallYoungMaxT(observedCells, nullCells);

  const notes = dropNotes(study.dropped);
  if (run.stoppedEarly) {
    notes.push(`Sequential stopping (Besag & Clifford 1991): the test stopped after ${B} of ${settings.permutations} permutations, when ${STOP_AFTER_EXCEEDANCES} permuted scores had reached the observed one; cell p-values use those ${B} permutations.`);
  }
  if (B === 0) notes.push('No permutations were requested, so no p-values are reported.');

  const nested = gridScanned
    ? yield* nestedBestCellSteps(design, cells, subjects.labels, observedFolds, settings.folds, classifier, settings.seed, (d, t) => onProgress?.('nested', d, t))
    : null;
  const nestedReason = !gridScanned
    ? 'the grid has one cell, so there is no cell to pick'
    : nested === null
      ? 'an outer training set has fewer than 2 subjects of a group, so no inner cross-validation is possible — use fewer folds or more subjects'
      : null;
  if (nested && nested.innerFolds < settings.folds) notes.push(`Nested cross-validation used ${nested.innerFolds} inner folds (outer training sets too small for ${settings.folds}).`);

  onProgress?.('importance', 0, 1);
  const importance = yield* permutationImportanceSteps(design, subjects.labels, observedFolds, settings.folds, classifier, settings.seed);
  onProgress?.('importance', 1, 1);

  const meanP = meanProbabilityPerSubject(headlineCv, design.nSubjects);
  const metrics = classificationMetrics(meanP, subjects.labels);
  const naiveBest = Math.max(...Array.from(observedCells).filter((v) => v === v));
  return {
    settings: {
      folds: settings.folds,
      repeats: settings.repeats,
      permutations: settings.permutations,
      classifier: settings.classifier,
      trees: settings.trees,
      l2: settings.l2,
      stop_early: settings.stopEarly,
      stop_after_exceedances: STOP_AFTER_EXCEEDANCES,
      seed: settings.seed,
      null_folds: 're-split',
    },
    data: {
      rows: design.nRows,
      subjects: design.nSubjects,
      group_names: [matrix.groupNames[0], matrix.groupNames[1]],
      group_sizes: countByLabel(subjects.labels),
      columns_used: study.columns.length,
      columns_dropped: study.dropped,
    },
    headline: {
      classifier: settings.classifier,
      auc: finiteOrNull(headlineCv.score),
      auc_by_repeat: Array.from(headlineCv.aucByRepeat, finiteOrNull),
      auc_ci: metrics.auc_ci,
      auc_se: metrics.auc_se,
      auc_of_mean_probability: finiteOrNull(metrics.auc),
      balanced_accuracy: finiteOrNull(metrics.balanced_accuracy),
      sensitivity: finiteOrNull(metrics.sensitivity),
      specificity: finiteOrNull(metrics.specificity),
      confusion: metrics.confusion,
      p_value: B > 0 ? finiteOrNull(run.headline.p_value) : null,
      p_value_se: B > 0 ? finiteOrNull(run.headline.p_value_se) : null,
      exceedances: run.headline.exceedances,
      permutations: B,
      stopped_early: run.stoppedEarly,
      null_aucs: run.nullStatistics.map((stats) => stats[0]).filter((v) => Number.isFinite(v)),
      roc: rocCurve(meanP, subjects.labels),
    },
    predictions: Array.from({ length: headlineCv.aucByRepeat.length }, (_, repeat) =>
      subjects.names.map((subject, s) => ({
        subject,
        group: matrix.groupNames[subjects.labels[s]],
        repeat: repeat + 1,
        probability: headlineCv.subjectProbabilities[repeat * design.nSubjects + s],
      })),
    ).flat(),
    subjects: subjects.names.map((subject, s) => ({ subject, group: matrix.groupNames[subjects.labels[s]], probability: meanP[s] })),
    cells: cells.map((c, i) => ({
      order: c.order,
      delay: c.delay,
      scale: c.scale,
      columns: c.columns.length,
      auc: finiteOrNull(observedCells[i]),
      p_value: B > 0 ? finiteOrNull(rawP[i]) : null,
      p_adjusted: B > 0 ? finiteOrNull(adjustedP[i]) : null,
    })),
    nested: nested && {
      auc: finiteOrNull(nested.auc),
      auc_by_repeat: Array.from(nested.aucByRepeat, finiteOrNull),
      naive_best_auc: finiteOrNull(naiveBest),
      optimism: finiteOrNull(naiveBest - nested.auc),
      inner_folds: nested.innerFolds,
      selected_cells: cells
        .map((c, i) => ({ order: c.order, delay: c.delay, scale: c.scale, times_selected: nested.timesSelected[i] }))
        .filter((c) => c.times_selected > 0),
    },
    nested_reason: nestedReason,
    importance: {
      by_column: study.columns.map((c, j) => ({ feature: c.feature, order: c.order, delay: c.delay, scale: c.scale, importance: finiteOrNull(importance[j]) })),
      by_feature: importanceByFeature(study.columns, importance).map((g) => ({ ...g, importance: finiteOrNull(g.importance) })),
      by_cell: importanceByCell(study.columns, importance).map((g) => ({ ...g, importance: finiteOrNull(g.importance) })),
    },
    notes,
  };
}

/**
 * Validates the inputs, screens columns (label-free) and builds the permutable pipeline.
 * The pipeline's statistics for any labels re-split the folds with the same seeds
 * (deriveSeed(seed, 'cv', repeat)) and use the same fit seeds, so it is a fixed function of
 * the labels: permutation k gives the same numbers in any worker.
 */
export function prepareStudy(matrix: FeatureMatrix, settings: EvaluationSettings, classifier: Classifier): PreparedStudy {
  checkSettings(settings);
  checkMatrix(matrix);
  const subjects = indexSubjects(matrix.subjects, matrix.labels);
  checkFoldsFeasible(subjects.labels, settings.folds, matrix.groupNames);
  const { keep, dropped } = screenColumns(matrix);
  if (keep.length === 0) {
    throw new InputError('feature matrix: every column is missing or constant across all recordings — there is nothing to compare; check the grid and the quality table');
  }
  const design = compactDesign(matrix, keep, subjects);
  const columns = keep.map((c) => matrix.columns[c]);
  const cells = gridCellsOf(columns);
  const allColumns = Int32Array.from(columns, (_, i) => i);
  const gridScanned = cells.length >= 2;
  const pipeline: PermutablePipeline = {
    subjectLabels: subjects.labels,
    seed: settings.seed,
    statistics(labels: Uint8Array): Float64Array {
      const folds = repeatedSubjectFolds(labels, settings.folds, settings.repeats, settings.seed);
      const headline = crossValidate(design, allColumns, labels, folds, settings.folds, classifier, settings.seed).score;
      if (!gridScanned) return Float64Array.of(headline);
      return Float64Array.of(headline, ...cellScores(design, cells, labels, folds, settings.folds, classifier, settings.seed));
    },
  };
  return { design, subjects, columns, dropped, cells, allColumns, settings, classifier, pipeline };
}

function meanProbabilityPerSubject(cv: CrossValidation, nSubjects: number): Float64Array {
  const repeats = cv.aucByRepeat.length;
  const out = new Float64Array(nSubjects);
  for (let rep = 0; rep < repeats; rep++) for (let s = 0; s < nSubjects; s++) out[s] += cv.subjectProbabilities[rep * nSubjects + s] / repeats;
  return out;
}

function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

function dropNotes(dropped: EvaluationResult['data']['columns_dropped']): string[] {
  if (dropped.length === 0) return [];
  const names = dropped.map((d) => `${d.feature} (order ${d.order}, delay ${d.delay}, scale ${d.scale}): ${d.reason}`);
  return [`${dropped.length} column(s) left out before modelling: ${names.join('; ')}.`];
}

/**
 * Columns that cannot inform any model whatever the labels: all values missing, or one
 * distinct value across all rows. Uses no labels, so it leaks nothing into the folds.
 */
function screenColumns(matrix: FeatureMatrix): { keep: number[]; dropped: EvaluationResult['data']['columns_dropped'] } {
  const nCols = matrix.columns.length;
  const nRows = matrix.rowIds.length;
  const keep: number[] = [];
  const dropped: EvaluationResult['data']['columns_dropped'] = [];
  for (let c = 0; c < nCols; c++) {
    let first = NaN;
    let varies = false;
    let present = false;
    for (let r = 0; r < nRows; r++) {
      const v = matrix.values[r * nCols + c];
      if (v !== v) continue;
      if (!present) {
        present = true;
        first = v;
      } else if (v !== first) {
        varies = true;
        break;
      }
    }
    const { feature, order, delay, scale } = matrix.columns[c];
    if (!present) dropped.push({ feature, order, delay, scale, reason: 'all values missing' });
    else if (!varies) dropped.push({ feature, order, delay, scale, reason: 'constant across all rows' });
    else keep.push(c);
  }
  return { keep, dropped };
}

function compactDesign(matrix: FeatureMatrix, keep: number[], subjects: SubjectIndex): Design {
  const nRows = matrix.rowIds.length;
  const nIn = matrix.columns.length;
  const nCols = keep.length;
  const values = new Float64Array(nRows * nCols);
  for (let r = 0; r < nRows; r++) for (let j = 0; j < nCols; j++) values[r * nCols + j] = matrix.values[r * nIn + keep[j]];
  return { values, nRows, nCols, ofRow: subjects.ofRow, nSubjects: subjects.names.length };
}

function checkMatrix(m: FeatureMatrix): void {
  const nRows = m.rowIds.length;
  const nCols = m.columns.length;
  if (m.subjects.length !== nRows || m.labels.length !== nRows) {
    throw new InputError(`feature matrix: ${nRows} row ids, ${m.subjects.length} subjects and ${m.labels.length} labels — give one subject and one label per row`);
  }
  if (m.values.length !== nRows * nCols) {
    throw new InputError(`feature matrix: values hold ${m.values.length} numbers, expected rows x columns = ${nRows} x ${nCols} = ${nRows * nCols}`);
  }
  for (let r = 0; r < nRows; r++) {
    if (m.labels[r] !== 0 && m.labels[r] !== 1) {
      throw new InputError(`feature matrix: row "${m.rowIds[r]}" has label ${m.labels[r]} — labels are 0 (${m.groupNames[0]}) or 1 (${m.groupNames[1]})`);
    }
  }
  for (let i = 0; i < m.values.length; i++) {
    const v = m.values[i];
    if (v === Infinity || v === -Infinity) {
      const r = Math.floor(i / nCols);
      const c = m.columns[i % nCols];
      throw new InputError(
        `feature matrix: row "${m.rowIds[r]}", ${c.feature} (order ${c.order}, delay ${c.delay}, scale ${c.scale}) is ${v} — features must be finite numbers or NaN for missing`,
      );
    }
  }
}

function checkSettings(s: EvaluationSettings): void {
  const integer = (name: string, v: number, min: number, fix: string): void => {
    if (!Number.isInteger(v) || v < min) throw new InputError(`settings ${name}: must be an integer of at least ${min}, got ${v} — ${fix}`);
  };
  integer('folds', s.folds, 2, 'use folds: 5 (common practice)');
  integer('repeats', s.repeats, 1, 'use repeats: 1 or more');
  integer('permutations', s.permutations, 0, 'use permutations: 999 or more for a p-value to report');
  if (s.classifier !== 'forest' && s.classifier !== 'logistic') {
    throw new InputError(`settings classifier: "${String(s.classifier)}" is not known — use forest or logistic`);
  }
  if (s.classifier === 'forest') integer('trees', s.trees, 1, 'use trees: 100 or more');
  if (s.classifier === 'logistic' && !(s.l2 > 0 && Number.isFinite(s.l2))) {
    // l2 = 0 has no finite optimum when a training fold happens to be separable
    throw new InputError(`settings l2: must be a finite number > 0 for the logistic regression, got ${s.l2} — use l2: 1`);
  }
  if (!Number.isFinite(s.seed)) throw new InputError(`settings seed: must be a number, got ${s.seed} — use any integer, e.g. seed: 1`);
}

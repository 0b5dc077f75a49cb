/**
 * What evaluateStudy returns, field by field exactly as results.json holds it (snake_case
 * keys, plain numbers and arrays, no typed arrays). Missing-value policy: a number that
 * cannot be computed is null and the reason is in `notes` or in a `*_reason` field beside it;
 * a result never carries NaN (JSON has no NaN).
 */
import type { ClassifierName } from './types.ts';
import type { ConfusionMatrix } from './metrics.ts';

/** A feature column named by feature and grid cell. */
export interface ColumnName {
  feature: string;
  order: number;
  delay: number;
  scale: number;
}

export interface EvaluationResult {
  /** The settings the numbers were computed with, echoed for the record. */
  settings: {
    folds: number;
    repeats: number;
    /** Permutations requested (the headline says how many ran). */
    permutations: number;
    classifier: ClassifierName;
    /** Trees of the forest (used when classifier is 'forest'). */
    trees: number;
    /** L2 penalty lambda of the logistic regression (used when classifier is 'logistic'). */
    l2: number;
    /** Besag & Clifford (1991) sequential stopping requested. */
    stop_early: boolean;
    /** Exceedances h after which sequential stopping ends the test (only meaningful with stop_early). */
    stop_after_exceedances: number;
    seed: number;
    /** How fold splits are handled under permutation: always 're-split' (see docs/evaluation.md). */
    null_folds: 're-split';
  };

  /** The data as evaluated. */
  data: {
    /** Recordings (rows of the feature matrix). */
    rows: number;
    /** Distinct subjects; cross-validation and every AUC count subjects. */
    subjects: number;
    group_names: [string, string];
    /** Subjects per group, in group_names order. */
    group_sizes: [number, number];
    /** Columns that entered the models. */
    columns_used: number;
    /** Columns left out before any model saw the data, with the reason (label-free screening). */
    columns_dropped: (ColumnName & { reason: 'all values missing' | 'constant across all rows' })[];
  };

  /**
   * The headline test: all columns of all cells together, the chosen classifier, repeated
   * stratified subject-grouped cross-validation, and a label permutation test of the whole
   * pipeline. The positive class is group_names[1].
   */
  headline: {
    classifier: ClassifierName;
    /** Test statistic: mean over repeats of the subject-level out-of-fold AUC. */
    auc: number | null;
    /** Subject-level out-of-fold AUC of each repeat. */
    auc_by_repeat: (number | null)[];
    /**
     * DeLong (1988) 95% Wald interval of the AUC of the repeat-averaged out-of-fold
     * probabilities (auc_of_mean_probability); null when a group has fewer than 2 subjects.
     */
    auc_ci: [number, number] | null;
    auc_se: number | null;
    /** AUC of each subject's out-of-fold probability averaged over repeats (the interval's centre). */
    auc_of_mean_probability: number | null;
    /** At threshold 0.5 on the repeat-averaged probabilities; null when undefined. */
    balanced_accuracy: number | null;
    sensitivity: number | null;
    specificity: number | null;
    confusion: ConfusionMatrix;
    /** (1 + b) / (1 + B) (Phipson & Smyth 2010), or h / L after early stopping; null without permutations. */
    p_value: number | null;
    /** Monte Carlo standard error sqrt(p (1 − p) / B); null without permutations. */
    p_value_se: number | null;
    /** b: permuted statistics at least as large as the observed one. */
    exceedances: number;
    /** B: permutations actually run (fewer than requested only after early stopping). */
    permutations: number;
    stopped_early: boolean;
    /** The headline statistic under each label permutation, in permutation order (the null distribution). */
    null_aucs: number[];
    /** Empirical ROC curve of the repeat-averaged out-of-fold probabilities (Fawcett 2006). */
    roc: { fpr: number; tpr: number }[];
  };

  /** Each subject's out-of-fold probability in each repeat (repeats x subjects), for predictions.csv. */
  predictions: { subject: string; group: string; repeat: number; probability: number }[];

  /** Each subject's out-of-fold probability of belonging to group_names[1], averaged over repeats and recordings. */
  subjects: { subject: string; group: string; probability: number }[];

  /**
   * Grid scan: one entry per grid cell (order, delay, scale), sorted by order, delay, scale;
   * each scored with that cell's columns only, on the same folds and permutations as the headline.
   */
  cells: {
    order: number;
    delay: number;
    scale: number;
    /** Columns of this cell that entered the models. */
    columns: number;
    /** Mean over repeats of the subject-level out-of-fold AUC. */
    auc: number | null;
    /** Raw permutation p-value (1 + b) / (1 + B); null without permutations. */
    p_value: number | null;
    /** Westfall & Young (1993) step-down max-T family-wise adjusted p-value; null without permutations. */
    p_adjusted: number | null;
  }[];

  /**
   * Honest estimate of "pick the best cell" by nested cross-validation, beside the naive
   * best observed cell score; null (with reason) for a one-cell grid or too few subjects.
   */
  nested: {
    /** Mean over repeats of the outer subject-level out-of-fold AUC. */
    auc: number | null;
    auc_by_repeat: (number | null)[];
    /** Highest cell AUC in `cells` (optimistic: chosen after looking at the results). */
    naive_best_auc: number | null;
    /** naive_best_auc − auc. */
    optimism: number | null;
    inner_folds: number;
    /** Cells picked by the inner cross-validation, with how often (out of repeats x folds). */
    selected_cells: { order: number; delay: number; scale: number; times_selected: number }[];
  } | null;
  nested_reason: string | null;

  /**
   * Permutation importance of the headline model on held-out folds: drop in subject-level
   * out-of-fold AUC when one column is shuffled among a fold's test rows, averaged over repeats.
   */
  importance: {
    by_column: (ColumnName & { importance: number | null })[];
    /** Mean over the feature's columns (all cells). */
    by_feature: { feature: string; importance: number | null; columns: number }[];
    /** Mean over the cell's columns (all features). */
    by_cell: { order: number; delay: number; scale: number; importance: number | null; columns: number }[];
  };

  /** Plain-language remarks: dropped columns, reduced inner folds, early stopping. */
  notes: string[];
}

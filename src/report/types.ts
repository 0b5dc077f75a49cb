/**
 * Contract of the report stage: everything the HTML page shows, as plain data.
 *
 * The run stage maps the pipeline's results into one {@link ReportInput}; `renderReport`
 * turns it into one self-contained HTML document and computes nothing but layout, a PCA
 * projection for display and the figures. Every field is JSON-serialisable (no typed arrays,
 * no Date objects, no NaN needed), so `results.json` can carry the very same object and the
 * page and the exports share one source of truth.
 *
 * Conventions used throughout:
 * - `group` is 0 or 1 and indexes {@link ReportInput.groupNames};
 * - a number that could not be computed is `null` (NaN is accepted and treated as null); the
 *   page shows it as "—" and, where the input carries one, the reason beside it;
 * - strings from the user (study name, group names, subject ids, file names, covariates,
 *   warnings) arrive raw: the report escapes them, in HTML and in SVG alike.
 */

/** 0 for `groupNames[0]`, 1 for `groupNames[1]`. */
export type GroupIndex = 0 | 1;

/** One grid cell: pattern order m, delay tau, scale s (shared/DESIGN.md). */
export interface ReportCell {
  order: number;
  delay: number;
  scale: number;
}

/** A two-sided interval at a stated level, e.g. a 95% interval of the AUC. */
export interface Interval {
  low: number | null;
  high: number | null;
  /** Coverage in (0, 1), e.g. 0.95. */
  level: number;
  /** How it was computed, in plain words (e.g. "percentile bootstrap over subjects, 2000 draws"). */
  method: string;
}

/** The study's answer: the whole pipeline's cross-validated score and its permutation test. */
export interface Headline {
  /** Out-of-fold ROC AUC of the whole pipeline (grid-cell choice included), averaged over repeats. */
  auc: number | null;
  /** Interval around `auc`. */
  interval: Interval;
  /** Permutation p-value (1 + b) / (1 + B) (Phipson & Smyth 2010, Stat. Appl. Genet. Mol. Biol. 9, art. 39). */
  permutationP: number | null;
  /** Monte-Carlo standard error of `permutationP`, sqrt(p(1 − p)/B). */
  permutationPSe: number | null;
  /** B: label permutations actually run (may be fewer than asked when stopped early). */
  permutations: number;
  /** Repeats of the cross-validation (differently seeded splits). */
  repeats: number;
  /** Folds per repeat. */
  folds: number;
  /** Classifier name as the study file gives it (e.g. "logistic", "forest"). */
  classifier: string;
  /** Why `auc` or `permutationP` is null, when one is. */
  missingReason?: string;
}

/** One recording in the cohort table. */
export interface CohortRow {
  /** Recording id (unique per row). */
  id: string;
  subject: string;
  group: GroupIndex;
  /** Samples in the selected part of the recording. */
  length: number;
  /** Share of missing (NaN) samples, in [0, 1]. */
  missingShare: number | null;
  /** Share of valid windows holding a tie, in [0, 1], at the finest grid cell. */
  tiedShare: number | null;
  /** Quality warnings for this recording, in plain words. */
  warnings: string[];
}

/** A quality warning that is not tied to one row, or a study-wide one. */
export interface QualityWarning {
  /** Subject the warning concerns, when it concerns one. */
  subject?: string;
  /** File the warning concerns, when it concerns one. */
  file?: string;
  message: string;
}

/** Cross-validated score of one grid cell, with its family-wise adjusted permutation p. */
export interface GridScanCell extends ReportCell {
  auc: number | null;
  /** Max-statistic adjusted p-value over all cells (Westfall & Young 1993). */
  adjustedP: number | null;
}

/** The grid search, scored naively and honestly. */
export interface Selection {
  /** The cell with the best cross-validated score when the same data pick and score it (optimistic). */
  naiveBest: (ReportCell & { auc: number | null }) | null;
  /** Nested cross-validation estimate: the cell is picked inside each outer training fold. */
  nestedAuc: number | null;
  /** Interval around `nestedAuc`, when one was computed. */
  nestedInterval?: Interval;
  /** How often each cell was picked by the inner loops, when known. */
  pickedCells?: (ReportCell & { times: number })[];
}

/** Univariate comparison of one feature at one cell between the two groups. */
export interface UnivariateRow extends ReportCell {
  feature: string;
  /** Subjects with a value, per group. */
  n: [number, number];
  mean: [number | null, number | null];
  sd: [number | null, number | null];
  /** Hedges' g, group 1 minus group 0 (Hedges & Olkin 1985). */
  hedgesG: number | null;
  /** Interval around g. */
  gLow: number | null;
  gHigh: number | null;
  /** Two-sided Mann–Whitney p. */
  mannWhitneyP: number | null;
  /** U / (n0 n1): probability that a group-1 value exceeds a group-0 value (ties 1/2). */
  auc: number | null;
  /** Benjamini–Hochberg q over the whole family of rows (Benjamini & Hochberg 1995). */
  q: number | null;
  /** Why a value is null, when one is. */
  note?: string;
}

/** One subject in the complexity–entropy plane. */
export interface PlanePoint {
  subject: string;
  group: GroupIndex;
  /** Normalised permutation entropy H in [0, 1]. */
  h: number | null;
  /** Jensen–Shannon statistical complexity C (Rosso et al. 2007). */
  c: number | null;
}

/** A point of a bound curve of the plane. */
export interface CurvePoint {
  h: number;
  c: number;
}

/** The complexity–entropy plane at one chosen cell. */
export interface PlaneCell {
  cell: ReportCell;
  points: PlanePoint[];
  /** Minimum and maximum complexity curves for this order (Martin, Plastino & Rosso 2006), as data. */
  bounds: { min: CurvePoint[]; max: CurvePoint[] };
}

/** Values of one feature at one cell, per group, for the strip-and-box figure. */
export interface Distribution extends ReportCell {
  feature: string;
  /** Values of group 0 and group 1 (missing values left out). */
  values: [number[], number[]];
}

/** A point of the out-of-fold ROC curve. */
export interface RocPoint {
  fpr: number;
  tpr: number;
}

/**
 * Subjects x columns feature matrix from which the report computes a PCA projection for display
 * (columns standardised; missing values replaced by the column median, for the picture only).
 */
export interface ProjectionInput {
  subjects: string[];
  groups: GroupIndex[];
  /** Column labels, e.g. "permutation_entropy m3 τ1 s1". */
  columns: string[];
  /** Row-major rows, one per subject; null or NaN where missing. */
  rows: (number | null)[][];
}

export interface ImportanceRow extends ReportCell {
  feature: string;
  importance: number | null;
  /** Spread of the importance over repeats, when known. */
  sd?: number | null;
}

/** Feature importance, with the method in plain words. */
export interface Importance {
  /** E.g. "mean drop of the out-of-fold AUC when the column is permuted". */
  method: string;
  rows: ImportanceRow[];
}

export interface InputFileRecord {
  path: string;
  /** Lower-case hex SHA-256 of the file's bytes. */
  sha256: string;
  bytes?: number;
}

/** Everything needed to reproduce the run. */
export interface Reproduction {
  /** Path of the study file as given. */
  studyPath: string;
  /** The study file, verbatim. */
  studyText: string;
  /** The command line as argv, program name first; shown shell-quoted. */
  commandLine: string[];
  inputFiles: InputFileRecord[];
  toolVersion: string;
  nodeVersion: string;
  /** Package name to exact version. */
  dependencies: Record<string, string>;
  /** E.g. "linux x64". */
  platform: string;
  seed: number;
  /** ISO 8601 start time. */
  startedAt: string;
  durationMs: number;
}

/** Everything the report shows. */
export interface ReportInput {
  studyName: string;
  /** Names of group 0 and group 1; must differ. */
  groupNames: [string, string];
  /** Subjects per group after exclusions. */
  subjectsPerGroup: [number, number];
  /** Significance level used for wording and for marking cells (common practice: 0.05). */
  alpha: number;
  headline: Headline;
  cohort: CohortRow[];
  warnings: QualityWarning[];
  /** Notes about the study and the evaluation (not data problems): settings adjusted, columns left out, paths outside the study folder. */
  notes: string[];
  gridScan: GridScanCell[];
  selection: Selection;
  univariate: UnivariateRow[];
  plane: PlaneCell[];
  distributions: Distribution[];
  roc: RocPoint[];
  /** Whole-pipeline scores under permuted labels; the observed score is `headline.auc`. */
  nullScores: number[];
  projection: ProjectionInput | null;
  importance: Importance | null;
  reproduction: Reproduction;
}

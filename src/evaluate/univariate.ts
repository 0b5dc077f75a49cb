/**
 * Univariate group comparison of every column of a feature matrix: descriptive statistics,
 * Hedges' g, the Mann–Whitney test with its AUC, and Benjamini–Hochberg q-values.
 */
import type { FeatureColumn, FeatureMatrix } from './types.ts';
import { benjaminiHochberg } from './fdr.ts';
import { hedgesG } from './hedges.ts';
import { mannWhitneyU } from './mann-whitney.ts';

/** Descriptive statistics of one group in one column. */
export interface GroupSummary {
  /** Values present (not NaN). */
  n: number;
  /** Values missing (NaN), excluded from every statistic. */
  missing: number;
  /** null when n = 0. */
  mean: number | null;
  /** Sample SD (denominator n − 1); null when n < 2. */
  sd: number | null;
}

/** One feature at one grid cell, group 1 compared against group 0. */
export interface UnivariateRow extends FeatureColumn {
  group0: GroupSummary;
  group1: GroupSummary;
  /** Hedges' g of group 1 minus group 0, with its 95% interval; null with a reason when not computable. */
  hedgesG: number | null;
  gLow: number | null;
  gHigh: number | null;
  /** Mann–Whitney U of group 1 and AUC = U/(n0·n1) = P(group 1 > group 0) + ties/2. */
  u: number | null;
  auc: number | null;
  /** Two-sided Mann–Whitney p-value and how it was computed. */
  pValue: number | null;
  pMethod: 'exact' | 'normal' | null;
  /** Benjamini–Hochberg q over the rows whose p-value is not null. */
  qValue: number | null;
  /** Why some statistics are null ('; '-separated), or null when all are present. */
  reason: string | null;
}

export interface CompareGroupsOptions {
  /** Fewest present values per group for any test statistic (default 2, the least Hedges' g needs). */
  minPerGroup?: number;
  /** Level of the Hedges' g interval (default 0.95). */
  level?: number;
}

/**
 * Compares the two groups of `matrix` column by column. For each column: n, missing count,
 * mean and SD per group (Welford 1962, Technometrics 4, 419, one pass); Hedges' g with a
 * 95% interval ({@link hedgesG}); the two-sided Mann–Whitney test and its AUC
 * ({@link mannWhitneyU}: exact without ties for up to 50 values, otherwise normal with tie and
 * continuity correction); then Benjamini–Hochberg q-values over the whole family of columns
 * ({@link benjaminiHochberg}; columns without a p-value are left out of the family).
 *
 * Missing values (NaN) are excluded and counted per group. A column with fewer than
 * `minPerGroup` values in a group, or with one value throughout, gets null statistics and a
 * reason; a column whose groups are each constant but differ gets a Mann–Whitney result but
 * no g (the pooled SD is 0).
 *
 * Rows are taken as independent observations: when subjects have several recordings, pass
 * one row per subject (e.g. averaged) to keep the tests valid.
 *
 * Complexity O(columns · rows log rows). An empty matrix gives an empty array.
 *
 * @example compareGroups(m) // m: 1 column, group 0 = [1, 2, 4], group 1 = [3, 5, 6]
 * // [{ ..., u: 8, auc: 0.888889, pValue: 0.2, pMethod: 'exact', hedgesG: 1.222020, qValue: 0.2, ... }]
 */
export function compareGroups(matrix: FeatureMatrix, options: CompareGroupsOptions = {}): UnivariateRow[] {
  const minPerGroup = options.minPerGroup ?? 2;
  const level = options.level ?? 0.95;
  const nCols = matrix.columns.length;
  const nRows = matrix.labels.length;
  if (matrix.values.length !== nRows * nCols) {
    throw new RangeError(`compareGroups: values hold ${matrix.values.length} numbers, expected rows x columns = ${nRows} x ${nCols}`);
  }
  const rows = matrix.columns.map((column, c) => compareColumn(matrix, column, c, minPerGroup, level));
  const q = benjaminiHochberg(rows.map((row) => row.pValue ?? Number.NaN));
  rows.forEach((row, i) => {
    row.qValue = Number.isNaN(q[i]) ? null : q[i];
  });
  return rows;
}

function compareColumn(matrix: FeatureMatrix, column: FeatureColumn, c: number, minPerGroup: number, level: number): UnivariateRow {
  const [values0, values1] = splitColumn(matrix, c);
  const group0 = summarise(values0);
  const group1 = summarise(values1);
  const row: UnivariateRow = {
    ...column,
    group0,
    group1,
    hedgesG: null,
    gLow: null,
    gHigh: null,
    u: null,
    auc: null,
    pValue: null,
    pMethod: null,
    qValue: null,
    reason: null,
  };
  const tooFew = tooFewReason(group0, group1, minPerGroup);
  if (tooFew !== null) return { ...row, reason: tooFew };
  if (isConstant(values0, values1)) return { ...row, reason: 'zero variance: every value is equal' };

  const reasons: string[] = [];
  const effect = hedgesG(asMoments(group0), asMoments(group1), level);
  if ('reason' in effect) reasons.push(`Hedges' g: ${effect.reason}`);
  else Object.assign(row, { hedgesG: effect.g, gLow: effect.low, gHigh: effect.high });

  const test = mannWhitneyU(values0, values1);
  Object.assign(row, { u: test.u, auc: test.auc });
  if (test.reason !== null) reasons.push(`Mann-Whitney: ${test.reason}`);
  else Object.assign(row, { pValue: test.p, pMethod: test.method });

  row.reason = reasons.length > 0 ? reasons.join('; ') : null;
  return row;
}

function splitColumn(matrix: FeatureMatrix, c: number): [Float64Array, Float64Array] {
  const nCols = matrix.columns.length;
  const nRows = matrix.labels.length;
  const all0: number[] = [];
  const all1: number[] = [];
  for (let r = 0; r < nRows; r++) {
    const v = matrix.values[r * nCols + c];
    const label = matrix.labels[r];
    if (label === 0) all0.push(v);
    else if (label === 1) all1.push(v);
    else throw new RangeError(`compareGroups: label ${label} in row ${r} — labels must be 0 or 1`);
  }
  return [Float64Array.from(all0), Float64Array.from(all1)];
}

/** One-pass mean and sample SD (Welford 1962); NaN values are counted as missing. */
function summarise(values: Float64Array): GroupSummary {
  let n = 0;
  let missing = 0;
  let mean = 0;
  let m2 = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isNaN(v)) {
      missing++;
      continue;
    }
    n++;
    const delta = v - mean;
    mean += delta / n;
    m2 += delta * (v - mean);
  }
  return { n, missing, mean: n > 0 ? mean : null, sd: n > 1 ? Math.sqrt(m2 / (n - 1)) : null };
}

function tooFewReason(group0: GroupSummary, group1: GroupSummary, minPerGroup: number): string | null {
  if (group0.n >= minPerGroup && group1.n >= minPerGroup) return null;
  return `too few values: ${group0.n} in group 0 and ${group1.n} in group 1, at least ${minPerGroup} per group needed`;
}

function isConstant(values0: Float64Array, values1: Float64Array): boolean {
  let first = Number.NaN;
  for (const values of [values0, values1]) {
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      if (Number.isNaN(v)) continue;
      if (Number.isNaN(first)) first = v;
      else if (v !== first) return false;
    }
  }
  return true;
}

function asMoments(summary: GroupSummary) {
  return { n: summary.n, mean: summary.mean ?? Number.NaN, sd: summary.sd ?? Number.NaN };
}

/**
 * Principal-component projection of subjects for display (Pearson 1901; Jolliffe 2002,
 * "Principal Component Analysis", 2nd ed., ch. 1–3), computed with ml-pca's SVD.
 */
import { PCA } from 'ml-pca';
import type { ProjectionInput } from './types.ts';

export interface Projection {
  /** Scores of each subject on the first two components ([pc1, pc2]; pc2 is 0 when only one exists). */
  scores: [number, number][];
  /** Share of the total variance of the standardised columns on each of the two components. */
  explained: [number, number];
  /** Columns used (finite in at least two rows and not constant). */
  usedColumns: number;
}

/** Median of the finite values, or null when there are none. */
function finiteMedian(values: number[]): number | null {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (v.length === 0) return null;
  const mid = v.length >> 1;
  return v.length % 2 === 1 ? v[mid] : (v[mid - 1] + v[mid]) / 2;
}

/**
 * Standardised matrix for the projection: each column's missing values (null, NaN) replaced by
 * its median, then centred and divided by its sample standard deviation (n − 1). Columns with
 * fewer than two finite values or zero spread are dropped. Returns the rows and the kept count.
 */
export function standardiseColumns(rows: (number | null)[][], nCols: number): { matrix: number[][]; kept: number } {
  const n = rows.length;
  const columns: number[][] = [];
  for (let j = 0; j < nCols; j++) {
    const raw = rows.map((r) => (r[j] === null || r[j] === undefined ? NaN : (r[j] as number)));
    const finiteCount = raw.filter(Number.isFinite).length;
    const med = finiteMedian(raw);
    if (finiteCount < 2 || med === null) continue;
    const filled = raw.map((v) => (Number.isFinite(v) ? v : med));
    const mean = filled.reduce((a, b) => a + b, 0) / n;
    const ss = filled.reduce((a, b) => a + (b - mean) ** 2, 0);
    const sd = Math.sqrt(ss / (n - 1));
    if (!(sd > 1e-12 * Math.max(1, Math.abs(mean)))) continue;
    columns.push(filled.map((v) => (v - mean) / sd));
  }
  const matrix = rows.map((_, i) => columns.map((c) => c[i]));
  return { matrix, kept: columns.length };
}

/**
 * Projects subjects on the first two principal components of their standardised features
 * (see standardiseColumns). Sign convention: each component's loading vector is flipped so
 * that its entry of largest magnitude is positive, which makes the picture deterministic.
 *
 * Cost: one SVD of an n x p matrix, O(n p min(n, p)).
 * Returns null, with nothing drawn, when fewer than 3 subjects or no usable column remain.
 *
 * @example projectSubjects({ subjects: ['a', 'b', 'c'], groups: [0, 0, 1], columns: ['x', 'y'], rows: [[1, 2], [2, 4], [3, 7]] })
 *          // explained ≈ [0.99670, 0.00330]: two standardised columns with correlation r give (1 ± r)/2, r = 0.99340
 */
export function projectSubjects(input: ProjectionInput): Projection | null {
  if (input.rows.length < 3) return null;
  const { matrix, kept } = standardiseColumns(input.rows, input.columns.length);
  if (kept === 0) return null;
  const pca = new PCA(matrix, { center: true, scale: false });
  const loadings = pca.getLoadings().to2DArray();
  const nComp = Math.min(2, loadings.length);
  const signs = loadings.slice(0, nComp).map((row) => {
    let best = 0;
    for (const v of row) if (Math.abs(v) > Math.abs(best)) best = v;
    return best < 0 ? -1 : 1;
  });
  const predicted = pca.predict(matrix, { nComponents: nComp }).to2DArray();
  const explainedAll = pca.getExplainedVariance();
  const scores = predicted.map((r) => [r[0] * signs[0], nComp > 1 ? r[1] * signs[1] : 0] as [number, number]);
  return { scores, explained: [explainedAll[0] ?? 0, nComp > 1 ? (explainedAll[1] ?? 0) : 0], usedColumns: kept };
}

/**
 * From the long feature table to the matrices the evaluation stage takes: one row per
 * recording (classification) and one row per subject (univariate comparisons, the report's
 * plots), columns = feature x cell.
 */
import type { FeatureColumn, FeatureMatrix } from '../evaluate/index.ts';
import type { Study } from '../study/index.ts';
import type { FeatureRow } from './feature-table.ts';

const cellKey = (c: { feature: string; order: number; delay: number; scale: number }) => `${c.feature}|${c.order}|${c.delay}|${c.scale}`;

/** Columns in grid order (scale, delay, order) and, within a cell, in feature order. */
export function featureColumns(study: Study): FeatureColumn[] {
  const columns: FeatureColumn[] = [];
  for (const scale of study.grid.scale)
    for (const delay of study.grid.delay)
      for (const order of study.grid.order) for (const feature of study.features.include) columns.push({ feature, order, delay, scale });
  return columns;
}

/** One row per recording; a value that could not be computed is NaN. */
export function recordingMatrix(study: Study, rows: FeatureRow[]): FeatureMatrix {
  const columns = featureColumns(study);
  const columnIndex = new Map(columns.map((c, j) => [cellKey(c), j]));
  const recordings = study.recordings;
  const rowIndex = new Map(recordings.map((r, i) => [r.id, i]));
  const values = new Float64Array(recordings.length * columns.length).fill(Number.NaN);
  for (const row of rows) {
    const i = rowIndex.get(row.recording);
    const j = columnIndex.get(cellKey(row));
    if (i === undefined || j === undefined || row.value === null) continue;
    values[i * columns.length + j] = row.value;
  }
  return {
    rowIds: recordings.map((r) => r.id),
    subjects: recordings.map((r) => r.subject),
    labels: Uint8Array.from(recordings, (r) => (r.group === study.groups[1] ? 1 : 0)),
    groupNames: study.groups,
    columns,
    values,
  };
}

/**
 * One row per subject: the mean of the subject's recordings, column by column, over the
 * values that are present (NaN when none is). Subjects in order of first appearance.
 */
export function subjectMatrix(matrix: FeatureMatrix): FeatureMatrix {
  const subjects = [...new Set(matrix.subjects)];
  const index = new Map(subjects.map((s, i) => [s, i]));
  const p = matrix.columns.length;
  const sums = new Float64Array(subjects.length * p);
  const counts = new Uint32Array(subjects.length * p);
  const labels = new Uint8Array(subjects.length);
  matrix.subjects.forEach((subject, row) => {
    const s = index.get(subject)!;
    labels[s] = matrix.labels[row];
    for (let j = 0; j < p; j++) {
      const v = matrix.values[row * p + j];
      if (Number.isNaN(v)) continue;
      sums[s * p + j] += v;
      counts[s * p + j]++;
    }
  });
  const values = sums.map((sum, k) => (counts[k] > 0 ? sum / counts[k] : Number.NaN));
  return { rowIds: subjects, subjects, labels, groupNames: matrix.groupNames, columns: matrix.columns, values };
}

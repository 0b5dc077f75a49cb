/**
 * The feature table of a study: every recording's features over the grid, in long form,
 * and the per-cell quality table. Built one recording at a time.
 */
import { computeGridFeatures, type CellFeatures, type FeatureName } from '../features/index.ts';
import type { Series } from '../signals/index.ts';
import { deriveSeed } from '../shared/random.ts';
import type { Study } from '../study/index.ts';
import type { RecordingInfo } from './read-cohort.ts';

export interface FeatureRow {
  subject: string;
  group: string;
  order: number;
  delay: number;
  scale: number;
  feature: FeatureName;
  /** null when the feature could not be computed (see reason). */
  value: number | null;
  recording: string;
  reason: string;
}

export interface QualityRow {
  subject: string;
  group: string;
  recording: string;
  order: number;
  delay: number;
  scale: number;
  valid_windows: number;
  windows_per_pattern: number;
  tied_window_share: number;
  missing_share: number;
  flagged: boolean;
}

/** Features of one series over the study's grid, with the study's tie rule and scale form. */
export function featuresOfSeries(study: Study, series: Series, recordingId: string): CellFeatures[] {
  return computeGridFeatures(series.values, study.grid, {
    ties: study.features.ties,
    jitterRepeats: study.features.jitterRepeats,
    scaleForm: study.features.scaleForm,
    seed: deriveSeed(study.seed, 'jitter', recordingId),
    minWindowsPerPattern: study.features.minWindowsPerPattern,
  });
}

/** Long-form rows (one per recording x cell x included feature). */
export function featureRows(study: Study, info: RecordingInfo, cells: CellFeatures[]): FeatureRow[] {
  const { recording } = info;
  const rows: FeatureRow[] = [];
  for (const cell of cells) {
    for (const feature of study.features.include) {
      rows.push({
        subject: recording.subject,
        group: recording.group,
        order: cell.order,
        delay: cell.delay,
        scale: cell.scale,
        feature,
        value: cell.values[feature],
        recording: recording.id,
        reason: cell.values[feature] === null ? (cell.reasons[feature] ?? 'not computable') : '',
      });
    }
  }
  return rows;
}

/** Quality rows (one per recording x cell). */
export function qualityRows(info: RecordingInfo, cells: CellFeatures[]): QualityRow[] {
  const { recording } = info;
  return cells.map((cell) => ({
    subject: recording.subject,
    group: recording.group,
    recording: recording.id,
    order: cell.order,
    delay: cell.delay,
    scale: cell.scale,
    valid_windows: cell.quality.validWindows,
    windows_per_pattern: cell.quality.windowsPerPattern,
    tied_window_share: cell.quality.tiedShare,
    missing_share: cell.quality.missingShare,
    flagged: cell.quality.flagged,
  }));
}

/**
 * Human-readable summary of flagged cells: cells flagged for the same recordings share one
 * line, and a cell flagged for every recording says so.
 */
export function flaggedCellNotes(quality: QualityRow[], recordings: number): string[] {
  const byCell = new Map<string, string[]>();
  for (const q of quality) {
    if (!q.flagged) continue;
    const key = `(order ${q.order}, delay ${q.delay}, scale ${q.scale})`;
    byCell.set(key, [...(byCell.get(key) ?? []), q.recording]);
  }
  const byRecordings = new Map<string, string[]>();
  for (const [cell, ids] of byCell) {
    const who = ids.length === recordings ? 'every recording' : `${ids.length} recording(s): ${ids.slice(0, 8).join(', ')}${ids.length > 8 ? ', …' : ''}`;
    byRecordings.set(who, [...(byRecordings.get(who) ?? []), cell]);
  }
  return [...byRecordings.entries()].map(
    ([who, cells]) =>
      `${cells.length} cell(s) ${cells.join(', ')} have too few windows per possible pattern for ${who}` +
      (who === 'every recording' ? ' — their features are unreliable for all subjects' : ' — read those values with caution'),
  );
}

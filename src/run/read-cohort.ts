/**
 * Reads every recording of a study, one at a time, and hands each series to a callback, so
 * that a recording's samples can be released as soon as they are reduced to features.
 */
import { readSeries, describeSeries, type Series, type SeriesSummary } from '../signals/index.ts';
import type { Recording, Study } from '../study/index.ts';
import { sha256File } from './hash.ts';

export interface RecordingInfo {
  recording: Recording;
  sha256: string;
  format: Series['format'];
  channel: string;
  sampleRate: number | null;
  /** Samples in the channel before start/length selection. */
  totalSamples: number;
  summary: SeriesSummary;
  /** A caution about how the file was read (Series.caution), or null. */
  caution: string | null;
}

/**
 * Calls `reduce` for each recording in study order with its series and description, and
 * returns the per-recording information together with what `reduce` returned.
 */
export async function forEachRecording<T>(
  study: Study,
  reduce: (series: Series, info: RecordingInfo) => T,
  onProgress?: (done: number, total: number) => void,
): Promise<{ info: RecordingInfo; value: T }[]> {
  const out: { info: RecordingInfo; value: T }[] = [];
  for (const recording of study.recordings) {
    const series = await readSeries(recording.path, study.signal);
    const info: RecordingInfo = {
      recording,
      sha256: series.source?.sha256 ?? sha256File(recording.path),
      format: series.format,
      channel: series.channel,
      sampleRate: series.sampleRate,
      totalSamples: series.totalSamples,
      summary: describeSeries(series.values),
      caution: series.caution,
    };
    out.push({ info, value: reduce(series, info) });
    onProgress?.(out.length, study.recordings.length);
  }
  return out;
}

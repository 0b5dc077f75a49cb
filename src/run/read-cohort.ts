/**
 * Reads every recording of a study, one at a time, and hands each series to a callback, so
 * that a recording's samples can be released as soon as they are reduced to features.
 */
import { readSeries, type Series } from '../signals/index.ts';
import type { Recording, Study } from '../study/index.ts';
import { sha256File } from './hash.ts';
import { factsOf, type RecordingFacts } from './recording-features.ts';

/** A recording of the study with what was learnt when its file was read. */
export type RecordingInfo = { recording: Recording } & RecordingFacts;

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
    const info: RecordingInfo = { recording, ...factsOf(series, series.source?.sha256 ?? sha256File(recording.path)) };
    out.push({ info, value: reduce(series, info) });
    onProgress?.(out.length, study.recordings.length);
  }
  return out;
}

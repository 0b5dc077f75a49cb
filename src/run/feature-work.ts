/**
 * Spreads the feature work of a study over recordings: in this thread one recording at a
 * time, or over a worker pool with one recording per thread at a time. Either way a
 * recording's samples live only while its features are counted, and the results come back
 * in study order whatever order the threads finish in. New cache entries are written once
 * every recording has succeeded.
 */
import type { Cell, FeatureOptions } from '../features/index.ts';
import { deriveSeed } from '../shared/random.ts';
import type { Recording, Study } from '../study/index.ts';
import { gridCells } from './cell-groups.ts';
import type { RecordingInfo } from './read-cohort.ts';
import { recordingFeatures, storeOutcome, type RecordingOutcome, type RecordingTask } from './recording-features.ts';
import { openFeatureCache } from './feature-cache.ts';
import type { WorkPool } from './worker-pool.ts';

/** How the feature work runs. */
export interface FeatureWork {
  /** Cache folder, or null to compute everything and store nothing. */
  cacheDir: string | null;
  /** Worker pool, or null to work in this thread. */
  pool: WorkPool | null;
  /** Called once per recording with the cells actually computed (not taken from the cache). */
  onComputed?: (recordingId: string, cells: Cell[]) => void;
  /** Bytes of parsed samples held for the series cache (default SERIES_KEPT_BYTES). */
  seriesBudgetBytes?: number;
}

/**
 * Parsed samples held for the series cache until the stage succeeds (entries are written
 * only then). Beyond this many bytes in one stage, the remaining recordings' samples are not
 * cached, so memory stays bounded; their reruns parse the files again.
 */
export const SERIES_KEPT_BYTES = 64 * 2 ** 20;

/** This thread, no cache. */
export const IN_THREAD: FeatureWork = { cacheDir: null, pool: null };

/** The feature options of one recording: the study's settings and the recording's own jitter seed. */
export function featureOptionsOf(study: Study, recording: Recording): FeatureOptions {
  return {
    ties: study.features.ties,
    jitterRepeats: study.features.jitterRepeats,
    scaleForm: study.features.scaleForm,
    seed: deriveSeed(study.seed, 'jitter', recording.id),
    minWindowsPerPattern: study.features.minWindowsPerPattern,
  };
}

/**
 * Runs the tasks in the pool, at most two per thread in flight, handed out in study order.
 * When tasks fail, the error thrown is that of the earliest failing task in study order (as in
 * one thread): no later task is handed out, and those in flight are awaited (never aborted, so
 * no worker answers a task the pool has forgotten).
 */
async function inPool(pool: WorkPool, tasks: RecordingTask[], finish: (i: number, o: RecordingOutcome) => void): Promise<void> {
  let next = 0;
  let firstFailed = Infinity;
  let error: unknown;
  const runFrom = async (): Promise<void> => {
    while (next < tasks.length && firstFailed === Infinity) {
      const i = next++;
      try {
        finish(i, await pool.features(tasks[i]));
      } catch (e) {
        if (i < firstFailed) {
          firstFailed = i;
          error = e;
        }
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(tasks.length, 2 * pool.threads) }, runFrom));
  if (firstFailed < Infinity) throw error;
}

/** One recording's work item with the cells asked for. */
export function recordingTask(study: Study, recording: Recording, cells: Cell[], cacheDir: string | null): RecordingTask {
  return { path: recording.path, signal: study.signal, options: featureOptionsOf(study, recording), cells, cacheDir };
}

export interface RecordingResult {
  info: RecordingInfo;
  outcome: RecordingOutcome;
}

/**
 * Features of the given recordings at the given cells (default: every recording at every
 * cell of the grid, in grid-engine order). Results in the order of `items`.
 */
export async function computeRecordings(
  study: Study,
  work: FeatureWork,
  onProgress?: (done: number, total: number) => void,
  items: { recording: Recording; cells: Cell[] }[] = study.recordings.map((recording) => ({ recording, cells: gridCells(study.grid) })),
): Promise<RecordingResult[]> {
  const results: RecordingResult[] = new Array(items.length);
  const tasks = items.map((item) => recordingTask(study, item.recording, item.cells, work.cacheDir));
  let done = 0;
  let seriesBytes = 0;
  const finish = (i: number, outcome: RecordingOutcome): void => {
    const { recording } = items[i];
    if (outcome.series) {
      // parsed samples wait for the end of the stage to be cached, within a fixed budget
      seriesBytes += outcome.series.byteLength;
      if (seriesBytes > (work.seriesBudgetBytes ?? SERIES_KEPT_BYTES)) outcome.series = null;
    }
    results[i] = { info: { recording, ...outcome.facts }, outcome };
    work.onComputed?.(recording.id, outcome.computed);
    onProgress?.(++done, items.length);
  };
  if (work.pool === null) {
    for (const [i, task] of tasks.entries()) finish(i, await recordingFeatures(task));
  } else {
    await inPool(work.pool, tasks, finish);
  }
  if (work.cacheDir !== null) {
    // only after every recording succeeded: a failing run writes nothing anywhere
    const cache = openFeatureCache(work.cacheDir);
    results.forEach((r, i) => storeOutcome(tasks[i], r.outcome, cache));
  }
  return results;
}

/**
 * Tasks run in worker threads (src/run/worker-pool.ts): features of one recording, and the
 * statistics of a range of label permutations. Every task is a pure function of its plain
 * data input, so the results do not depend on which thread ran it or when.
 */
import { classifierFor, permutedStatisticsRange, prepareStudy, type EvaluationSettings, type FeatureMatrix, type PreparedStudy } from '../evaluate/index.ts';
import { InputError } from '../shared/errors.ts';
import { recordingFeatures, type RecordingOutcome, type RecordingTask } from './recording-features.ts';

/** A task's outcome, or its error as plain data (a thrown error loses its class between threads). */
export type Settled<T> = { ok: T } | { error: string; input: boolean };

/** Features of one recording (see recordingFeatures). */
export async function features(task: RecordingTask): Promise<Settled<RecordingOutcome>> {
  try {
    return { ok: await recordingFeatures(task) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e), input: e instanceof InputError };
  }
}

/** A range of permutations of one study; `studyId` lets a thread reuse its prepared pipeline. */
export interface PermutationTask {
  studyId: string;
  matrix: FeatureMatrix;
  settings: EvaluationSettings;
  from: number;
  to: number;
}

let prepared: { id: string; study: PreparedStudy } | null = null;

/**
 * Statistics of permutations [from, to) of the study rebuilt from (matrix, settings):
 * permutedStatisticsRange(prepareStudy(...).pipeline, from, to), one Float64Array per k.
 */
export function permutations(task: PermutationTask): Float64Array[] {
  if (prepared?.id !== task.studyId) {
    prepared = { id: task.studyId, study: prepareStudy(task.matrix, task.settings, classifierFor(task.settings)) };
  }
  return permutedStatisticsRange(prepared.study.pipeline, task.from, task.to);
}

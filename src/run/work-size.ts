/**
 * When worker threads pay off. Starting a thread that loads the TypeScript sources costs
 * about a second of CPU, so with the default --jobs a stage runs in this thread unless its
 * work is clearly larger; an explicit --jobs N always uses N threads. The result does not
 * depend on the choice (see src/run/permutation-stage.ts and src/run/feature-work.ts).
 */
import { statSync } from 'node:fs';
import type { Study } from '../study/index.ts';
import { estimateStatisticsCost } from './cost.ts';

/** Recording bytes above which the feature stage uses the pool (about half a million text samples). */
export const POOL_MIN_RECORDING_BYTES = 4_000_000;
/** Estimated statistics CPU seconds above which the permutations use the pool. */
export const POOL_MIN_STATISTICS_SECONDS = 3;

/** True when the study's recording files hold at least POOL_MIN_RECORDING_BYTES together (missing files count 0). */
export function featureWorkIsLarge(study: Study): boolean {
  let bytes = 0;
  for (const r of study.recordings) {
    try {
      bytes += statSync(r.path).size;
    } catch {
      // reported by the reader, with its reason
    }
    if (bytes >= POOL_MIN_RECORDING_BYTES) return true;
  }
  return false;
}

/** True when the statistics stage is estimated (src/run/cost.ts) at POOL_MIN_STATISTICS_SECONDS or more and has permutations to share. */
export function permutationWorkIsLarge(study: Study): boolean {
  return study.evaluation.permutations >= 2 && estimateStatisticsCost(study).seconds >= POOL_MIN_STATISTICS_SECONDS;
}

/**
 * The permutation stage, spread over a worker pool or run in this thread between turns of
 * the event loop. Permutation k's labels and fit seeds come
 * from (seed, k) alone (src/evaluate/permutation.ts), so computing ranges of k in any thread
 * and in any order, then reading them in index order, gives the same null distribution,
 * the same sequential stop and the same p-values as one thread.
 */
import { permutedStatisticsRange, runPermutationTest, type EvaluationSettings, type FeatureMatrix, type PermutablePipeline, type PermutationRun, type PermutationStage } from '../evaluate/index.ts';
import { randomBytes } from 'node:crypto';
import type { WorkPool } from './worker-pool.ts';

/**
 * Ranges [from, to) that split 0..B-1 into about `chunksPerThread` pieces per thread, in order.
 * Example: permutationRanges(10, 2, 2) -> [0,3) [3,6) [6,9) [9,10).
 */
export function permutationRanges(B: number, threads: number, chunksPerThread = 4): [number, number][] {
  const size = Math.max(1, Math.ceil(B / (threads * chunksPerThread)));
  const ranges: [number, number][] = [];
  for (let from = 0; from < B; from += size) ranges.push([from, Math.min(B, from + size)]);
  return ranges;
}

/**
 * A PermutationStage for evaluateStudyWith that computes the permutations in `pool`; `matrix`
 * and `settings` are the inputs the study was prepared from (each thread prepares its own).
 * Ranges are handed out in index order, at most two per thread in flight (see
 * {@link rangedPermutationStage}).
 */
export function pooledPermutationStage(pool: WorkPool, matrix: FeatureMatrix, settings: EvaluationSettings): PermutationStage {
  return (study, observed, B, stopAfter, onEach) => {
    const studyId = randomBytes(8).toString('hex');
    const compute = (from: number, to: number) => pool.permutations({ studyId, matrix, settings, from, to });
    return rangedPermutationStage(permutationRanges(B, pool.threads), 2 * pool.threads, compute, study, observed, B, stopAfter, onEach);
  };
}

/** Resolves after the event loop has turned once, so that pending signal handlers and I/O run. */
export const nextTurn = (): Promise<void> => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * A PermutationStage that computes the permutations in this thread, one at a time, and lets
 * the event loop run between them, so that Ctrl-C (a signal handler) is served within one
 * permutation's time instead of after the whole test. Same outcome as runPermutationTest.
 */
export const inThreadPermutationStage: PermutationStage = (study, observed, B, stopAfter, onEach) => {
  const compute = async (from: number, to: number) => {
    await nextTurn();
    return permutedStatisticsRange(study.pipeline, from, to);
  };
  const single = Array.from({ length: B }, (_, k): [number, number] => [k, k + 1]);
  return rangedPermutationStage(single, 1, compute, study, observed, B, stopAfter, onEach);
};

/**
 * Computes the permutation ranges with `compute`, at most `window` in flight, handed out and
 * read back in index order; under sequential stopping no new range is handed out once the
 * stopping rule is met, and the ranges still in flight are awaited (never aborted, so no
 * worker answers a task the pool has forgotten). The outcome is what runPermutationTest gives
 * in one thread: the statistics computed are replayed through it in index order.
 */
async function rangedPermutationStage(
  ranges: [number, number][],
  window: number,
  compute: (from: number, to: number) => Promise<Float64Array[]>,
  ...[study, observed, B, stopAfter, onEach]: Parameters<PermutationStage>
): Promise<PermutationRun> {
  const inFlight: Promise<Float64Array[]>[] = [];
  let done = 0;
  const launch = (): void => {
    const [from, to] = ranges[inFlight.length];
    inFlight.push(
      compute(from, to).then((stats) => {
        done += stats.length;
        onEach(done, B);
        return stats;
      }),
    );
  };
  while (inFlight.length < ranges.length && inFlight.length < window) launch();
  const computed: Float64Array[] = [];
  let exceedances = 0;
  try {
    for (let i = 0; i < ranges.length; i++) {
      const stats = await inFlight[i];
      for (const s of stats) {
        computed.push(s);
        if (!(s[0] < observed[0])) exceedances++;
        if (stopAfter !== null && exceedances >= stopAfter && computed.length < B) return replay(study.pipeline, observed, computed, B, stopAfter);
      }
      if (inFlight.length < ranges.length) launch();
    }
  } finally {
    await Promise.allSettled(inFlight);
  }
  return replay(study.pipeline, observed, computed, B, stopAfter);
}

/** runPermutationTest over statistics already computed, in index order. */
function replay(pipeline: PermutablePipeline, observed: Float64Array, computed: Float64Array[], B: number, stopAfter: number | null) {
  let k = 0;
  const recorded: PermutablePipeline = {
    subjectLabels: pipeline.subjectLabels,
    seed: pipeline.seed,
    statistics: () => {
      if (k >= computed.length) throw new Error(`permutation ${k} was not computed by the pool`);
      return computed[k++];
    },
  };
  return runPermutationTest(recorded, observed, B, stopAfter);
}

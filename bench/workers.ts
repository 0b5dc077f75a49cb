/**
 * Benchmark of worker threads on the permutation stage (issue 6): a seeded table of 80
 * subjects x 36 columns (4 grid cells x 9 features; a 0.4 SD shift in 4 columns), 5 folds,
 * 1 repeat, a 50-tree forest, 48 permutations. Times runPermutationTest in this thread,
 * then the pooled stage with 1 and 2 worker threads (pools started and warmed before
 * timing), checks that every pooled null distribution equals the one-thread one, and prints
 * the speed-up from 1 to 2 workers.
 *
 * Target: >= 1.7x from 1 to 2 workers. Needs two idle cores: the load average is printed
 * first, and a loaded machine shows less.
 *
 * Run: node --import tsx bench/workers.ts [--permutations 48] [--subjects 80]
 */
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { classifierFor, prepareStudy } from '../src/evaluate/evaluate.ts';
import { runPermutationTest } from '../src/evaluate/permutation.ts';
import type { EvaluationSettings, FeatureMatrix } from '../src/evaluate/index.ts';
import { createWorkPool } from '../src/run/worker-pool.ts';
import { pooledPermutationStage } from '../src/run/permutation-stage.ts';
import { createRng } from '../src/shared/random.ts';
import { FEATURE_NAMES } from '../src/features/index.ts';
import { argument } from './arguments.ts';


/** The seeded table: subjects alternate between groups; columns 0..3 shifted by 0.4 SD in group 1. */
export function workerBenchTable(subjects: number, seed = 6): FeatureMatrix {
  const rng = createRng(seed);
  const columns = [1, 2].flatMap((scale) => [3, 4].flatMap((order) => FEATURE_NAMES.map((feature) => ({ feature, order, delay: 1, scale }))));
  const labels = Uint8Array.from({ length: subjects }, (_, i) => i % 2);
  const values = new Float64Array(subjects * columns.length);
  for (let r = 0; r < subjects; r++) for (let c = 0; c < columns.length; c++) values[r * columns.length + c] = rng.normal() + (c < 4 && labels[r] ? 0.4 : 0);
  const ids = Array.from({ length: subjects }, (_, i) => `s${i}`);
  return { rowIds: ids, subjects: ids, labels, groupNames: ['a', 'b'], columns, values };
}

export interface WorkerFigures {
  oneThreadSeconds: number;
  pool1Seconds: number;
  pool2Seconds: number;
  /** pool1Seconds / pool2Seconds (target >= 1.7). */
  speedup: number;
  identical: boolean;
}

/** Runs the benchmark and prints its figures. */
export async function benchWorkers(B = argument('--permutations', 48), subjects = argument('--subjects', 80)): Promise<WorkerFigures> {
  console.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}; ${availableParallelism()} cores; ${subjects} subjects, ${B} permutations`);
  const matrix = workerBenchTable(subjects);
  const settings: EvaluationSettings = { folds: 5, repeats: 1, permutations: B, classifier: 'forest', trees: 50, l2: 1, stopEarly: false, seed: 3 };
  const study = prepareStudy(matrix, settings, classifierFor(settings));
  const observed = study.pipeline.statistics(study.subjects.labels);
  let t = performance.now();
  const alone = runPermutationTest(study.pipeline, observed, B, null);
  const oneThreadSeconds = (performance.now() - t) / 1000;
  const pooled = async (threads: number) => {
    const pool = createWorkPool(threads);
    try {
      await pooledPermutationStage(pool, matrix, { ...settings, permutations: threads })(study, observed, threads, null, () => undefined); // start and warm every thread
      t = performance.now();
      const run = await pooledPermutationStage(pool, matrix, settings)(study, observed, B, null, () => undefined);
      return { seconds: (performance.now() - t) / 1000, run };
    } finally {
      await pool.close();
    }
  };
  const p1 = await pooled(1);
  const p2 = await pooled(2);
  const same = (r: typeof alone) => JSON.stringify(r.nullStatistics.map((s) => Array.from(s))) === JSON.stringify(alone.nullStatistics.map((s) => Array.from(s)));
  const identical = same(p1.run) && same(p2.run);
  const speedup = p1.seconds / p2.seconds;
  console.log(`  this thread:        ${oneThreadSeconds.toFixed(2)} s`);
  console.log(`  pool of 1 worker:   ${p1.seconds.toFixed(2)} s`);
  console.log(`  pool of 2 workers:  ${p2.seconds.toFixed(2)} s — ${speedup.toFixed(2)}x over 1 worker (target >= 1.7x), ${(oneThreadSeconds / p2.seconds).toFixed(2)}x over this thread`);
  console.log(`  null distributions identical to one thread: ${identical ? 'yes' : 'NO'}`);
  return { oneThreadSeconds, pool1Seconds: p1.seconds, pool2Seconds: p2.seconds, speedup, identical };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchWorkers();
}

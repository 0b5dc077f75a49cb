/**
 * Benchmark of reruns (issue 6): a seeded cohort of 200 subjects (AR(1) series of 20,000
 * samples, text files), grid order 3,4,5 x delay 1,2 x scale 1,2,3 (18 cells). It times the
 * feature stage (read, features, cache) in one thread: cold with an empty cache, then a
 * rerun with one extra grid value (scale 4: 6 new cells per subject, the rest from the
 * cache), then an unchanged rerun (everything cached: files hashed, never parsed).
 *
 * Target: the rerun with one extra grid value takes under 15% of the cold feature stage.
 * Figures vary with the machine's load, printed first.
 *
 * Run: node --import tsx bench/rerun.ts [--subjects 200] [--samples 20000]
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { computeFeatureStage } from '../src/run/run-study.ts';
import { createRng } from '../src/shared/random.ts';
import type { Study } from '../src/study/index.ts';
import type { Grid } from '../src/features/index.ts';
import { argument } from './arguments.ts';

/**
 * Text of one recording: an AR(1) series x_t = phi x_{t-1} + e_t, standard normal e_t from
 * the seeded stream, four decimals per line.
 */
export function recordingText(n: number, seed: number, phi: number): string {
  const rng = createRng(seed);
  const lines = new Array<string>(n);
  let x = 0;
  for (let i = 0; i < n; i++) {
    x = phi * x + rng.normal();
    lines[i] = x.toFixed(4);
  }
  return lines.join('\n') + '\n';
}

/** Path of recording i of a cohort folder. */
export const recordingPath = (dir: string, i: number): string => join(dir, i % 2 === 0 ? 'a' : 'b', `s${String(i).padStart(5, '0')}.csv`);

/** Writes recording i of the cohort: group a (phi 0.3) for even i, b (phi 0.5) for odd i. */
export function writeRecording(dir: string, i: number, n: number, seed: number): void {
  const path = recordingPath(dir, i);
  mkdirSync(join(path, '..'), { recursive: true });
  writeFileSync(path, recordingText(n, seed + i, i % 2 === 0 ? 0.3 : 0.5));
}

/** A Study over `subjects` recordings in `dir` (written or not), built as loadStudy would. */
export function cohortStudy(dir: string, subjects: number, grid: Grid, seed = 1): Study {
  return {
    file: join(dir, 'study.yaml'),
    dir,
    text: `bench cohort ${subjects}\n`,
    overrides: [],
    name: 'bench-cohort',
    description: '',
    seed,
    groups: ['a', 'b'],
    recordings: Array.from({ length: subjects }, (_, i) => {
      const id = `s${String(i).padStart(5, '0')}`;
      return { id, subject: id, group: i % 2 === 0 ? 'a' : 'b', path: recordingPath(dir, i), relPath: recordingPath('.', i), covariates: {} };
    }),
    signal: { column: 1, start: 0, length: null },
    grid,
    features: {
      include: ['permutation_entropy', 'weighted_permutation_entropy', 'statistical_complexity', 'missing_patterns', 'transition_entropy', 'conditional_entropy', 'outdegree_mean', 'outdegree_variance', 'self_loop_fraction'],
      ties: 'appearance',
      jitterRepeats: 10,
      scaleForm: 'coarse',
      minWindowsPerPattern: 5,
    },
    evaluation: { folds: 5, repeats: 1, permutations: 0, classifier: 'forest', trees: 100, l2: 1, stopEarly: false },
    report: { pseudonyms: false },
    notes: [],
  };
}


export interface RerunFigures {
  coldSeconds: number;
  extraValueSeconds: number;
  unchangedSeconds: number;
  /** extraValueSeconds / coldSeconds (target < 0.15). */
  ratio: number;
  computedCold: number;
  computedRerun: number;
}

/** Runs the benchmark and prints its figures. */
export async function benchRerun(subjects = argument('--subjects', 200), samples = argument('--samples', 20000)): Promise<RerunFigures> {
  console.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}; ${subjects} subjects x ${samples} samples, one thread`);
  const dir = join(import.meta.dirname, '.out', 'rerun');
  rmSync(dir, { recursive: true, force: true });
  for (let i = 0; i < subjects; i++) writeRecording(dir, i, samples, 20261201);
  const cacheDir = join(dir, 'cache');
  const grid = { order: [3, 4, 5], delay: [1, 2], scale: [1, 2, 3] };
  const timed = async (study: Study) => {
    let computed = 0;
    const t = performance.now();
    await computeFeatureStage(study, undefined, { cacheDir, pool: null, onComputed: (_id, cells) => (computed += cells.length) });
    return { seconds: (performance.now() - t) / 1000, computed };
  };
  const cold = await timed(cohortStudy(dir, subjects, grid));
  const extra = await timed(cohortStudy(dir, subjects, { ...grid, scale: [1, 2, 3, 4] }));
  const unchanged = await timed(cohortStudy(dir, subjects, { ...grid, scale: [1, 2, 3, 4] }));
  const ratio = extra.seconds / cold.seconds;
  console.log(`  cold feature stage (18 cells):          ${cold.seconds.toFixed(2)} s, ${cold.computed} cells computed`);
  console.log(`  rerun with scale 4 added (24 cells):    ${extra.seconds.toFixed(2)} s, ${extra.computed} cells computed — ${(100 * ratio).toFixed(1)}% of cold (target < 15%)`);
  console.log(`  rerun unchanged (all cached):           ${unchanged.seconds.toFixed(2)} s, ${unchanged.computed} cells computed — ${((100 * unchanged.seconds) / cold.seconds).toFixed(1)}% of cold`);
  rmSync(dir, { recursive: true, force: true });
  return { coldSeconds: cold.seconds, extraValueSeconds: extra.seconds, unchangedSeconds: unchanged.seconds, ratio, computedCold: cold.computed, computedRerun: extra.computed };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchRerun();
}

/**
 * Benchmark of reruns (issue 6): a seeded cohort of 200 subjects (AR(1) series of 20,000
 * samples, text files) and two grids (see CHANGES). It times the feature stage (read,
 * features, cache) in one thread: cold with an empty cache, then a rerun with one extra grid
 * value (the new cells computed from the cached samples, the rest from the cache), then an
 * unchanged rerun (everything cached: files hashed, never parsed). It also prints the share
 * of the cold work that the new cells need, the floor any cache would meet.
 *
 * Target: the rerun with one extra grid value takes under 15% of the cold feature stage.
 * Figures vary with the machine's load, printed first; each is the best of --runs.
 *
 * Run: node --import tsx bench/rerun.ts [--subjects 200] [--samples 20000] [--runs 3]
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
  grid: string;
  coldSeconds: number;
  extraValueSeconds: number;
  unchangedSeconds: number;
  /** extraValueSeconds / coldSeconds (target < 0.15). */
  ratio: number;
  /** Share of the cold stage's samples x cells that the new cells need (the ratio a cache with no overhead would reach). */
  floor: number;
  computedCold: number;
  computedRerun: number;
}

/** A grid and the same grid with one more value of one parameter. */
interface GridChange {
  name: string;
  grid: Grid;
  widened: Grid;
}

/**
 * The grids timed: a small one (3 orders x 2 delays x 3 scales, adding scale 4) and a
 * multiscale one of the kind multiscale studies use (orders 3-6, delay 1, scales 1-10 in the
 * tradition of Costa et al. 2002, adding scale 11).
 */
const CHANGES: GridChange[] = [
  { name: 'orders 3-5 x delays 1,2 x scales 1-3, + scale 4', grid: { order: [3, 4, 5], delay: [1, 2], scale: [1, 2, 3] }, widened: { order: [3, 4, 5], delay: [1, 2], scale: [1, 2, 3, 4] } },
  {
    name: 'orders 3-6 x delay 1 x scales 1-10, + scale 11',
    grid: { order: [3, 4, 5, 6], delay: [1], scale: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] },
    widened: { order: [3, 4, 5, 6], delay: [1], scale: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11] },
  },
];

/** Coarse-grained samples x cells of a grid, per original sample (scale s keeps 1/s of the samples). */
const sampleCells = (g: Grid): number => g.order.length * g.delay.length * g.scale.reduce((sum, s) => sum + 1 / s, 0);

/**
 * Runs the benchmark and prints its figures: per grid, the best of `runs` timings of the cold
 * stage (empty cache), the rerun with the widened grid, and an unchanged rerun.
 */
export async function benchRerun(subjects = argument('--subjects', 200), samples = argument('--samples', 20000), runs = argument('--runs', 3)): Promise<RerunFigures[]> {
  console.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}; ${subjects} subjects x ${samples} samples, one thread, best of ${runs} runs`);
  const dir = join(import.meta.dirname, '.out', 'rerun');
  rmSync(dir, { recursive: true, force: true });
  for (let i = 0; i < subjects; i++) writeRecording(dir, i, samples, 20261201);
  const timed = async (study: Study, cacheDir: string) => {
    let computed = 0;
    const t = performance.now();
    await computeFeatureStage(study, undefined, { cacheDir, pool: null, onComputed: (_id, cells) => (computed += cells.length) });
    return { seconds: (performance.now() - t) / 1000, computed };
  };
  const figures: RerunFigures[] = [];
  for (const change of CHANGES) {
    const best = { cold: Infinity, extra: Infinity, unchanged: Infinity, computedCold: 0, computedRerun: 0 };
    for (let r = 0; r < runs; r++) {
      const cacheDir = join(dir, `cache-${figures.length}-${r}`);
      const cold = await timed(cohortStudy(dir, subjects, change.grid), cacheDir);
      const extra = await timed(cohortStudy(dir, subjects, change.widened), cacheDir);
      const unchanged = await timed(cohortStudy(dir, subjects, change.widened), cacheDir);
      rmSync(cacheDir, { recursive: true, force: true });
      best.cold = Math.min(best.cold, cold.seconds);
      best.extra = Math.min(best.extra, extra.seconds);
      best.unchanged = Math.min(best.unchanged, unchanged.seconds);
      best.computedCold = cold.computed;
      best.computedRerun = extra.computed;
    }
    const ratio = best.extra / best.cold;
    const floor = (sampleCells(change.widened) - sampleCells(change.grid)) / sampleCells(change.grid);
    console.log(`  ${change.name}`);
    console.log(`    cold feature stage:              ${best.cold.toFixed(2)} s, ${best.computedCold} cells computed`);
    console.log(`    rerun with the extra value:      ${best.extra.toFixed(2)} s, ${best.computedRerun} cells computed — ${(100 * ratio).toFixed(1)}% of cold (target < 15%; the new cells are ${(100 * floor).toFixed(1)}% of the cold samples x cells)`);
    console.log(`    rerun unchanged (all cached):    ${best.unchanged.toFixed(2)} s — ${((100 * best.unchanged) / best.cold).toFixed(1)}% of cold`);
    figures.push({ grid: change.name, coldSeconds: best.cold, extraValueSeconds: best.extra, unchangedSeconds: best.unchanged, ratio, floor, computedCold: best.computedCold, computedRerun: best.computedRerun });
  }
  rmSync(dir, { recursive: true, force: true });
  return figures;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchRerun();
}

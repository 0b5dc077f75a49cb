/**
 * Peak memory of the feature stage on a large synthetic cohort (issue 6): S subjects x n
 * samples, generated on the fly as text recordings. The files are written a few ahead of the
 * work (the pool hands out recordings in study order, at most two per thread in flight) and
 * each is deleted as soon as its features are in, so the disk holds at most 2·jobs + 1 files
 * whatever S. No cache (every recording is read and reduced), grid order 3,4,5 x delay 1 x
 * scale 1,2 (6 cells). Prints the peak resident memory of the whole process, worker threads
 * included (process.resourceUsage().maxRSS), at every tenth of the cohort.
 *
 * Target: under 1.5 GB for 2,000 x 10^6, the default. That takes 2,000 x (generate + write +
 * read + count 10^6 samples): 25-30 minutes on 2 cores; --subjects 100 gives a first look in
 * two (the peak is reached within the first few hundred recordings). --jobs 1 works in this
 * thread (no pool).
 *
 * Run: node --import tsx bench/memory.ts [--subjects 2000] [--samples 1000000] [--jobs 2]
 */
import { rmSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { computeFeatureStage } from '../src/run/run-study.ts';
import { createWorkPool } from '../src/run/worker-pool.ts';
import { cohortStudy, recordingPath, writeRecording } from './rerun.ts';
import { argument } from './arguments.ts';

export interface MemoryFigures {
  subjects: number;
  samples: number;
  jobs: number;
  peakRssMB: number;
  seconds: number;
}

const peakRssMB = () => process.resourceUsage().maxRSS / 1024;

/** Runs the benchmark and prints its figures. */
export async function benchMemory(
  subjects = argument('--subjects', 2000),
  samples = argument('--samples', 1_000_000),
  jobs = argument('--jobs', availableParallelism()),
): Promise<MemoryFigures> {
  console.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}; ${subjects} subjects x ${samples} samples, generated on the fly, ${jobs} thread(s), no cache`);
  const dir = join(import.meta.dirname, '.out', 'memory');
  rmSync(dir, { recursive: true, force: true });
  const seed = 777;
  const study = cohortStudy(dir, subjects, { order: [3, 4, 5], delay: [1], scale: [1, 2] });
  const indexOf = new Map(study.recordings.map((r, i) => [r.id, i]));
  // in flight at most 2 per thread; one more so a thread never waits for its file
  const ahead = jobs === 1 ? 1 : 2 * jobs + 1;
  let written = 0;
  const writeUpTo = (count: number) => {
    for (; written < Math.min(subjects, count); written++) writeRecording(dir, written, samples, seed);
  };
  writeUpTo(ahead);
  const pool = jobs === 1 ? null : createWorkPool(jobs);
  const before = peakRssMB();
  let done = 0;
  const t = performance.now();
  try {
    const stage = await computeFeatureStage(study, undefined, {
      cacheDir: null,
      pool,
      onComputed: (id) => {
        rmSync(recordingPath(dir, indexOf.get(id)!), { force: true });
        done++;
        writeUpTo(done + ahead);
        if (done % Math.max(1, Math.floor(subjects / 10)) === 0) console.log(`  ${done}/${subjects}: peak RSS ${peakRssMB().toFixed(0)} MB, ${((performance.now() - t) / 1000).toFixed(0)} s`);
      },
    });
    const seconds = (performance.now() - t) / 1000;
    const peak = peakRssMB();
    console.log(
      `  ${stage.rows.length} feature rows in ${seconds.toFixed(0)} s; peak RSS ${peak.toFixed(0)} MB (${before.toFixed(0)} MB before the stage, pool started); ` +
        `one recording = ${((samples * 8) / 1e6).toFixed(0)} MB as Float64; target < 1500 MB for 2,000 x 10^6`,
    );
    return { subjects, samples, jobs, peakRssMB: peak, seconds };
  } finally {
    await pool?.close();
    rmSync(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchMemory();
}

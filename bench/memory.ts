/**
 * Peak memory of the feature stage on a large synthetic cohort (issue 6): S subjects x n
 * samples, generated on the fly: recording i+1 is written when recording i has been counted
 * and recording i is deleted then, so the disk holds at most two files whatever S. One
 * thread, no cache (every recording is read and reduced), grid order 3,4,5 x delay 1 x
 * scale 1,2 (6 cells). Prints the peak resident memory (process.resourceUsage().maxRSS) and
 * the size of one recording's samples as Float64.
 *
 * Target: under 1.5 GB for 2,000 x 10^6. The full size takes about 2,000 x (write + read +
 * count of 10^6 samples), half an hour or more, so the default is --subjects 100; pass
 * --subjects 2000 for the full figure.
 *
 * Run: node --import tsx bench/memory.ts [--subjects 100] [--samples 1000000]
 */
import { rmSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { computeFeatureStage } from '../src/run/run-study.ts';
import { cohortStudy, recordingPath, writeRecording } from './rerun.ts';
import { argument } from './arguments.ts';


export interface MemoryFigures {
  subjects: number;
  samples: number;
  peakRssMB: number;
  seconds: number;
}

const peakRssMB = () => process.resourceUsage().maxRSS / 1024;

/** Runs the benchmark and prints its figures. */
export async function benchMemory(subjects = argument('--subjects', 100), samples = argument('--samples', 1_000_000)): Promise<MemoryFigures> {
  console.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}; ${subjects} subjects x ${samples} samples, generated on the fly, one thread, no cache`);
  const dir = join(import.meta.dirname, '.out', 'memory');
  rmSync(dir, { recursive: true, force: true });
  const seed = 777;
  const study = cohortStudy(dir, subjects, { order: [3, 4, 5], delay: [1], scale: [1, 2] });
  const before = peakRssMB();
  writeRecording(dir, 0, samples, seed);
  const t = performance.now();
  const stage = await computeFeatureStage(
    study,
    (_stage, done) => {
      rmSync(recordingPath(dir, done - 1), { force: true });
      if (done < subjects) writeRecording(dir, done, samples, seed);
      if (done % Math.max(1, Math.floor(subjects / 10)) === 0) console.log(`  ${done}/${subjects}: peak RSS ${peakRssMB().toFixed(0)} MB`);
    },
    { cacheDir: null, pool: null },
  );
  const seconds = (performance.now() - t) / 1000;
  const peak = peakRssMB();
  rmSync(dir, { recursive: true, force: true });
  console.log(`  ${stage.rows.length} feature rows in ${seconds.toFixed(0)} s; peak RSS ${peak.toFixed(0)} MB (${before.toFixed(0)} MB before the stage); one recording = ${((samples * 8) / 1e6).toFixed(0)} MB as Float64; target < 1500 MB for 2,000 x 10^6`);
  return { subjects, samples, peakRssMB: peak, seconds };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchMemory();
}

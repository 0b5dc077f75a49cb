/**
 * Benchmark of the feature engine (issue 3): a seeded series of 10^7 uniform samples, one
 * thread. For orders 3..7 at delay 1 it prints samples per second for pattern counting
 * (countOrdinalPatterns) and for the full feature set of one cell (computeGridFeatures: nine
 * features, quality, transitions), each as the best of several runs, and the time ratio to a
 * plain summation loop over the same array (the memory-speed floor). Then the one-pass grid
 * of orders 3..7 together, one cell at delay 2 (whose order-7 transitions are collected and
 * sorted), and the peak resident memory (process.resourceUsage().maxRSS) after each stage,
 * against the issue's budget of 3 x the series' Float64 size + 150 MB.
 *
 * Targets: >= 100 M samples/s per core for counting at every m up to 7. Figures vary with
 * the machine's load, printed first.
 *
 * Run: node --import tsx bench/features.ts [--samples 10000000] [--runs 5]
 */
import { loadavg } from 'node:os';
import { computeGridFeatures } from '../src/features/grid-features.ts';
import { countOrdinalPatterns } from '../src/features/count-patterns.ts';
import type { FeatureOptions, Grid } from '../src/features/types.ts';
import { createRng } from '../src/shared/random.ts';
import { argument } from './arguments.ts';
import { bestSeconds } from './best-seconds.ts';

export interface FeatureBenchRow {
  task: string;
  samplesPerSecond: number;
  /** Time of the task / time of the summation loop over the same array. */
  ratioToSum: number;
  peakRssMB: number;
}

const OPTIONS: FeatureOptions = { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5 };



/** Plain summation loop: the floor any one-pass kernel over the array must pay. */
function plainSum(x: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < x.length; i++) sum += x[i];
  return sum;
}

function peakRssMB(): number {
  return process.resourceUsage().maxRSS / 1024; // maxRSS is in kilobytes
}

export async function benchFeatures(options: { samples?: number; runs?: number } = {}): Promise<FeatureBenchRow[]> {
  const n = options.samples ?? argument('--samples', 1e7);
  const runs = options.runs ?? argument('--runs', 5);
  const rng = createRng(20020429);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = rng.next();
  const seriesMB = (n * 8) / 2 ** 20;
  console.log(`feature engine benchmark: ${n} samples (${seriesMB.toFixed(0)} MiB), best of ${runs} runs, Node ${process.version}, load average ${loadavg()[0].toFixed(2)}`);

  let checksum = 0;
  const sumSeconds = bestSeconds(runs * 2, () => (checksum += plainSum(x)));
  console.log(`  plain summation loop               ${(n / sumSeconds / 1e6).toFixed(0).padStart(6)} M samples/s   (floor)`);
  const rows: FeatureBenchRow[] = [];
  const report = (task: string, seconds: number): void => {
    const row = { task, samplesPerSecond: n / seconds, ratioToSum: seconds / sumSeconds, peakRssMB: peakRssMB() };
    rows.push(row);
    console.log(
      `  ${task.padEnd(34)} ${(row.samplesPerSecond / 1e6).toFixed(1).padStart(6)} M samples/s   ${row.ratioToSum.toFixed(1).padStart(5)} x the summation time   peak RSS ${row.peakRssMB.toFixed(0)} MB`,
    );
  };

  for (let m = 3; m <= 7; m++) {
    countOrdinalPatterns(x.subarray(0, 1e5), m, 1); // let the JIT compile the kernel first
    report(`count patterns, m = ${m}`, bestSeconds(runs, () => (checksum += countOrdinalPatterns(x, m, 1).validWindows)));
  }
  const cell = (m: number, delay = 1): Grid => ({ order: [m], delay: [delay], scale: [1] });
  for (let m = 3; m <= 7; m++) {
    report(`full feature set, m = ${m}`, bestSeconds(Math.min(runs, 3), () => computeGridFeatures(x, cell(m), OPTIONS)));
  }
  report('full set, m = 3..7 in one pass', bestSeconds(Math.min(runs, 3), () => computeGridFeatures(x, { order: [3, 4, 5, 6, 7], delay: [1], scale: [1] }, OPTIONS)));
  report('full feature set, m = 7, delay 2', bestSeconds(1, () => computeGridFeatures(x, cell(7, 2), OPTIONS)));
  const budget = 3 * seriesMB + 150;
  console.log(`  peak RSS ${peakRssMB().toFixed(0)} MB; budget 3 x ${seriesMB.toFixed(0)} MiB + 150 MB = ${budget.toFixed(0)} MB (includes Node's own ~50 MB)`);
  if (checksum === 42) console.log(''); // keeps the timed results alive
  return rows;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchFeatures();
}

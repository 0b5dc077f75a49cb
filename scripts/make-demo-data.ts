/**
 * Writes the demo study's recordings into demo-data/: invented stride-to-stride interval
 * series of two invented groups of runners, "fresh" and "fatigued". Nothing here comes from
 * a real person. Seeded: the same seed writes the same bytes.
 *
 * Scenario (our own): each runner's stride interval (seconds) fluctuates around a personal
 * mean. Fresh runners' fluctuations are a sum of three AR(1) processes with slow, medium and
 * fast memory (a common way to mimic long-range correlated gait variability, cf. Hausdorff et
 * al. 1995, J. Appl. Physiol. 78, 349). Fatigued runners' series mix the same kind of noise
 * with a deterministic component — a left/right alternation and a slow drift of stride
 * length — whose strength varies between runners, so the groups overlap but the fatigued
 * series carry more ordinal structure (lower permutation entropy on average).
 *
 * Special recordings, so that `patternfold check` has something to say:
 * - fresh/runner-07: 14 missing strides (empty cells), e.g. a sensor drop-out;
 * - fresh/runner-13: a short recording (90 strides);
 * - fatigued/runner-25: coarsely quantised to 10 ms (ties);
 * - fatigued/runner-31: stored gzip-compressed.
 *
 * Usage: node --import tsx scripts/make-demo-data.ts [--seed N] [--out DIR]
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { parseArgs } from 'node:util';
import { createRng, deriveSeed, type Rng } from '../src/shared/random.ts';

const SUBJECTS_PER_GROUP = 20;
const STRIDES = 1300;

function arProcess(rng: Rng, n: number, phi: number, sd: number): Float64Array {
  const out = new Float64Array(n);
  let v = (rng.normal() * sd) / Math.sqrt(1 - phi * phi);
  for (let i = 0; i < n; i++) {
    v = phi * v + sd * rng.normal();
    out[i] = v;
  }
  return out;
}

/** Interval series (seconds) of one runner. */
function runnerSeries(rng: Rng, fatigued: boolean, n: number): Float64Array {
  const mean = 0.68 + 0.06 * rng.next();
  const slow = arProcess(rng, n, 0.98, 0.002);
  const medium = arProcess(rng, n, 0.8, 0.004);
  const fast = arProcess(rng, n, 0.2, 0.008);
  const alternation = fatigued ? 0.002 + 0.01 * rng.next() : 0;
  const drift = fatigued ? 0.00002 * rng.next() : 0;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    out[i] = mean + slow[i] + medium[i] + fast[i] + (i % 2 === 0 ? alternation : -alternation) + drift * i;
  }
  return out;
}

function csvText(values: Float64Array, seed: number, decimals: number): string {
  const lines = [`# synthetic demo data written by scripts/make-demo-data.ts (seed ${seed}); not a real person's data`, 'stride,time_s,interval_s'];
  let time = 0;
  values.forEach((v, i) => {
    if (!Number.isNaN(v)) time += v;
    lines.push(`${i + 1},${Number.isNaN(v) ? '' : time.toFixed(3)},${Number.isNaN(v) ? '' : v.toFixed(decimals)}`);
  });
  return lines.join('\n') + '\n';
}

export function writeDemoData(outDir: string, seed: number): string[] {
  rmSync(outDir, { recursive: true, force: true });
  const written: string[] = [];
  let runner = 0;
  for (const group of ['fresh', 'fatigued'] as const) {
    mkdirSync(join(outDir, group), { recursive: true });
    for (let k = 0; k < SUBJECTS_PER_GROUP; k++) {
      runner++;
      const id = `runner-${String(runner).padStart(2, '0')}`;
      const rng = createRng(deriveSeed(seed, 'demo', id));
      const length = id === 'runner-13' ? 90 : STRIDES;
      const series = runnerSeries(rng, group === 'fatigued', length);
      if (id === 'runner-07') for (let i = 200; i < 214; i++) series[i] = Number.NaN;
      const decimals = id === 'runner-25' ? 2 : 4;
      const text = csvText(series, seed, decimals);
      const file = id === 'runner-31' ? `${id}.csv.gz` : `${id}.csv`;
      const path = join(outDir, group, file);
      writeFileSync(path, file.endsWith('.gz') ? gzipSync(Buffer.from(text), { level: 9 }) : text);
      written.push(path);
    }
  }
  writeFileSync(
    join(outDir, 'README.md'),
    `# Demo data (synthetic)\n\nInvented stride-interval series of two invented groups of runners, written by\n\`scripts/make-demo-data.ts\` with seed ${seed}. No real person's data. Regenerate with\n\`node --import tsx scripts/make-demo-data.ts\`.\n`,
  );
  return written;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { values } = parseArgs({ options: { seed: { type: 'string', default: '20261201' }, out: { type: 'string', default: 'demo-data' } } });
  const files = writeDemoData(values.out!, Number(values.seed));
  console.log(`wrote ${files.length} synthetic recordings to ${values.out}/`);
}

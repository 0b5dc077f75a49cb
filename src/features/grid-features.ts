import { InputError } from '../shared/errors.ts';
import { createRng, deriveSeed } from '../shared/random.ts';
import { averageEstimates } from './average-estimates.ts';
import { coarseGrain } from './coarse-grain.ts';
import { dataResolution } from './data-resolution.ts';
import { factorial } from './factorial.ts';
import { jitterBelowResolution } from './jitter.ts';
import { scanOrdinalPatterns, type OrdinalScan } from './ordinal-scan.ts';
import { featuresFromScan, type FeatureEstimate } from './scan-features.ts';
import type { CellFeatures, CellQuality, FeatureOptions, Grid } from './types.ts';
import { safeRange } from './safe-range.ts';

/** What one coarse-graining (one offset) contributes to a cell. */
interface OffsetResult {
  estimate: FeatureEstimate;
  validWindows: number;
  tiedWindows: number;
  samples: number;
  missingSamples: number;
}

/**
 * Every feature of shared/DESIGN.md at every cell of the grid, for one recording x (missing
 * samples as NaN). Results come one per (scale, delay, order), scale-major, then delay, then
 * order, each list sorted ascending and deduplicated.
 *
 * Per scale s, x is coarse-grained (Costa, Goldberger & Peng 2002, Phys. Rev. Lett. 89,
 * 068102); under options.scaleForm = 'composite' each feature is the mean over the s shifted
 * coarse-grainings (Wu et al. 2013, Entropy 15, 1069). Per (scale, offset, delay) one pass
 * ({@link scanOrdinalPatterns}) feeds every order. Ties (options.ties): 'appearance' ranks
 * the earlier sample lower; 'symbols' keeps tied values as symbols of their own (Bian et al.
 * 2012, Phys. Rev. E 85, 061902), normalising by the ordered Bell number of symbols instead
 * of m!; 'jitter' adds seeded noise below the data's resolution and averages the features
 * over options.jitterRepeats draws, the stream of draw r at (scale, offset) seeded with
 * deriveSeed(options.seed, 'jitter', scale, offset, r), so a cell does not depend on the
 * rest of the grid.
 *
 * Quality, per cell: validWindows (the smallest over the offsets under the composite form),
 * windowsPerPattern = validWindows / m!, tiedShare = share of valid windows holding a tie in
 * the series before any jitter, missingShare = share of NaN in the coarse-grained series
 * (both pooled over offsets; NaN when there is no window or no sample), and flagged when
 * validWindows < minWindowsPerPattern · m!.
 *
 * Cost: O(n · (m_max + orders)) per (scale, offset, delay, jitter draw). Missing values: a
 * feature that cannot be computed is null with its reason in `reasons`; an empty x gives
 * every cell with every feature null. Throws an {@link InputError} for a grid or options
 * outside their ranges (orders 2..9, delays and scales integers >= 1).
 *
 * @example computeGridFeatures(Float64Array.of(4, 7, 9, 10, 6, 11, 3), { order: [3], delay: [1], scale: [1] },
 *   { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5 })[0]
 *   .values.permutation_entropy // 0.588762155916294
 */
export function computeGridFeatures(recording: Float64Array, grid: Grid, options: FeatureOptions): CellFeatures[] {
  const x = safeRange(recording);
  const orders = checkedAxis(grid.order, 'grid.order', 2, 9);
  const delays = checkedAxis(grid.delay, 'grid.delay', 1, Infinity);
  const scales = checkedAxis(grid.scale, 'grid.scale', 1, Infinity);
  checkOptions(options);
  const cells: CellFeatures[] = [];
  for (const scale of scales) {
    // a scale beyond the recording leaves every offset empty: one offset says so
    const offsetCount = options.scaleForm === 'composite' && scale <= x.length ? scale : 1;
    const offsets = Array.from({ length: offsetCount }, (_, i) => i);
    // results[delayIndex][orderIndex][offsetIndex]
    const results = delays.map(() => orders.map((): OffsetResult[] => []));
    for (const offset of offsets) {
      const y = scale === 1 && offset === 0 ? x : coarseGrain(x, scale, offset);
      const missingSamples = countMissing(y);
      const estimates = estimatesAtOffset(y, scale, offset, delays, orders, options);
      delays.forEach((_, d) =>
        orders.forEach((_, o) => {
          const { estimate, base } = estimates[d][o];
          results[d][o].push({ estimate, validWindows: base.validWindows, tiedWindows: base.tiedWindows, samples: y.length, missingSamples });
        }),
      );
    }
    delays.forEach((delay, d) =>
      orders.forEach((order, o) => cells.push(assembleCell(order, delay, scale, results[d][o], options))),
    );
  }
  return cells;
}

/** Estimates of one coarse-grained series for every (delay, order), with the un-jittered scans. */
function estimatesAtOffset(
  y: Float64Array,
  scale: number,
  offset: number,
  delays: number[],
  orders: number[],
  options: FeatureOptions,
): { estimate: FeatureEstimate; base: OrdinalScan }[][] {
  const symbols = options.ties === 'symbols' ? 'symbols' : 'appearance';
  const base = delays.map((delay) => scanOrdinalPatterns(y, delay, orders, symbols));
  if (options.ties !== 'jitter') {
    return base.map((scans) => scans.map((scan) => ({ estimate: featuresFromScan(scan), base: scan })));
  }
  const draws = delays.map(() => orders.map((): FeatureEstimate[] => []));
  const labels: string[] = [];
  const resolution = dataResolution(y);
  for (let r = 0; r < options.jitterRepeats; r++) {
    const jittered = jitterBelowResolution(y, createRng(deriveSeed(options.seed, 'jitter', scale, offset, r)), resolution);
    labels.push(`jitter draw ${r + 1}`);
    delays.forEach((delay, d) =>
      scanOrdinalPatterns(jittered, delay, orders).forEach((scan, o) => draws[d][o].push(featuresFromScan(scan))),
    );
  }
  return base.map((scans, d) => scans.map((scan, o) => ({ estimate: averageEstimates(draws[d][o], labels), base: scan })));
}

function assembleCell(order: number, delay: number, scale: number, parts: OffsetResult[], options: FeatureOptions): CellFeatures {
  const { values, reasons } = averageEstimates(
    parts.map((p) => p.estimate),
    parts.map((_, i) => `offset ${i} of the composite scale ${scale}`),
  );
  const validWindows = Math.min(...parts.map((p) => p.validWindows));
  const valid = parts.reduce((a, p) => a + p.validWindows, 0);
  const tied = parts.reduce((a, p) => a + p.tiedWindows, 0);
  const samples = parts.reduce((a, p) => a + p.samples, 0);
  const missing = parts.reduce((a, p) => a + p.missingSamples, 0);
  const quality: CellQuality = {
    validWindows,
    windowsPerPattern: validWindows / factorial(order),
    tiedShare: valid > 0 ? tied / valid : NaN,
    missingShare: samples > 0 ? missing / samples : NaN,
    flagged: validWindows < options.minWindowsPerPattern * factorial(order),
  };
  return { order, delay, scale, values: { ...values }, reasons: { ...reasons }, quality };
}

function countMissing(y: Float64Array): number {
  let missing = 0;
  for (let i = 0; i < y.length; i++) if (y[i] !== y[i]) missing++;
  return missing;
}

/** Sorted distinct values of one grid axis, after checking each is an integer in [low, high]. */
function checkedAxis(values: readonly number[], key: string, low: number, high: number): number[] {
  if (!Array.isArray(values) || values.length === 0) {
    throw new InputError(`${key}: needs at least one value — list one or more integers, e.g. [${low}]`);
  }
  for (const v of values) {
    if (!Number.isInteger(v) || v < low || v > high) {
      const range = Number.isFinite(high) ? `from ${low} to ${high}` : `>= ${low}`;
      throw new InputError(`${key}: ${JSON.stringify(v)} is not an integer ${range} — use integers ${range}`);
    }
  }
  return [...new Set(values)].sort((a, b) => a - b);
}

function checkOptions(options: FeatureOptions): void {
  if (!['appearance', 'jitter', 'symbols'].includes(options.ties)) {
    throw new InputError(`ties: ${JSON.stringify(options.ties)} is not a tie rule — use appearance, jitter or symbols`);
  }
  if (!['coarse', 'composite'].includes(options.scaleForm)) {
    throw new InputError(`scaleForm: ${JSON.stringify(options.scaleForm)} is not a scale form — use coarse or composite`);
  }
  if (options.ties === 'jitter' && (!Number.isInteger(options.jitterRepeats) || options.jitterRepeats < 1)) {
    throw new InputError(`jitterRepeats: ${JSON.stringify(options.jitterRepeats)} is not an integer >= 1 — use e.g. 10`);
  }
  if (!(options.minWindowsPerPattern >= 0)) {
    throw new InputError(`minWindowsPerPattern: ${JSON.stringify(options.minWindowsPerPattern)} must be a number >= 0 — common practice is 5`);
  }
  if (!Number.isFinite(options.seed)) {
    throw new InputError(`seed: ${JSON.stringify(options.seed)} is not a finite number — use an integer such as 1`);
  }
}

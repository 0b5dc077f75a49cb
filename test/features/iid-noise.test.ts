// i.i.d. continuous noise: closed forms derived in shared/REFERENCES.md [D] (all m! patterns
// equally likely; from each pattern, delay 1, m successors, one with probability 2/(m+1) and
// m-1 with 1/(m+1)). Checked on a seeded series of 10^6 uniform values; tolerances are
// stated beside each check (about 5 standard errors of the estimate, or the stated bias).
import { describe, expect, it } from 'vitest';
import { computeGridFeatures, factorial, type CellFeatures, type FeatureOptions } from '../../src/features/index.ts';
import { createRng } from '../../src/shared/random.ts';

const n = 1_000_000;
const x = new Float64Array(n);
const rng = createRng(1948);
for (let i = 0; i < n; i++) x[i] = rng.next();
const options: FeatureOptions = { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5 };
const cells = computeGridFeatures(x, { order: [3, 4], delay: [1, 2], scale: [1] }, options);
const cell = (order: number, delay: number): CellFeatures => cells.find((c) => c.order === order && c.delay === delay) as CellFeatures;
const value = (c: CellFeatures, name: keyof CellFeatures['values']): number => c.values[name] as number;

describe('i.i.d. uniform noise, delay 1 [D]', () => {
  it.each([3, 4])('order %i: permutation entropy 1 and complexity 0 within 1e-4', (m) => {
    // bias of the plug-in entropy is about (m! - 1) / (2 N ln m!) < 1e-4 for N = 10^6
    expect(1 - value(cell(m, 1), 'permutation_entropy')).toBeLessThan(1e-4);
    expect(value(cell(m, 1), 'statistical_complexity')).toBeLessThan(1e-4);
    expect(value(cell(m, 1), 'missing_patterns')).toBe(0);
  });

  it.each([3, 4])('order %i: every node has outdegree m (mean m, variance 0), exactly', (m) => {
    expect(value(cell(m, 1), 'outdegree_mean')).toBe(m);
    expect(value(cell(m, 1), 'outdegree_variance')).toBe(0);
  });

  it.each([
    [3, 1.039721],
    [4, 1.332179],
  ])('order %i: conditional entropy ln(m+1) - 2 ln 2/(m+1) = %f, within 5e-3', (m, expected) => {
    expect(Math.log(m + 1) - (2 * Math.log(2)) / (m + 1)).toBeCloseTo(expected, 6);
    expect(Math.abs(value(cell(m, 1), 'conditional_entropy') - expected)).toBeLessThan(5e-3);
  });

  it.each([3, 4])('order %i: transition entropy ln((m+1)!) - 2 ln 2/(m+1), within 5e-3', (m) => {
    const expected = Math.log(factorial(m + 1)) - (2 * Math.log(2)) / (m + 1);
    expect(Math.abs(value(cell(m, 1), 'transition_entropy') - expected)).toBeLessThan(5e-3);
  });

  it.each([
    [3, 1 / 12],
    [4, 1 / 60],
  ])('order %i: self-loop fraction 2/(m+1)! = %f, within 5 standard errors', (m, p) => {
    const standardError = Math.sqrt((p * (1 - p)) / n);
    expect(Math.abs(value(cell(m, 1), 'self_loop_fraction') - p)).toBeLessThan(5 * standardError);
  });
});

describe('i.i.d. uniform noise, delay 2 [D]', () => {
  it.each([3, 4])('order %i: consecutive windows share no sample, so conditional entropy = ln(m!) within 2e-2', (m) => {
    // plug-in bias of a conditional entropy over m!·m! cells: about (m!-1)·m!/(2N) = 0.013 for m = 4
    expect(Math.abs(value(cell(m, 2), 'conditional_entropy') - Math.log(factorial(m)))).toBeLessThan(2e-2);
  });
});

describe('quality of continuous noise', () => {
  it('no ties, nothing missing, not flagged', () => {
    for (const c of cells) {
      expect(c.quality.tiedShare).toBe(0);
      expect(c.quality.missingShare).toBe(0);
      expect(c.quality.flagged).toBe(false);
      expect(c.quality.validWindows).toBe(n - (c.order - 1) * c.delay);
    }
  });
});

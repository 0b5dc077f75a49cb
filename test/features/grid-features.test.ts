// computeGridFeatures: layout of the results, missing values with reasons, quality flags,
// the scale forms (Costa, Goldberger & Peng 2002; Wu et al. 2013), the tie rules and option
// checks. Expected values come from the definitions in shared/DESIGN.md, computed here by
// other routes (per-offset coarse-graining by hand, closed forms for monotone series).
import { describe, expect, it } from 'vitest';
import {
  coarseGrain,
  computeGridFeatures,
  featuresFromScan,
  FEATURE_NAMES,
  scanOrdinalPatterns,
  type FeatureOptions,
} from '../../src/features/index.ts';
import { InputError } from '../../src/shared/errors.ts';
import { createRng } from '../../src/shared/random.ts';

const base: FeatureOptions = { ties: 'appearance', jitterRepeats: 4, scaleForm: 'coarse', seed: 11, minWindowsPerPattern: 5 };
function noise(n: number, seed: number, round = false): Float64Array {
  const rng = createRng(seed);
  return Float64Array.from({ length: n }, () => (round ? Math.round(rng.normal() * 2) : rng.normal()));
}

describe('layout', () => {
  it('one cell per (scale, delay, order): scale-major, then delay, then order, sorted and deduplicated', () => {
    const cells = computeGridFeatures(noise(500, 1), { order: [4, 3, 3], delay: [2, 1], scale: [2, 1] }, base);
    expect(cells.map((c) => [c.scale, c.delay, c.order])).toEqual([
      [1, 1, 3], [1, 1, 4], [1, 2, 3], [1, 2, 4],
      [2, 1, 3], [2, 1, 4], [2, 2, 3], [2, 2, 4],
    ]);
    for (const c of cells) expect(Object.keys(c.values)).toEqual([...FEATURE_NAMES]);
  });
});

describe('monotone series [D]', () => {
  it('rising: permutation entropy 0, complexity 0, all but one pattern missing, every transition a self-loop', () => {
    const x = Float64Array.from({ length: 200 }, (_, i) => i * 0.5);
    for (const c of computeGridFeatures(x, { order: [2, 3, 5], delay: [1, 3], scale: [1, 2] }, base)) {
      expect(c.values.permutation_entropy).toBe(0);
      expect(c.values.weighted_permutation_entropy).toBe(0);
      expect(c.values.statistical_complexity).toBe(0);
      expect(c.values.missing_patterns).toBeCloseTo(1 - 1 / [1, 1, 2, 6, 24, 120][c.order], 15);
      expect(c.values.transition_entropy).toBe(0);
      expect(c.values.conditional_entropy).toBe(0);
      expect(c.values.self_loop_fraction).toBe(1);
      expect(c.values.outdegree_mean).toBe(1);
    }
  });
});

describe('missing values carry reasons, never 0', () => {
  it('too short a series: every feature null with a reason; quality says 0 windows, flagged', () => {
    const [cell] = computeGridFeatures(Float64Array.of(1, 2, 3), { order: [4], delay: [1], scale: [1] }, base);
    for (const name of FEATURE_NAMES) {
      expect(cell.values[name]).toBeNull();
      expect(cell.reasons[name]).toMatch(/no valid window|no two consecutive valid windows/);
    }
    expect(cell.quality.validWindows).toBe(0);
    expect(cell.quality.flagged).toBe(true);
    expect(cell.quality.tiedShare).toBeNaN();
  });

  it('empty recording: every cell, every feature null', () => {
    const cells = computeGridFeatures(new Float64Array(0), { order: [3], delay: [1], scale: [1, 2] }, { ...base, scaleForm: 'composite' });
    expect(cells).toHaveLength(2);
    for (const c of cells) for (const name of FEATURE_NAMES) expect(c.values[name]).toBeNull();
  });

  it('constant stretches: weighted entropy null ("zero variance"), the others computed', () => {
    const [cell] = computeGridFeatures(Float64Array.of(5, 5, 5, 5, 5, 5), { order: [3], delay: [1], scale: [1] }, base);
    expect(cell.values.weighted_permutation_entropy).toBeNull();
    expect(cell.reasons.weighted_permutation_entropy).toMatch(/zero variance/);
    expect(cell.values.permutation_entropy).toBe(0);
    expect(cell.quality.tiedShare).toBe(1);
  });

  it('NaN windows are skipped; isolated valid windows give no transition', () => {
    const x = Float64Array.of(1, 3, 2, NaN, 4, 6, 5, NaN, 9, 7, 8);
    const [cell] = computeGridFeatures(x, { order: [3], delay: [1], scale: [1] }, base);
    expect(cell.quality.validWindows).toBe(3);
    expect(cell.quality.missingShare).toBeCloseTo(2 / 11, 15);
    expect(cell.values.transition_entropy).toBeNull();
    expect(cell.reasons.transition_entropy).toMatch(/no two consecutive valid windows/);
    expect(cell.values.permutation_entropy).not.toBeNull();
  });
});

describe('quality', () => {
  it('flagged exactly when validWindows < minWindowsPerPattern · m! (common practice: 5)', () => {
    // order 3: 5 · 3! = 30 windows needed; 31 samples give 29 windows, 32 give 30
    const flagged = (n: number): boolean =>
      computeGridFeatures(noise(n, 2), { order: [3], delay: [1], scale: [1] }, base)[0].quality.flagged;
    expect(flagged(31)).toBe(true);
    expect(flagged(32)).toBe(false);
  });

  it('tiedShare counts valid windows holding an equal pair (checked against a direct count)', () => {
    const x = noise(400, 3, true);
    const [cell] = computeGridFeatures(x, { order: [4], delay: [2], scale: [1] }, base);
    let tied = 0;
    let valid = 0;
    for (let t = 0; t + 6 < x.length; t++) {
      const w = [x[t], x[t + 2], x[t + 4], x[t + 6]];
      valid++;
      if (new Set(w).size < 4) tied++;
    }
    expect(cell.quality.tiedShare).toBe(tied / valid);
    expect(cell.quality.windowsPerPattern).toBe(valid / 24);
  });
});

describe('scale forms', () => {
  it('coarse: the features of coarseGrain(x, s) at scale 1', () => {
    const x = noise(900, 4);
    const [atScale3] = computeGridFeatures(x, { order: [3], delay: [1], scale: [3] }, base);
    const [direct] = computeGridFeatures(coarseGrain(x, 3), { order: [3], delay: [1], scale: [1] }, base);
    expect(atScale3.values).toEqual(direct.values);
  });

  it('composite (Wu et al. 2013): each feature is the mean over the s offsets; validWindows the smallest', () => {
    const x = noise(1000, 5);
    const [cell] = computeGridFeatures(x, { order: [3], delay: [2], scale: [3] }, { ...base, scaleForm: 'composite' });
    const perOffset = [0, 1, 2].map((k) => featuresFromScan(scanOrdinalPatterns(coarseGrain(x, 3, k), 2, [3])[0]));
    for (const name of FEATURE_NAMES) {
      const mean = perOffset.reduce((a, e) => a + (e.values[name] as number), 0) / 3;
      expect(cell.values[name] as number).toBeCloseTo(mean, 14);
    }
    // offsets 0, 1, 2 give 333, 333, 332 coarse samples, so 329, 329, 328 windows
    expect(cell.quality.validWindows).toBe(328);
  });
});

describe('tie rules', () => {
  const x = noise(3000, 6, true); // integer data: many ties
  const grid = { order: [3, 4], delay: [1], scale: [1, 2] };

  it('jitter: deterministic under a seed, different under another, tie share of the raw data', () => {
    const a = computeGridFeatures(x, grid, { ...base, ties: 'jitter' });
    const b = computeGridFeatures(x, grid, { ...base, ties: 'jitter' });
    const c = computeGridFeatures(x, grid, { ...base, ties: 'jitter', seed: 12 });
    const plain = computeGridFeatures(x, grid, base);
    expect(a).toEqual(b);
    expect(a[0].values.permutation_entropy).not.toBe(c[0].values.permutation_entropy);
    a.forEach((cell, i) => expect(cell.quality).toEqual(plain[i].quality));
    expect(a[0].quality.tiedShare).toBeGreaterThan(0.2);
  });

  it('jitter: a cell does not depend on the rest of the grid', () => {
    const whole = computeGridFeatures(x, grid, { ...base, ties: 'jitter' });
    const [alone] = computeGridFeatures(x, { order: [4], delay: [1], scale: [2] }, { ...base, ties: 'jitter' });
    expect(alone).toEqual(whole.find((c) => c.order === 4 && c.scale === 2));
  });

  it('jitter on i.i.d. rounded noise restores the closed form of continuous noise: entropy 1 within 2e-3 [D]', () => {
    const [cell] = computeGridFeatures(noise(60000, 7, true), { order: [3], delay: [1], scale: [1] }, { ...base, ties: 'jitter' });
    expect(1 - (cell.values.permutation_entropy as number)).toBeLessThan(2e-3);
    const [plain] = computeGridFeatures(noise(60000, 7, true), { order: [3], delay: [1], scale: [1] }, base);
    expect(1 - (plain.values.permutation_entropy as number)).toBeGreaterThan(5e-3); // ties bias it down (Zunino et al. 2017)
  });

  it('symbols: entropy normalised by the ordered Bell number, so a constant series has entropy 0 and 12 of 13 symbols missing', () => {
    const [cell] = computeGridFeatures(new Float64Array(50).fill(2), { order: [3], delay: [1], scale: [1] }, { ...base, ties: 'symbols' });
    expect(cell.values.permutation_entropy).toBe(0);
    expect(cell.values.missing_patterns).toBeCloseTo(12 / 13, 15);
  });
});

describe('argument checks', () => {
  const x = noise(100, 8);
  it.each([
    [{ order: [1], delay: [1], scale: [1] }, 'grid.order: 1 is not an integer from 2 to 9 — use integers from 2 to 9'],
    [{ order: [10], delay: [1], scale: [1] }, 'grid.order: 10 is not an integer from 2 to 9 — use integers from 2 to 9'],
    [{ order: [3], delay: [0], scale: [1] }, 'grid.delay: 0 is not an integer >= 1 — use integers >= 1'],
    [{ order: [3], delay: [1], scale: [1.5] }, 'grid.scale: 1.5 is not an integer >= 1 — use integers >= 1'],
    [{ order: [], delay: [1], scale: [1] }, 'grid.order: needs at least one value — list one or more integers, e.g. [2]'],
  ])('grid %j', (grid, message) => {
    expect(() => computeGridFeatures(x, grid, base)).toThrow(InputError);
    expect(() => computeGridFeatures(x, grid, base)).toThrow(message);
  });

  it('options', () => {
    const grid = { order: [3], delay: [1], scale: [1] };
    expect(() => computeGridFeatures(x, grid, { ...base, ties: 'random' as never })).toThrow(
      'ties: "random" is not a tie rule — use appearance, jitter or symbols',
    );
    expect(() => computeGridFeatures(x, grid, { ...base, ties: 'jitter', jitterRepeats: 0 })).toThrow('jitterRepeats: 0 is not an integer >= 1');
  });
});

describe('infinite values', () => {
  it('are ordered like any value, but make the weighted entropy null with its own reason', () => {
    const [cell] = computeGridFeatures(Float64Array.of(1, 3, Infinity, 2, 5, 4), { order: [3], delay: [1], scale: [1] }, base);
    expect(cell.values.permutation_entropy).not.toBeNull();
    expect(cell.values.weighted_permutation_entropy).toBeNull();
    expect(cell.reasons.weighted_permutation_entropy).toMatch(/infinite value/);
  });
});

describe('a delay longer than the recording', () => {
  it('gives no window, quickly and without a large allocation', () => {
    const [cell] = computeGridFeatures(noise(50, 9), { order: [3], delay: [1e9], scale: [1] }, base);
    expect(cell.quality.validWindows).toBe(0);
    expect(cell.values.permutation_entropy).toBeNull();
  });
});

describe('a scale longer than the recording', () => {
  it('composite form: every feature null, at once', () => {
    const [cell] = computeGridFeatures(noise(50, 10), { order: [3], delay: [1], scale: [1e9] }, { ...base, scaleForm: 'composite' });
    expect(cell.quality.validWindows).toBe(0);
    for (const name of FEATURE_NAMES) expect(cell.values[name]).toBeNull();
  });
});

describe('values near the largest double', () => {
  it('give the features of the same series scaled down (every feature is scale invariant) [D]', () => {
    const base = Float64Array.from({ length: 400 }, (_, i) => Math.sin(i * 1.3) + 0.5 * Math.sin(i * 0.37));
    const huge = base.map((v) => v * 1.5e307);
    const options = { ties: 'appearance' as const, jitterRepeats: 1, scaleForm: 'coarse' as const, seed: 1, minWindowsPerPattern: 5 };
    const grid = { order: [3, 4], delay: [1, 2], scale: [1, 2] };
    const a = computeGridFeatures(base, grid, options);
    const b = computeGridFeatures(huge, grid, options);
    for (let i = 0; i < a.length; i++) {
      for (const [name, value] of Object.entries(a[i].values)) expect(b[i].values[name as keyof typeof a[number]['values']]).toBeCloseTo(value as number, 12);
    }
  });
});

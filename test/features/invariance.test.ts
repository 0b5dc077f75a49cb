// Ordinal patterns depend only on the order of the values (Bandt & Pompe 2002, Phys. Rev.
// Lett. 88, 174102), so every feature built on patterns alone is unchanged by a strictly
// increasing transform of the data (property test, fast-check). The weighted permutation
// entropy is not: its weights are variances, which a non-linear transform changes; it is
// checked only under an affine map a·x + b, a > 0 (variances scale by a^2, which cancels).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeGridFeatures, FEATURE_NAMES, type FeatureName, type FeatureOptions } from '../../src/features/index.ts';

// Every feature but the weighted entropy, whose variance weights change under a nonlinear transform.
const ORDINAL_FEATURES: FeatureName[] = FEATURE_NAMES.filter((f) => f !== 'weighted_permutation_entropy');
// integers, so that the transforms below are exact or keep distinct values distinct
const series = fc.array(fc.oneof({ arbitrary: fc.integer({ min: -40, max: 40 }), weight: 9 }, { arbitrary: fc.constant(NaN), weight: 1 }), {
  maxLength: 120,
  size: 'max',
});
const transforms: [string, (v: number) => number][] = [
  ['x^3 + x', (v) => v ** 3 + v],
  ['2^(x/4)', (v) => 2 ** (v / 4)],
  ['atan(x) shifted', (v) => Math.atan(v) + 1000],
];
const grid = { order: [2, 3, 4], delay: [1, 2], scale: [1] };

describe('invariance under strictly increasing transforms', () => {
  it.each(['appearance', 'symbols'] as const)('ties as %s: every ordinal feature unchanged', (ties) => {
    const options: FeatureOptions = { ties, jitterRepeats: 1, scaleForm: 'coarse', seed: 3, minWindowsPerPattern: 5 };
    fc.assert(
      fc.property(series, fc.constantFrom(...transforms), (values, [, f]) => {
        const x = Float64Array.from(values);
        const before = computeGridFeatures(x, grid, options);
        const after = computeGridFeatures(x.map(f), grid, options);
        before.forEach((cell, i) => {
          for (const name of ORDINAL_FEATURES) expect(after[i].values[name]).toBe(cell.values[name]);
          expect(after[i].quality).toEqual(cell.quality);
        });
      }),
      { numRuns: 150 },
    );
  });

  it('weighted permutation entropy is unchanged by a·x + b with a > 0 (to 1e-12)', () => {
    const options: FeatureOptions = { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 3, minWindowsPerPattern: 5 };
    fc.assert(
      fc.property(series, fc.integer({ min: 1, max: 64 }), fc.integer({ min: -100, max: 100 }), (values, a, b) => {
        const x = Float64Array.from(values);
        const before = computeGridFeatures(x, grid, options);
        const after = computeGridFeatures(x.map((v) => a * v + b), grid, options);
        before.forEach((cell, i) => {
          const w0 = cell.values.weighted_permutation_entropy;
          const w1 = after[i].values.weighted_permutation_entropy;
          if (w0 === null) expect(w1).toBeNull();
          else expect(Math.abs((w1 as number) - w0)).toBeLessThan(1e-12);
        });
      }),
      { numRuns: 100 },
    );
  });
});

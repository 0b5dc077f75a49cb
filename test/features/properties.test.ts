// Invariants every cell must satisfy, whatever the data (property tests, fast-check), and a
// random walk end to end against its derived values [D, shared/REFERENCES.md].
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeGridFeatures, type FeatureOptions } from '../../src/features/index.ts';
import { createRng } from '../../src/shared/random.ts';

const series = fc.array(
  fc.oneof(
    { arbitrary: fc.integer({ min: -4, max: 4 }), weight: 3 },
    { arbitrary: fc.double({ min: -50, max: 50, noNaN: true }), weight: 3 },
    { arbitrary: fc.constant(NaN), weight: 1 },
  ),
  { maxLength: 150, size: 'max' },
);
const ties = fc.constantFrom('appearance' as const, 'jitter' as const, 'symbols' as const);
const scaleForm = fc.constantFrom('coarse' as const, 'composite' as const);
const grid = { order: [2, 3, 4], delay: [1, 3], scale: [1, 2] };

describe('invariants of every cell', () => {
  it('normalised features in [0, 1]; conditional <= transition entropy; outdegree <= m at delay 1 (appearance)', () => {
    fc.assert(
      fc.property(series, ties, scaleForm, (values, rule, form) => {
        const options: FeatureOptions = { ties: rule, jitterRepeats: 2, scaleForm: form, seed: 5, minWindowsPerPattern: 5 };
        for (const cell of computeGridFeatures(Float64Array.from(values), grid, options)) {
          for (const name of ['permutation_entropy', 'weighted_permutation_entropy', 'statistical_complexity', 'missing_patterns', 'self_loop_fraction'] as const) {
            const v = cell.values[name];
            if (v === null) expect(cell.reasons[name]).toBeTruthy();
            else {
              expect(v).toBeGreaterThanOrEqual(0);
              expect(v).toBeLessThanOrEqual(1 + 1e-12);
            }
          }
          const { transition_entropy: te, conditional_entropy: ce, outdegree_mean: od } = cell.values;
          if (te !== null && ce !== null) expect(ce).toBeLessThanOrEqual(te + 1e-12);
          if (od !== null && cell.delay === 1 && rule === 'appearance') expect(od).toBeLessThanOrEqual(cell.order);
          expect(cell.quality.flagged).toBe(cell.quality.validWindows < 5 * [1, 1, 2, 6, 24][cell.order]);
        }
      }),
      { numRuns: 120 },
    );
  });

  it('deterministic under a seed, for every tie rule', () => {
    fc.assert(
      fc.property(series, ties, fc.integer(), (values, rule, seed) => {
        const options: FeatureOptions = { ties: rule, jitterRepeats: 2, scaleForm: 'composite', seed, minWindowsPerPattern: 5 };
        const x = Float64Array.from(values);
        expect(computeGridFeatures(x, grid, options)).toEqual(computeGridFeatures(x, grid, options));
      }),
      { numRuns: 60 },
    );
  });
});

describe('random walk with symmetric continuous increments, m = 3 [D]', () => {
  it('(H, C) = (0.967132, 0.030602) within 2e-3 on 10^6 steps', () => {
    const rng = createRng(1905);
    const x = new Float64Array(1_000_000);
    for (let i = 1; i < x.length; i++) x[i] = x[i - 1] + rng.normal();
    const [cell] = computeGridFeatures(x, { order: [3], delay: [1], scale: [1] }, {
      ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5,
    });
    expect(Math.abs((cell.values.permutation_entropy as number) - 0.967132)).toBeLessThan(2e-3);
    expect(Math.abs((cell.values.statistical_complexity as number) - 0.030602)).toBeLessThan(2e-3);
  });
});

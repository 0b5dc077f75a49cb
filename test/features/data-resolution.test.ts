import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dataResolution } from '../../src/features/index.ts';

/** Brute-force oracle: smallest positive |x_i − x_j| over all pairs, O(n²) [D from the definition]. */
function resolutionByPairs(xs: number[]): number {
  let best = Infinity;
  for (const a of xs) for (const b of xs) if (!Number.isNaN(a) && !Number.isNaN(b) && a - b > 0) best = Math.min(best, a - b);
  return best === Infinity ? NaN : best;
}

describe('dataResolution', () => {
  it('hand values [D]', () => {
    expect(dataResolution(Float64Array.of(3, 1, NaN, 1.5, 3))).toBe(0.5); // doc-comment example
    expect(dataResolution(Float64Array.of(0, 0.25, 0.25, 1))).toBe(0.25);
    expect(dataResolution(Float64Array.of(2, 2, 2))).toBeNaN();
    expect(dataResolution(Float64Array.of(NaN, 7))).toBeNaN();
    expect(dataResolution(new Float64Array(0))).toBeNaN();
  });

  it('16-bit EDF quantisation: step (pmax − pmin)/(dmax − dmin) for consecutive digital codes [D]', () => {
    const gain = 1000 / 65535;
    const xs = Float64Array.from([-3, -2, 5, 9], (d) => -500 + (d + 32768) * gain);
    expect(dataResolution(xs)).toBeCloseTo(gain, 12);
  });

  it('equals the all-pairs oracle and leaves its input unchanged', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.integer({ min: -50, max: 50 }).map((k) => k / 8), fc.constant(NaN)), { maxLength: 40 }), (xs) => {
        const input = Float64Array.from(xs);
        expect(dataResolution(input)).toBe(resolutionByPairs(xs));
        expect(Array.from(input)).toEqual(xs);
      }),
    );
  });
});


import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { describeSeries, sampleResolution } from '../../src/signals/index.ts';

/** Brute-force oracle: smallest positive |x_i − x_j| over all pairs, O(n²) [D from the definition]. */
function resolutionByPairs(xs: number[]): number | null {
  let best = Infinity;
  for (const a of xs) for (const b of xs) if (!Number.isNaN(a) && !Number.isNaN(b) && a - b > 0) best = Math.min(best, a - b);
  return best === Infinity ? null : best;
}

describe('sampleResolution', () => {
  it('hand values [D]', () => {
    expect(sampleResolution(Float64Array.of(3, 1, NaN, 1.5, 3))).toBe(0.5); // doc-comment example
    expect(sampleResolution(Float64Array.of(0, 0.25, 0.25, 1))).toBe(0.25);
    expect(sampleResolution(Float64Array.of(2, 2, 2))).toBeNull();
    expect(sampleResolution(Float64Array.of(NaN, 7))).toBeNull();
    expect(sampleResolution(new Float64Array(0))).toBeNull();
  });

  it('16-bit EDF quantisation: step (pmax − pmin)/(dmax − dmin) for consecutive digital codes [D]', () => {
    const gain = 1000 / 65535;
    const xs = Float64Array.from([-3, -2, 5, 9], (d) => -500 + (d + 32768) * gain);
    expect(sampleResolution(xs)).toBeCloseTo(gain, 12);
  });

  it('equals the all-pairs oracle and leaves its input unchanged', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.integer({ min: -50, max: 50 }).map((k) => k / 8), fc.constant(NaN)), { maxLength: 40 }), (xs) => {
        const input = Float64Array.from(xs);
        expect(sampleResolution(input)).toBe(resolutionByPairs(xs));
        expect(Array.from(input)).toEqual(xs);
      }),
    );
  });
});

describe('describeSeries', () => {
  it('doc-comment example [D by counting]', () => {
    // Present neighbour pairs (1,1), (2,2), (2,3): two of three tied.
    expect(describeSeries(Float64Array.of(1, 1, NaN, NaN, 2, 2, 3))).toEqual({ length: 7, missing: 2, longestGap: 2, distinct: 3, tiedShare: 2 / 3 });
  });

  it('empty and all-missing input', () => {
    const empty = describeSeries(new Float64Array(0));
    expect(empty).toMatchObject({ length: 0, missing: 0, longestGap: 0, distinct: 0 });
    expect(empty.tiedShare).toBeNaN();
    const gaps = describeSeries(Float64Array.of(NaN, NaN, NaN));
    expect(gaps).toMatchObject({ length: 3, missing: 3, longestGap: 3, distinct: 0 });
    expect(gaps.tiedShare).toBeNaN();
  });

  it('agrees with a direct count over pairs and runs', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.integer({ min: 0, max: 3 }), fc.constant(NaN)), { maxLength: 60 }), (xs) => {
        const d = describeSeries(Float64Array.from(xs));
        const present = xs.filter((x) => !Number.isNaN(x));
        const pairs = xs.slice(1).map((x, i) => [xs[i], x]).filter(([a, b]) => !Number.isNaN(a) && !Number.isNaN(b));
        const runs = xs.map((x) => (Number.isNaN(x) ? 'n' : '.')).join('').split('.').map((r) => r.length);
        expect(d.length).toBe(xs.length);
        expect(d.missing).toBe(xs.length - present.length);
        expect(d.longestGap).toBe(Math.max(0, ...runs));
        expect(d.distinct).toBe(new Set(present).size);
        if (pairs.length === 0) expect(d.tiedShare).toBeNaN();
        else expect(d.tiedShare).toBe(pairs.filter(([a, b]) => a === b).length / pairs.length);
      }),
    );
  });
});

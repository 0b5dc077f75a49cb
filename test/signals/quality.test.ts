import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { describeSeries } from '../../src/signals/index.ts';

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

  it('counts distinct values of any doubles like a Set does (-0 and +0 as one), in any order', () => {
    const anyDouble = fc.oneof(fc.double(), fc.constantFrom(0, -0, NaN, Infinity, -Infinity, 5e-324, -5e-324), fc.integer({ min: -3, max: 3 }));
    fc.assert(
      fc.property(fc.array(anyDouble, { maxLength: 300 }), (xs) => {
        expect(describeSeries(Float64Array.from(xs)).distinct).toBe(new Set(xs.filter((x) => !Number.isNaN(x))).size); // Set uses SameValueZero: -0 equals +0 (ECMA-262)
      }),
      { numRuns: 300 },
    );
  });
});

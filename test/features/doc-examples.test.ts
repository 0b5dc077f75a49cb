// The examples in the doc comments of src/features, kept true (values worked by hand [D]
// unless the comment names another source), and the jitter rule's guarantees.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  complexityConstant,
  countOrdinalPatterns,
  dataResolution,
  jensenShannonToUniform,
  jitterBelowResolution,
  normalizedEntropy,
  ordinalSymbolCode,
  ordinalSymbolFromCode,
  scanOrdinalPatterns,
  shannonEntropy,
  statisticalComplexity,
  successorPatternCode,
  symbolCodeSpace,
  transitionFeatures,
} from '../../src/features/index.ts';
import { createRng } from '../../src/shared/random.ts';

describe('doc examples', () => {
  it('entropy and complexity', () => {
    expect(shannonEntropy([1, 1])).toBeCloseTo(Math.LN2, 15);
    expect(shannonEntropy([5])).toBe(0);
    expect(normalizedEntropy([2, 2, 1], 6)).toBeCloseTo(0.588762155916294, 14);
    expect(complexityConstant(6)).toBeCloseTo(2.203066987747817, 12);
    // P = (1, 0), U = (1/2, 1/2): S(3/4, 1/4) - S(P)/2 - ln(2)/2
    const mixEntropy = -(0.75 * Math.log(0.75) + 0.25 * Math.log(0.25));
    expect(jensenShannonToUniform([1], 2)).toBeCloseTo(mixEntropy - Math.LN2 / 2, 15);
    expect(statisticalComplexity([2, 2, 1], 6)).toBeCloseTo(0.289954, 6);
  });

  it('codes and counts', () => {
    const bp = Float64Array.of(4, 7, 9, 10, 6, 11, 3);
    expect(Array.from(countOrdinalPatterns(bp, 2, 1).counts)).toEqual([2, 4]);
    expect(Array.from(scanOrdinalPatterns(bp, 1, [2])[0].counts)).toEqual([2, 4]);
    expect(successorPatternCode(5, 3, 2)).toBe(5);
    expect(ordinalSymbolCode([1, 2, 3])).toBe(18);
    expect(ordinalSymbolCode([2, 2, 2])).toBe(5);
    expect(ordinalSymbolFromCode(18, 3)).toEqual([0, 1, 2]);
    expect(ordinalSymbolFromCode(5, 3)).toEqual([0, 0, 0]);
    expect(symbolCodeSpace(3)).toBe(24);
  });

  it('transition features', () => {
    const f = transitionFeatures({ source: Int32Array.of(0, 0, 1), target: Int32Array.of(0, 1, 0), count: Float64Array.of(1, 1, 2) });
    expect(f?.transitionEntropy).toBeCloseTo(2 * 0.25 * Math.log(4) + 0.5 * Math.log(2), 15);
    expect(f?.conditionalEntropy).toBeCloseTo(0.5 * Math.log(2), 15);
    expect(f?.outdegreeMean).toBe(1.5);
    expect(f?.outdegreeVariance).toBe(0.25);
    expect(f?.selfLoopFraction).toBe(0.25);
  });

  it('data resolution', () => {
    expect(dataResolution(Float64Array.of(3, 1, 1.5, 3, NaN))).toBe(0.5);
    expect(dataResolution(Float64Array.of(2, 2))).toBeNaN();
    expect(dataResolution(new Float64Array(0))).toBeNaN();
  });
});

describe('jitter below the resolution (Zunino et al. 2017)', () => {
  it('keeps every strict order, keeps NaN, and is fixed by the seed (property, fast-check)', () => {
    const data = fc.array(fc.oneof(fc.integer({ min: -5, max: 5 }), fc.constant(NaN), fc.constant(1e9)), { maxLength: 60, size: 'max' });
    fc.assert(
      fc.property(data, fc.integer(), (values, seed) => {
        const x = Float64Array.from(values);
        const j = jitterBelowResolution(x, createRng(seed));
        expect(j).toEqual(jitterBelowResolution(x, createRng(seed)));
        for (let a = 0; a < x.length; a++) {
          if (Number.isNaN(x[a])) expect(j[a]).toBeNaN();
          for (let b = 0; b < x.length; b++) if (x[a] < x[b]) expect(j[a]).toBeLessThan(j[b]);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('breaks ties: a constant series becomes distinct values', () => {
    const j = jitterBelowResolution(new Float64Array(100).fill(3), createRng(1));
    expect(new Set(j).size).toBe(100);
  });
});

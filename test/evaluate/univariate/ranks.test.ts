import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { hasTies, midRanks, rankWithTies, tieCorrectionSum } from '../../../src/evaluate/ranks.ts';

/** Brute-force oracle: mid-rank = (# smaller) + (# equal + 1)/2, counting non-NaN values only. */
function bruteMidRank(values: number[], i: number): number {
  let smaller = 0;
  let equal = 0;
  for (const v of values) {
    if (Number.isNaN(v)) continue;
    if (v < values[i]) smaller++;
    else if (v === values[i]) equal++;
  }
  return smaller + (equal + 1) / 2;
}

describe('midRanks', () => {
  it('averages the ranks of tied values (doc example; definition of mid-ranks, Kendall 1945)', () => {
    expect(Array.from(midRanks([3, 1, 3, 2]))).toEqual([3.5, 1, 3.5, 2]);
  });

  it('leaves NaN out of the ranking and reports the tie groups (doc example)', () => {
    const ranked = rankWithTies([10, 20, 10, Number.NaN]);
    expect(Array.from(ranked.ranks)).toEqual([1.5, 3, 1.5, Number.NaN]);
    expect(Array.from(ranked.tieSizes)).toEqual([2, 1]);
    expect(ranked.n).toBe(3);
  });

  it('returns empty arrays for empty input', () => {
    const ranked = rankWithTies([]);
    expect(ranked.ranks.length).toBe(0);
    expect(ranked.tieSizes.length).toBe(0);
    expect(ranked.n).toBe(0);
  });

  it('ranks infinities as extremes and ties 0 with -0', () => {
    expect(Array.from(midRanks([Infinity, 0, -0, -Infinity]))).toEqual([4, 2.5, 2.5, 1]);
  });

  it('does not modify its input', () => {
    const input = Object.freeze([5, 3, 5, 1]);
    midRanks(input);
    expect(input).toEqual([5, 3, 5, 1]);
  });

  it('agrees with a brute-force count on random data with ties and NaN (property)', () => {
    const value = fc.oneof(fc.integer({ min: -4, max: 4 }), fc.constant(Number.NaN), fc.double({ noNaN: true }));
    fc.assert(
      fc.property(fc.array(value, { maxLength: 40 }), (values) => {
        const ranks = midRanks(values);
        values.forEach((v, i) => {
          if (Number.isNaN(v)) expect(ranks[i]).toBeNaN();
          else expect(ranks[i]).toBe(bruteMidRank(values, i));
        });
      }),
    );
  });

  it('ranks sum to n(n+1)/2 and tie groups sum to n [D: sum of 1..n]', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 6 }), { maxLength: 60 }), (values) => {
        const { ranks, tieSizes, n } = rankWithTies(values);
        expect(ranks.reduce((a, b) => a + b, 0)).toBe((n * (n + 1)) / 2);
        expect(tieSizes.reduce((a, b) => a + b, 0)).toBe(n);
      }),
    );
  });
});

describe('tie helpers', () => {
  it('sums t^3 - t over tie groups (doc example, arithmetic)', () => {
    expect(tieCorrectionSum(Int32Array.from([2, 1, 3]))).toBe(30);
    expect(tieCorrectionSum([])).toBe(0);
  });

  it('detects ties', () => {
    expect(hasTies(rankWithTies([1, 2, 3]).tieSizes)).toBe(false);
    expect(hasTies(rankWithTies([1, 2, 2]).tieSizes)).toBe(true);
  });
});

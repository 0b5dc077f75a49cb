/**
 * Checks of the forest's and the logistic regression's internal building blocks against
 * slow obvious oracles and hand-derived values [D].
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { choleskySolveInPlace } from '../../../src/evaluate/classifiers/cholesky.ts';
import { rankColumns } from '../../../src/evaluate/classifiers/column-ranks.ts';
import { RankBuckets } from '../../../src/evaluate/classifiers/rank-buckets.ts';
import { sortByFloat64Key } from '../../../src/evaluate/classifiers/sort-pairs.ts';

describe('sort-pairs', () => {
  it('doc example [D]', () => {
    const kf = Float64Array.of(0.5, -1, 0.25);
    const vf = Int32Array.of(0, 1, 2);
    sortByFloat64Key(kf, vf, 0, 2);
    expect([Array.from(kf), Array.from(vf)]).toEqual([[-1, 0.25, 0.5], [1, 2, 0]]);
  });

  it('agrees with Array.prototype.sort and keeps each payload with its key (fast-check)', () => {
    fc.assert(
      // Keys in halves from -10 to 10: many ties, and ranges both above and below the
      // insertion-sort cutoff.
      fc.property(fc.array(fc.integer({ min: -20, max: 20 }).map((v) => v / 2), { maxLength: 300 }), (keys) => {
        const k = Float64Array.from(keys);
        const v = Int32Array.from(keys, (_, i) => i);
        sortByFloat64Key(k, v, 0, k.length - 1);
        expect(Array.from(k)).toEqual([...keys].sort((a, b) => a - b));
        v.forEach((i, pos) => expect(keys[i]).toBe(k[pos]));
        expect([...v].sort((a, b) => a - b)).toEqual(keys.map((_, i) => i));
      }),
    );
  });
});

describe('rankColumns', () => {
  it('doc example [D]', () => {
    const r = rankColumns(Float64Array.of(3, 1, 3), 3, 1);
    expect(Array.from(r.rank)).toEqual([1, 0, 1]);
    expect(Array.from(r.rankInOrder)).toEqual([0, 1, 1]);
    expect(Array.from(r.distinct)).toEqual([1, 3]);
    expect(r.order[0]).toBe(1);
  });

  it('dense ranks equal the count of smaller distinct values (fast-check oracle)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 25 }), fc.integer({ min: 1, max: 4 }), fc.nat(), (nRows, nCols, seed) => {
        let s = seed;
        const X = Float64Array.from({ length: nRows * nCols }, () => ((s = (s * 7 + 3) % 11) - 5) / 2);
        const r = rankColumns(X, nRows, nCols);
        for (let c = 0; c < nCols; c++) {
          const col = Array.from({ length: nRows }, (_, i) => X[i * nCols + c]);
          const distinct = [...new Set(col)].sort((a, b) => a - b);
          expect(Array.from(r.distinct.subarray(r.distinctStart[c], r.distinctStart[c + 1]))).toEqual(distinct);
          col.forEach((v, i) => expect(r.rank[c * nRows + i]).toBe(distinct.indexOf(v)));
          for (let k = 0; k < nRows; k++) expect(r.rankInOrder[c * nRows + k]).toBe(r.rank[c * nRows + r.order[c * nRows + k]]);
          for (let k = 1; k < nRows; k++) expect(r.rankInOrder[c * nRows + k]).toBeGreaterThanOrEqual(r.rankInOrder[c * nRows + k - 1]);
        }
      }),
    );
  });
});

describe('RankBuckets', () => {
  it('doc example [D]', () => {
    const b = new RankBuckets(4);
    const d = b.fill(Int32Array.of(2, 0, 2, 1), 0, Int32Array.of(0, 1, 2, 3), 0, 4, Int32Array.of(1, 2, 1, 1), Int32Array.of(0, 2, 1, 0));
    expect(d).toBe(3);
    expect([Array.from(b.bucketRank.subarray(0, d)), Array.from(b.bucketWeight.subarray(0, d)), Array.from(b.bucketWeight1.subarray(0, d))]).toEqual([
      [0, 1, 2],
      [2, 1, 2],
      [2, 0, 1],
    ]);
  });

  it('an empty segment gives no bucket', () => {
    expect(new RankBuckets(5).fill(new Int32Array(5), 0, new Int32Array(5), 2, 2, new Int32Array(5), new Int32Array(5))).toBe(0);
  });

  it('agrees with sorting and summing by rank, and leaves no residue between calls (fast-check oracle) [D]', () => {
    // n up to 3000 exercises the two-level bitmap (more than 1024 ranks) as well as the
    // one-word summary; the same RankBuckets is reused for every segment of one table.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 3000 }), fc.integer({ min: 1, max: 3000 }), fc.nat(), (n, distinctValues, seed) => {
        let s = seed;
        const next = () => (s = (Math.imul(s, 1103515245) + 12345) >>> 0);
        const rank = Int32Array.from({ length: 2 * n }, () => next() % Math.min(n, distinctValues));
        const weight = Int32Array.from({ length: n }, () => next() % 4);
        const weight1 = Int32Array.from(weight, (w) => (next() % 2 === 0 ? w : 0));
        const samples = Int32Array.from({ length: n }, (_, i) => i);
        const buckets = new RankBuckets(n);
        for (const [offset, start, end] of [[0, 0, n], [n, n >> 2, n - (n >> 3)], [0, n >> 1, n]]) {
          const expected = new Map<number, [number, number]>();
          for (let k = start; k < end; k++) {
            const r = rank[offset + samples[k]];
            const [w, w1] = expected.get(r) ?? [0, 0];
            expected.set(r, [w + weight[samples[k]], w1 + weight1[samples[k]]]);
          }
          const ranks = [...expected.keys()].sort((a, b) => a - b);
          const d = buckets.fill(rank, offset, samples, start, end, weight, weight1);
          expect(d).toBe(ranks.length);
          expect(Array.from(buckets.bucketRank.subarray(0, d))).toEqual(ranks);
          expect(Array.from(buckets.bucketWeight.subarray(0, d))).toEqual(ranks.map((r) => expected.get(r)![0]));
          expect(Array.from(buckets.bucketWeight1.subarray(0, d))).toEqual(ranks.map((r) => expected.get(r)![1]));
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('choleskySolveInPlace', () => {
  it('doc example: [[4, 2], [2, 3]] x = [2, 1] gives x = [0.5, 0] [D]', () => {
    const b = Float64Array.of(2, 1);
    expect(choleskySolveInPlace(Float64Array.of(4, 2, 2, 3), b, 2)).toBe(true);
    expect(b[0]).toBeCloseTo(0.5, 15);
    expect(b[1]).toBeCloseTo(0, 15);
  });

  it('refuses a matrix that is not positive definite', () => {
    expect(choleskySolveInPlace(Float64Array.of(1, 2, 2, 1), Float64Array.of(1, 1), 2)).toBe(false);
  });

  it('A x reproduces b for A = MᵀM + I (fast-check)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 64, maxLength: 64 }), (d, m) => {
        const A = new Float64Array(d * d);
        for (let i = 0; i < d; i++)
          for (let j = 0; j < d; j++) {
            let s = i === j ? 1 : 0;
            for (let k = 0; k < d; k++) s += m[k * 8 + i] * m[k * 8 + j];
            A[i * d + j] = s;
          }
        const b = Float64Array.from({ length: d }, (_, i) => i - 1.5);
        const x = b.slice();
        expect(choleskySolveInPlace(A.slice(), x, d)).toBe(true);
        for (let i = 0; i < d; i++) {
          let s = 0;
          for (let j = 0; j < d; j++) s += A[i * d + j] * x[j];
          expect(s).toBeCloseTo(b[i], 8);
        }
      }),
    );
  });
});

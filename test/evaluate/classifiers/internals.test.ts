/**
 * Checks of the forest's and the logistic regression's internal building blocks against
 * slow obvious oracles and hand-derived values [D].
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { choleskySolveInPlace } from '../../../src/evaluate/classifiers/cholesky.ts';
import { rankColumns } from '../../../src/evaluate/classifiers/column-ranks.ts';
import { sortByFloat64Key, sortByInt32Key } from '../../../src/evaluate/classifiers/sort-pairs.ts';

describe('sort-pairs', () => {
  it('doc examples [D]', () => {
    const k = Int32Array.of(3, 1, 2);
    const v = Int32Array.of(30, 10, 20);
    sortByInt32Key(k, v, 0, 2);
    expect([Array.from(k), Array.from(v)]).toEqual([[1, 2, 3], [10, 20, 30]]);
    const kf = Float64Array.of(0.5, -1, 0.25);
    const vf = Int32Array.of(0, 1, 2);
    sortByFloat64Key(kf, vf, 0, 2);
    expect([Array.from(kf), Array.from(vf)]).toEqual([[-1, 0.25, 0.5], [1, 2, 0]]);
  });

  it('agrees with Array.prototype.sort and keeps each payload with its key (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -20, max: 20 }), { maxLength: 300 }), (keys) => {
        const k = Int32Array.from(keys);
        const v = Int32Array.from(keys, (_, i) => i);
        sortByInt32Key(k, v, 0, k.length - 1);
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

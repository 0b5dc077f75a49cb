/**
 * Checks of the forest's and the logistic regression's internal building blocks against
 * slow obvious oracles and hand-derived values [D].
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { choleskySolveInPlace } from '../../../src/evaluate/classifiers/cholesky.ts';
import { rankColumns } from '../../../src/evaluate/classifiers/column-ranks.ts';
import { sortByFloat64Key } from '../../../src/evaluate/classifiers/sort-pairs.ts';
import { CLASS1_UNIT, COLUMN_BETTER, COLUMN_CONSTANT, ColumnSplitSearch } from '../../../src/evaluate/classifiers/column-split.ts';

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
    expect(Array.from(r.distinct)).toEqual([1, 3]);
    expect(Array.from(r.distinctStart)).toEqual([0, 2]);
  });

  it('dense ranks equal the count of smaller distinct values (fast-check oracle)', () => {
    // Values: whole numbers from -3 to 3 (many ties, -0 among them) or any finite double.
    const value = fc.oneof(fc.integer({ min: -3, max: 3 }).map((v) => (v === 0 ? -0 : v)), fc.constant(0), fc.double({ noNaN: true, noDefaultInfinity: true }));
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }).chain((nRows) =>
          fc.integer({ min: 1, max: 4 }).chain((nCols) => fc.tuple(fc.constant(nRows), fc.constant(nCols), fc.array(value, { minLength: nRows * nCols, maxLength: nRows * nCols }))),
        ),
        ([nRows, nCols, values]) => {
          const X = Float64Array.from(values);
          const r = rankColumns(X, nRows, nCols);
          for (let c = 0; c < nCols; c++) {
            const col = Array.from({ length: nRows }, (_, i) => X[i * nCols + c]);
            const distinct = [...new Set(col)].sort((a, b) => a - b); // Set treats -0 and 0 as one value
            expect(Array.from(r.distinct.subarray(r.distinctStart[c], r.distinctStart[c + 1])).map((v) => v + 0)).toEqual(distinct.map((v) => v + 0));
            col.forEach((v, i) => expect(r.rank[c * nRows + i]).toBe(distinct.filter((d) => d < v).length));
          }
        },
      ),
    );
  });
});

describe('ColumnSplitSearch', () => {
  it('doc example [D]', () => {
    const search = new ColumnSplitSearch(4);
    search.reset();
    const packed = Float64Array.of(1, 1, 1 + CLASS1_UNIT, 1 + CLASS1_UNIT);
    expect(search.search(Int32Array.of(0, 1, 2, 3), 0, Int32Array.of(0, 1, 2, 3), 0, 4, packed, 2, 2, 1)).toBe(COLUMN_BETTER);
    expect([search.bestRankLeft, search.bestRankRight, search.bestLeft0, search.bestLeft1]).toEqual([1, 2, 2, 0]);
    expect([search.bestNumerator, search.bestDenominator]).toEqual([16, 4]);
  });

  it('a column with one value in the node, or an empty node, is constant', () => {
    const search = new ColumnSplitSearch(5);
    search.reset();
    const packed = Float64Array.of(1, 2 + 2 * CLASS1_UNIT, 1, 1, 1);
    expect(search.search(Int32Array.of(3, 3, 0, 1, 2), 0, Int32Array.of(0, 1, 2, 3, 4), 0, 2, packed, 1, 2, 1)).toBe(COLUMN_CONSTANT);
    expect(search.search(Int32Array.of(3, 3, 0, 1, 2), 0, Int32Array.of(0, 1, 2, 3, 4), 2, 2, packed, 0, 0, 1)).toBe(COLUMN_CONSTANT);
  });

  /** Weighted Gini impurity of the two children of every threshold, by direct summation [D]. */
  function bruteForceSplits(ranks: number[], w: number[], w1: number[], minLeaf: number): { rankLeft: number; rankRight: number; impurity: number }[] {
    const distinct = [...new Set(ranks)].sort((a, b) => a - b);
    const gini = (n: number, n1: number) => (n === 0 ? 0 : n * (1 - (n1 / n) ** 2 - ((n - n1) / n) ** 2));
    const out = [];
    for (let k = 0; k + 1 < distinct.length; k++) {
      let nl = 0, l1 = 0, nr = 0, r1 = 0;
      ranks.forEach((r, i) => {
        if (r <= distinct[k]) {
          nl += w[i];
          l1 += w1[i];
        } else {
          nr += w[i];
          r1 += w1[i];
        }
      });
      if (nl >= minLeaf && nr >= minLeaf) out.push({ rankLeft: distinct[k], rankRight: distinct[k + 1], impurity: gini(nl, l1) + gini(nr, r1) });
    }
    return out;
  }

  it('finds the split of least weighted Gini impurity across columns, against brute force (fast-check) [D]', () => {
    // n up to 3000 exercises the two-level bitmap (more than 1024 ranks) as well as the
    // one-word summary; one search object is reused for every column and node, so scratch
    // left behind by one search would spoil the next.
    const search = new ColumnSplitSearch(3000);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 3000 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 4 }), fc.nat(), (n, m0, minLeaf, seed) => {
        let state = seed;
        const next = (k: number) => (state = (Math.imul(state, 1103515245) + 12345) >>> 0) % k;
        const m = Math.min(m0, n);
        const nCols = 3;
        const values = 1 + next(n); // distinct values per column, 1 = constant
        const rank = Int32Array.from({ length: nCols * n }, () => next(values));
        const samples = Int32Array.from({ length: n }, (_, i) => i);
        for (let i = n - 1; i > 0; i--) {
          const j = next(i + 1);
          [samples[i], samples[j]] = [samples[j], samples[i]];
        }
        const w = Array.from({ length: n }, () => 1 + next(3));
        const w1 = w.map((v) => (next(2) === 1 ? v : 0));
        const packed = Float64Array.from(w, (v, i) => v + w1[i] * CLASS1_UNIT);
        const start = n - m;
        const rows = Array.from(samples.subarray(start, n));
        const c1 = rows.reduce((a, i) => a + w1[i], 0);
        const c0 = rows.reduce((a, i) => a + w[i], 0) - c1;
        search.reset();
        let best: { col: number; impurity: number } | null = null;
        let bestCol = -1;
        for (let col = 0; col < nCols; col++) {
          const ranks = rows.map((i) => rank[col * n + i]);
          const outcome = search.search(rank, col * n, samples, start, n, packed, c0, c1, minLeaf);
          expect(outcome === COLUMN_CONSTANT).toBe(new Set(ranks).size < 2);
          if (outcome === COLUMN_BETTER) bestCol = col;
          for (const split of bruteForceSplits(ranks, rows.map((i) => w[i]), rows.map((i) => w1[i]), minLeaf)) {
            if (best === null || split.impurity < best.impurity - 1e-9) best = { col, impurity: split.impurity };
          }
        }
        if (best === null) {
          expect(bestCol).toBe(-1);
          return;
        }
        // The chosen split: impurity = total − num / den; it must be the least one found by brute force.
        expect(bestCol).toBeGreaterThanOrEqual(0);
        expect(c0 + c1 - search.bestNumerator / search.bestDenominator).toBeCloseTo(best.impurity, 9);
        const ranks = rows.map((i) => rank[bestCol * n + i]);
        const left = rows.filter((_, k) => ranks[k] <= search.bestRankLeft);
        expect(left.reduce((a, i) => a + w[i] - w1[i], 0)).toBe(search.bestLeft0);
        expect(left.reduce((a, i) => a + w1[i], 0)).toBe(search.bestLeft1);
        // rankRight is the next value present in the node.
        expect(Math.min(...ranks.filter((r) => r > search.bestRankLeft))).toBe(search.bestRankRight);
      }),
      { numRuns: 150 },
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

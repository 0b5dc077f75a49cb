import { describe, expect, it } from 'vitest';
import type { FeatureMatrix } from '../../../src/evaluate/types.ts';
import { compareGroups } from '../../../src/evaluate/univariate.ts';
import { hedgesG } from '../../../src/evaluate/hedges.ts';
import { expectClose, loadScipyReference } from './helpers.ts';

const reference = loadScipyReference();

/** A matrix from per-column value lists: group 0 rows first, then group 1. */
function matrixFromColumns(group0: number[][], group1: number[][]): FeatureMatrix {
  const n0 = group0[0].length;
  const n1 = group1[0].length;
  const nCols = group0.length;
  const values = new Float64Array((n0 + n1) * nCols);
  for (let c = 0; c < nCols; c++) {
    group0[c].forEach((v, r) => (values[r * nCols + c] = v));
    group1[c].forEach((v, r) => (values[(n0 + r) * nCols + c] = v));
  }
  const ids = Array.from({ length: n0 + n1 }, (_, i) => `s${i}`);
  return {
    rowIds: ids,
    subjects: ids,
    labels: Uint8Array.from({ length: n0 + n1 }, (_, i) => (i < n0 ? 0 : 1)),
    groupNames: ['control', 'patient'],
    columns: group0.map((_, c) => ({ feature: `f${c}`, order: 3, delay: 1, scale: c + 1 })),
    values,
  };
}

function fixtureMatrix(): FeatureMatrix {
  const m = reference.matrix;
  const nRows = m.labels.length;
  const ids = Array.from({ length: nRows }, (_, i) => `r${i}`);
  return {
    rowIds: ids,
    subjects: ids,
    labels: Uint8Array.from(m.labels),
    groupNames: ['a', 'b'],
    columns: Array.from({ length: m.n_cols }, (_, c) => ({ feature: 'permutation_entropy', order: 3 + c, delay: 1, scale: 1 })),
    values: Float64Array.from(m.values, (v) => (v === null ? Number.NaN : v)),
  };
}

describe('compareGroups against numpy and scipy (fixture from scripts/fixtures/univariate/make_fixtures.py)', () => {
  const rows = compareGroups(fixtureMatrix());

  it('one row per column, carrying the column description', () => {
    expect(rows.length).toBe(reference.matrix.n_cols);
    expect(rows.map((r) => r.order)).toEqual([3, 4, 5, 6]);
  });

  reference.matrix.expected.forEach((e, c) => {
    it(`column ${c}: counts, mean and SD (numpy), U and p (scipy mannwhitneyu), q (false_discovery_control)`, () => {
      const row = rows[c];
      expect([row.group0.n, row.group1.n, row.group0.missing, row.group1.missing]).toEqual([e.n0, e.n1, e.missing0, e.missing1]);
      expectClose(row.group0.mean!, e.mean0, 1e-12, 1e-14);
      expectClose(row.group1.mean!, e.mean1, 1e-12, 1e-14);
      expectClose(row.group0.sd!, e.sd0, 1e-12);
      expectClose(row.group1.sd!, e.sd1, 1e-12);
      expect(row.u).toBe(e.u);
      expectClose(row.auc!, e.u / (e.n0 * e.n1), 1e-15);
      expect(row.pMethod).toBe(e.method);
      expectClose(row.pValue!, e.p, 1e-9);
      expectClose(row.qValue!, e.q, 1e-9);
      expect(row.reason).toBeNull();
    });
  });

  it("Hedges' g equals hedgesG of numpy's group moments", () => {
    reference.matrix.expected.forEach((e, c) => {
      const g = hedgesG({ n: e.n0, mean: e.mean0, sd: e.sd0 }, { n: e.n1, mean: e.mean1, sd: e.sd1 });
      if ('reason' in g) throw new Error(g.reason);
      expectClose(rows[c].hedgesG!, g.g, 1e-10);
      expectClose(rows[c].gLow!, g.low, 1e-10, 1e-12);
      expectClose(rows[c].gHigh!, g.high, 1e-10, 1e-12);
    });
  });
});

describe('compareGroups: values that cannot be computed', () => {
  it('doc example: [1, 2, 4] vs [3, 5, 6] gives U 8, exact p 0.2, g = 0.8·(7/3)/√(7/3) [D]', () => {
    const [row] = compareGroups(matrixFromColumns([[1, 2, 4]], [[3, 5, 6]]));
    expect(row.u).toBe(8);
    expectClose(row.auc!, 8 / 9, 1e-15);
    expectClose(row.pValue!, 0.2, 1e-15);
    expect(row.pMethod).toBe('exact');
    expectClose(row.hedgesG!, 0.8 * Math.sqrt(7 / 3), 1e-14);
    expectClose(row.qValue!, 0.2, 1e-15); // a family of one
  });

  it('a constant column gets null statistics with a reason and stays out of the BH family', () => {
    const rows = compareGroups(matrixFromColumns([[5, 5, 5], [1, 2, 4]], [[5, 5, 5], [3, 5, 6]]));
    expect(rows[0]).toMatchObject({ hedgesG: null, u: null, auc: null, pValue: null, qValue: null, reason: 'zero variance: every value is equal' });
    expect(rows[0].group0).toEqual({ n: 3, missing: 0, mean: 5, sd: 0 });
    expectClose(rows[1].qValue!, 0.2, 1e-15); // m = 1: the constant column is not counted
  });

  it('too few values per group (missing values excluded and counted) gives nulls and a reason', () => {
    const [row] = compareGroups(matrixFromColumns([[1, Number.NaN, Number.NaN]], [[3, 5, 6]]));
    expect(row.group0).toEqual({ n: 1, missing: 2, mean: 1, sd: null });
    expect(row.pValue).toBeNull();
    expect(row.reason).toBe('too few values: 1 in group 0 and 3 in group 1, at least 2 per group needed');
  });

  it('groups each constant but different: no g (zero pooled SD), exact Mann–Whitney still given', () => {
    const [row] = compareGroups(matrixFromColumns([[1, 1, 1]], [[2, 2, 2]]));
    expect(row.hedgesG).toBeNull();
    expect(row.auc).toBe(1);
    expect(row.pMethod).toBe('normal'); // ties: the exact table does not apply
    expect(row.pValue).not.toBeNull();
    expect(row.reason).toBe("Hedges' g: zero variance within both groups");
  });

  it('honours minPerGroup', () => {
    const [row] = compareGroups(matrixFromColumns([[1, 2, 4]], [[3, 5, 6]]), { minPerGroup: 4 });
    expect(row.pValue).toBeNull();
    expect(row.reason).toMatch(/at least 4 per group needed/);
  });

  it('returns [] for a matrix without columns and rejects a mis-sized value array', () => {
    const empty = matrixFromColumns([[1]], [[2]]);
    expect(compareGroups({ ...empty, columns: [], values: new Float64Array(0) })).toEqual([]);
    expect(() => compareGroups({ ...empty, values: new Float64Array(5) })).toThrow(/values hold 5 numbers, expected rows x columns = 2 x 1/);
  });

  it('does not modify the matrix', () => {
    const m = matrixFromColumns([[1, Number.NaN, 4]], [[3, 5, 6]]);
    const before = Array.from(m.values);
    compareGroups(m);
    expect(Array.from(m.values)).toEqual(before);
  });
});

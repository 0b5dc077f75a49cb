import { describe, expect, it } from 'vitest';
import { EXACT_MAX_TOTAL, exactUCounts, mannWhitneyU, normalQuantile, normalUpperTail } from '../../../src/evaluate/mann-whitney.ts';
import { expectClose, loadScipyReference } from './helpers.ts';

const reference = loadScipyReference();

/** Binomial coefficient, small arguments. */
function choose(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n - k + i)) / i;
  return Math.round(c);
}

describe('mannWhitneyU: fuel-additive example (a standard statistics manual; S via secondary, D recomputed)', () => {
  const group0 = [20, 23, 21, 25, 18, 17, 18, 24, 20, 24, 23, 19];
  const group1 = [24, 25, 21, 22, 23, 18, 17, 28, 24, 27, 21, 23];

  it('U = 94 for group 1 (50 for group 0), tie-adjusted z = 1.2788, p = 0.2010 without continuity correction', () => {
    const r = mannWhitneyU(group0, group1, { continuity: false });
    expect(r.u).toBe(94);
    expect(r.n0 * r.n1 - r.u).toBe(50);
    expect(r.method).toBe('normal'); // ties force the normal approximation
    // z = (94 − 72)/√295.9565; the reference states −1.2788 for the smaller U.
    expectClose(r.z, 22 / Math.sqrt(295.9565), 1e-6);
    expectClose(r.z, 1.2788, 0, 5e-5);
    expectClose(r.p, 0.2010, 0, 5e-5);
    expectClose(r.auc, 94 / 144, 1e-15);
  });

  it('p = 0.211389 with continuity correction', () => {
    const r = mannWhitneyU(group0, group1);
    expectClose(r.p, 0.211389, 0, 5e-7);
    expectClose(r.z, 21.5 / Math.sqrt(295.9565), 1e-6);
  });

  it('swapping the groups gives U = 50, a negative z and the same p', () => {
    const r = mannWhitneyU(group1, group0, { continuity: false });
    expect(r.u).toBe(50);
    expectClose(r.z, -1.2788, 0, 5e-5);
    expectClose(r.p, 0.2010, 0, 5e-5);
  });
});

describe('mannWhitneyU against scipy.stats.mannwhitneyu (fixture from scripts/fixtures/univariate/make_fixtures.py)', () => {
  for (const c of reference.mann_whitney) {
    it(c.name, () => {
      const withCc = mannWhitneyU(c.group0, c.group1, { method: 'normal' });
      expect(withCc.u).toBe(c.asymptotic_cc.u);
      expectClose(withCc.p, c.asymptotic_cc.p, 1e-9, 1e-15);
      const plain = mannWhitneyU(c.group0, c.group1, { method: 'normal', continuity: false });
      expectClose(plain.p, c.asymptotic_plain.p, 1e-9, 1e-15);
      const auto = mannWhitneyU(c.group0, c.group1);
      if (c.exact) {
        const exact = mannWhitneyU(c.group0, c.group1, { method: 'exact' });
        expect(exact.u).toBe(c.exact.u);
        expectClose(exact.p, c.exact.p, 1e-12);
        expect(auto.method).toBe(c.group0.length + c.group1.length <= EXACT_MAX_TOTAL ? 'exact' : 'normal');
      } else {
        expect(auto.method).toBe('normal');
        expect(() => mannWhitneyU(c.group0, c.group1, { method: 'exact' })).toThrow(/exact null distribution assumes no ties/);
      }
    });
  }
});

describe('mannWhitneyU edge cases', () => {
  it('doc example: complete exact distribution of 3 vs 3 gives p = 2·2/20 = 0.2 [D]', () => {
    const r = mannWhitneyU([1, 2, 4], [3, 5, 6]);
    expect(r.u).toBe(8);
    expect(r.method).toBe('exact');
    expectClose(r.p, 0.2, 1e-15);
  });

  it('skips NaN values and counts only the rest', () => {
    const r = mannWhitneyU([1, Number.NaN, 2, 4], [3, 5, Number.NaN, 6]);
    expect([r.n0, r.n1, r.u]).toEqual([3, 3, 8]);
  });

  it('an empty group gives NaN with a reason', () => {
    const r = mannWhitneyU([Number.NaN], [1, 2]);
    expect([r.u, r.auc, r.z, r.p].every(Number.isNaN)).toBe(true);
    expect(r.reason).toBe('group 0 has no values');
  });

  it('all values tied gives p NaN with a reason', () => {
    const r = mannWhitneyU([2, 2, 2], [2, 2]);
    expect(r.auc).toBe(0.5);
    expect(r.p).toBeNaN();
    expect(r.reason).toBe('all values are tied');
  });
});

describe('exactUCounts', () => {
  it('doc example: 2 vs 2 gives counts 1, 1, 2, 1, 1 (enumerated by hand)', () => {
    expect(Array.from(exactUCounts(2, 2))).toEqual([1, 1, 2, 1, 1]);
  });

  it('counts sum to C(n0+n1, n0), are symmetric and exact up to 25 vs 25 [D: q-binomial coefficient at q = 1]', () => {
    for (const [n0, n1] of [[1, 1], [3, 7], [10, 10], [5, 45], [25, 25]]) {
      const counts = exactUCounts(n0, n1);
      expect(counts.length).toBe(n0 * n1 + 1);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(choose(n0 + n1, n0));
      for (let k = 0; k < counts.length; k++) {
        expect(counts[k]).toBe(counts[counts.length - 1 - k]);
        expect(Number.isInteger(counts[k]) && counts[k] >= 0).toBe(true);
      }
    }
  });
});

describe('standard normal functions against scipy.stats.norm (fixture)', () => {
  it('upper tail Q(z), relative error <= 1e-12', () => {
    for (const { z, sf } of reference.normal.sf) expectClose(normalUpperTail(z), sf, 1e-12, 1e-300);
  });

  it('quantile, error <= 1e-12 relative', () => {
    for (const { p, z } of reference.normal.ppf) expectClose(normalQuantile(p), z, 1e-12, 1e-14);
  });

  it('quantile ends and outside values', () => {
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
    expect(normalQuantile(1.5)).toBeNaN();
    expect(normalUpperTail(Number.NaN)).toBeNaN();
  });
});

describe('mannWhitneyU exact-size limit', () => {
  it('refuses a forced exact test above EXACT_FORCED_MAX_TOTAL values, naming the fix', () => {
    const a = Array.from({ length: 151 }, (_, i) => i);
    const b = Array.from({ length: 150 }, (_, i) => i + 0.5);
    expect(() => mannWhitneyU(a, b, { method: 'exact' })).toThrow(/limited to 300 values, got 301 — use method "normal" or "auto"/);
  });
});

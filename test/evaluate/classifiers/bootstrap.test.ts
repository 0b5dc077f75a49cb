/**
 * Bootstrap weights of the forest. Sources beside each check:
 * - [D] derived: digit counts, the binomial law of one row's count, Binomial(n, 1/n);
 * - [S] chi-square critical values from scipy 1.10.1 (Debian python3-scipy),
 *   scipy.stats.chi2.ppf(0.999, df): df 3 → 16.266, df 6 → 22.458.
 */
import { describe, expect, it } from 'vitest';
import { drawBootstrapCounts, drawsPerCall } from '../../../src/evaluate/classifiers/bootstrap.ts';
import { createRng } from '../../../src/shared/random.ts';

const CHI2_999 = { 3: 16.266, 6: 22.458 }; // [S] scipy.stats.chi2.ppf(0.999, df)

function chiSquare(observed: number[], expected: number[]): number {
  return observed.reduce((sum, o, i) => sum + (o - expected[i]) ** 2 / expected[i], 0);
}

/** P(K = k) for K ~ Binomial(n, p), by the closed form [D]. */
function binomialPmf(n: number, p: number, k: number): number {
  let c = 1;
  for (let i = 0; i < k; i++) c = (c * (n - i)) / (i + 1);
  return c * p ** k * (1 - p) ** (n - k);
}

describe('bootstrap counts', () => {
  it('draws per generator call: the largest k with n^k <= 2^32 [D]', () => {
    expect(drawsPerCall(96)).toBe(4); // 96^4 = 84,934,656; 96^5 > 2^32
    expect(drawsPerCall(7)).toBe(11); // 7^11 = 1,977,326,743; 7^12 > 2^32
    expect(drawsPerCall(2)).toBe(32);
    expect(drawsPerCall(65536)).toBe(2);
    expect(drawsPerCall(65537)).toBe(1);
    expect(drawsPerCall(1)).toBe(1);
  });

  it('n draws in all; one row is drawn once', () => {
    const rng = createRng(3);
    for (const n of [1, 2, 5, 96, 1000, 70000]) {
      const counts = new Int32Array(n);
      drawBootstrapCounts(rng, n, counts);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(n);
    }
    const one = Int32Array.of(5);
    drawBootstrapCounts(rng, 1, one);
    expect(Array.from(one)).toEqual([1]);
  });

  it('each row is drawn 1/n of the time: chi-square over 20,000 samples of 7 draws [D][S]', () => {
    // All 7 draws of a sample come from one generator call (7^7 < 2^32), so a digit
    // that is not uniform shows here.
    const rng = createRng(11);
    const counts = new Int32Array(7);
    const total = new Array<number>(7).fill(0);
    for (let t = 0; t < 20000; t++) {
      drawBootstrapCounts(rng, 7, counts);
      counts.forEach((c, i) => (total[i] += c));
    }
    expect(chiSquare(total, new Array<number>(7).fill(20000))).toBeLessThan(CHI2_999[6]);
  });

  for (const n of [7, 96]) {
    it(`a row's count follows Binomial(${n}, 1/${n}): chi-square over 0, 1, 2, 3+ [D][S]`, () => {
      // Digits of one call that were dependent would change this law: e.g. repeated digits
      // would inflate the counts of 2 and more.
      const rng = createRng(n);
      const counts = new Int32Array(n);
      const observed = [0, 0, 0, 0];
      const samples = 20000;
      for (let t = 0; t < samples; t++) {
        drawBootstrapCounts(rng, n, counts);
        for (let i = 0; i < n; i++) observed[Math.min(counts[i], 3)]++;
      }
      const cells = samples * n;
      const p = [0, 1, 2].map((k) => binomialPmf(n, 1 / n, k));
      const expected = [...p, 1 - p[0] - p[1] - p[2]].map((q) => q * cells);
      // Rows of one sample are dependent (their counts sum to n), so this is a screen, not
      // an exact test; the chi-square values seen are far below the bound.
      expect(chiSquare(observed, expected)).toBeLessThan(CHI2_999[3]);
    });
  }
});

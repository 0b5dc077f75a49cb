// Entropy and Jensen–Shannon statistical complexity (Rosso et al. 2007, Phys. Rev. Lett. 99,
// 154102) against scipy (fixture test/features/fixtures/entropy-reference.json, made by
// scripts/fixtures/features/entropy_reference.py with scipy.stats.entropy and
// scipy.spatial.distance.jensenshannon), Q0 values [D] and the random-walk values [D] of
// shared/REFERENCES.md, and the bounds of Martin, Plastino & Rosso (2006, Physica A 369, 439).
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  complexityBounds,
  complexityConstant,
  jensenShannonToUniform,
  normalizedEntropy,
  shannonEntropy,
  statisticalComplexity,
  transitionFeatures,
  type PlanePoint,
} from '../../src/features/index.ts';

interface Reference {
  distributions: {
    alphabetSize: number;
    kind: string;
    counts: number[];
    entropy: number;
    normalizedEntropy: number;
    jensenShannon: number;
    q0: number;
    complexity: number;
  }[];
  tables: { table: number[][]; transitionEntropy: number; conditionalEntropy: number; selfLoopFraction: number; outdegrees: number[] }[];
}
const reference = JSON.parse(readFileSync(new URL('./fixtures/entropy-reference.json', import.meta.url), 'utf8')) as Reference;
/** scipy and patternfold sum in different orders: agreement to 1e-12 absolute. */
const CLOSE = 1e-12;

describe('entropy and complexity against scipy', () => {
  it.each(reference.distributions.map((d) => [d.kind, d.alphabetSize, d] as const))('%s distribution over %i states', (_, M, d) => {
    expect(Math.abs(shannonEntropy(d.counts) - d.entropy)).toBeLessThan(CLOSE);
    expect(Math.abs(normalizedEntropy(d.counts, M) - d.normalizedEntropy)).toBeLessThan(CLOSE);
    expect(Math.abs(jensenShannonToUniform(d.counts, M) - d.jensenShannon)).toBeLessThan(CLOSE);
    expect(Math.abs(complexityConstant(M) - d.q0)).toBeLessThan(1e-9 * d.q0);
    expect(Math.abs(statisticalComplexity(d.counts, M) - d.complexity)).toBeLessThan(1e-10);
    // only the seen states need to be passed
    const seen = d.counts.filter((c) => c > 0);
    expect(Math.abs(statisticalComplexity(seen, M) - d.complexity)).toBeLessThan(1e-10);
  });

  it.each(reference.tables.map((t) => [t.table.length, t] as const))('transition network of a %i-node table', (size, t) => {
    const source: number[] = [];
    const target: number[] = [];
    const count: number[] = [];
    t.table.forEach((row, i) => row.forEach((c, j) => c > 0 && (source.push(i), target.push(j), count.push(c))));
    const features = transitionFeatures({ source: Int32Array.from(source), target: Int32Array.from(target), count: Float64Array.from(count) });
    expect(features).not.toBeNull();
    const mean = t.outdegrees.reduce((a, b) => a + b, 0) / t.outdegrees.length;
    const variance = t.outdegrees.reduce((a, d) => a + (d - mean) ** 2, 0) / t.outdegrees.length;
    expect(Math.abs(features!.transitionEntropy - t.transitionEntropy)).toBeLessThan(CLOSE);
    expect(Math.abs(features!.conditionalEntropy - t.conditionalEntropy)).toBeLessThan(CLOSE);
    expect(features!.selfLoopFraction).toBeCloseTo(t.selfLoopFraction, 14);
    expect(features!.outdegreeMean).toBeCloseTo(mean, 14);
    expect(features!.outdegreeVariance).toBeCloseTo(variance, 14);
  });

  it('no transition gives null; no count gives NaN', () => {
    expect(transitionFeatures({ source: new Int32Array(0), target: new Int32Array(0), count: new Float64Array(0) })).toBeNull();
    expect(shannonEntropy([])).toBeNaN();
    expect(statisticalComplexity([0, 0], 6)).toBeNaN();
  });
});

describe('published and derived values', () => {
  it.each([
    [6, 2.203067],
    [24, 1.651047],
    [120, 1.494734],
    [720, 1.453735],
  ])('Q0 for %i states = %f [D]', (M, q0) => {
    expect(Math.abs(complexityConstant(M) - q0)).toBeLessThan(5e-7);
  });

  it('C = 0 at the uniform and at a one-pattern distribution [D]', () => {
    for (const M of [6, 24, 120, 720, 5040]) {
      expect(statisticalComplexity(new Array(M).fill(3), M)).toBeLessThan(1e-13); // rounding of sums over M terms
      expect(statisticalComplexity([9], M)).toBe(0);
    }
  });

  it('random walk, m = 3: probabilities 1/4, 1/8 x 4, 1/4 give (H, C) = (0.967132, 0.030602) [D]', () => {
    const counts = [2, 1, 1, 1, 1, 2];
    expect(Math.abs(normalizedEntropy(counts, 6) - 0.967132)).toBeLessThan(5e-7);
    expect(Math.abs(statisticalComplexity(counts, 6) - 0.030602)).toBeLessThan(5e-7);
  });
});

describe('complexity bounds (Martin, Plastino & Rosso 2006)', () => {
  it('order 3: the maximum curve peaks near C = 0.2915 at H = 0.613 [D]', () => {
    const { max } = complexityBounds(3, 2000);
    const top = max.reduce((a, p) => (p.c > a.c ? p : a));
    expect(Math.abs(top.c - 0.2915)).toBeLessThan(5e-5);
    expect(Math.abs(top.h - 0.613)).toBeLessThan(5e-4);
  });

  it('curves run from (0, 0) to (1, 0), sorted by entropy', () => {
    for (const order of [2, 3, 5, 9]) {
      const { min, max } = complexityBounds(order, 300);
      for (const curve of [min, max]) {
        expect(curve[0].h).toBeLessThan(1e-12);
        expect(curve[curve.length - 1].h).toBeCloseTo(1, 12);
        expect(curve[curve.length - 1].c).toBeLessThan(1e-12);
        for (let i = 1; i < curve.length; i++) expect(curve[i].h).toBeGreaterThanOrEqual(curve[i - 1].h);
      }
    }
  });

  const interpolate = (curve: PlanePoint[], h: number): number => {
    const i = curve.findIndex((p) => p.h >= h);
    if (i <= 0) return curve[Math.max(i, 0)].c;
    const a = curve[i - 1];
    const b = curve[i];
    return b.h === a.h ? Math.max(a.c, b.c) : a.c + ((b.c - a.c) * (h - a.h)) / (b.h - a.h);
  };

  it('every distribution over 3! or 4! patterns lies between the curves (property, fast-check)', () => {
    const bounds = { 3: complexityBounds(3, 4000), 4: complexityBounds(4, 4000) };
    fc.assert(
      fc.property(
        fc.constantFrom(3 as const, 4 as const).chain((order) =>
          fc.tuple(fc.constant(order), fc.array(fc.nat({ max: 100 }), { minLength: order === 3 ? 6 : 24, maxLength: order === 3 ? 6 : 24 })),
        ),
        ([order, counts]) => {
          fc.pre(counts.some((c) => c > 0));
          const M = order === 3 ? 6 : 24;
          const h = normalizedEntropy(counts, M);
          const c = statisticalComplexity(counts, M);
          // the sampled curves are piecewise linear; 2e-3 covers the chord error
          expect(c).toBeLessThanOrEqual(interpolate(bounds[order].max, h) + 2e-3);
          expect(c).toBeGreaterThanOrEqual(interpolate(bounds[order].min, h) - 2e-3);
        },
      ),
      { numRuns: 500 },
    );
  });
});

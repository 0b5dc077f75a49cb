// Logistic map x -> 4x(1-x): allowed and forbidden ordinal patterns.
// [S] OEIS A193284/A193285 citing Elizalde & Liu (2011), Discrete Appl. Math. 159, 1207, and
// Amigó, Zambrano & Sanjuán (2007), EPL 79, 50001: 5, 12, 31, 75, 178 allowed patterns for
// orders 3..7; the forbidden pattern of order 3 is the strictly falling one.
// The orbit is generated through the conjugacy with the doubling map (x = sin^2(pi theta),
// theta -> 2 theta mod 1), reading theta_t as 53 bits of a seeded random bit stream shifted t
// places: an exact orbit up to 2^-53 in theta, which avoids the collapse of a floating-point
// orbit of 4x(1-x) onto 0 (shared/REFERENCES.md warns about it).
import { describe, expect, it } from 'vitest';
import { countOrdinalPatterns, ordinalPatternCode, ordinalPatternFromCode } from '../../src/features/index.ts';
import { createRng } from '../../src/shared/random.ts';

function logisticOrbit(length: number, seed: number): Float64Array {
  const rng = createRng(seed);
  const bit = (): number => (rng.next() < 0.5 ? 0 : 1);
  let theta = 0;
  for (let i = 0; i < 53; i++) theta = theta / 2 + bit() / 2; // 53 random bits
  const x = new Float64Array(length);
  for (let t = 0; t < length; t++) {
    x[t] = Math.sin(Math.PI * theta) ** 2;
    theta = 2 * theta;
    if (theta >= 1) theta -= 1;
    theta += bit() * 2 ** -53; // next bit enters at the last place: exact in binary64
  }
  return x;
}

describe('logistic map at r = 4', () => {
  const x = logisticOrbit(2_000_000, 2011);

  it('the orbit follows 4x(1-x) up to rounding', () => {
    let worst = 0;
    for (let t = 0; t < 1000; t++) worst = Math.max(worst, Math.abs(x[t + 1] - 4 * x[t] * (1 - x[t])));
    expect(worst).toBeLessThan(1e-12);
  });

  it.each([
    [3, 5],
    [4, 12],
    [5, 31],
    [6, 75],
    [7, 178],
  ])('order %i: %i allowed patterns [S]', (order, allowed) => {
    const { counts } = countOrdinalPatterns(x, order, 1);
    expect(counts.filter((c) => c > 0).length).toBe(allowed);
  });

  it('order 3: the only forbidden pattern is the strictly falling one [S]', () => {
    const { counts } = countOrdinalPatterns(x, 3, 1);
    const missing = [...counts.keys()].filter((code) => counts[code] === 0);
    expect(missing).toEqual([ordinalPatternCode([3, 2, 1])]);
    expect(ordinalPatternFromCode(missing[0], 3)).toEqual([2, 1, 0]);
  });

  it('order 3 probabilities 1/3, 1/15, 2/15, 1/5, 4/15 [D], within 5 standard errors', () => {
    const { counts, validWindows } = countOrdinalPatterns(x, 3, 1);
    const expected: Record<string, number> = { '0,1,2': 1 / 3, '0,2,1': 1 / 15, '1,0,2': 2 / 15, '1,2,0': 1 / 5, '2,0,1': 4 / 15 };
    for (const [key, p] of Object.entries(expected)) {
      const code = [...counts.keys()].find((c) => (ordinalPatternFromCode(c, 3) as number[]).join(',') === key) as number;
      const standardError = Math.sqrt((p * (1 - p)) / validWindows);
      expect(Math.abs(counts[code] / validWindows - p)).toBeLessThan(5 * standardError);
    }
  });
});

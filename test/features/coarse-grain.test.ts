// Coarse-graining (Costa, Goldberger & Peng 2002, Phys. Rev. Lett. 89, 068102) and its shifted
// forms (Wu et al. 2013, Entropy 15, 1069) against numpy: fixture
// test/features/fixtures/coarse-grain.json, made by scripts/fixtures/features/coarse_grain.py
// (x[k : k + s*L].reshape(L, s).mean(axis=1)). numpy sums blocks of 8 or more values
// pairwise, so agreement is to 4 ulp of the block's scale, not bit for bit.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { coarseGrain } from '../../src/features/index.ts';

interface Case {
  name: string;
  scale: number;
  offset: number;
  x: (number | null)[];
  y: (number | null)[];
}
const fixture = JSON.parse(readFileSync(new URL('./fixtures/coarse-grain.json', import.meta.url), 'utf8')) as { cases: Case[] };
const toArray = (values: (number | null)[]): Float64Array => Float64Array.from(values, (v) => (v === null ? NaN : v));

describe('coarseGrain against numpy', () => {
  it.each(fixture.cases.map((c) => [c.name, c.scale, c.offset, c] as const))('%s, scale %i, offset %i', (_, scale, offset, c) => {
    const x = toArray(c.x);
    const copy = x.slice();
    const y = coarseGrain(x, scale, offset);
    expect(y.length).toBe(c.y.length);
    c.y.forEach((expected, j) => {
      if (expected === null) {
        expect(y[j]).toBeNaN();
      } else {
        let blockScale = 0;
        for (let i = 0; i < scale; i++) blockScale = Math.max(blockScale, Math.abs(x[offset + j * scale + i]));
        expect(Math.abs(y[j] - expected)).toBeLessThanOrEqual(4 * Number.EPSILON * blockScale);
      }
    });
    expect(x).toEqual(copy);
  });
});

describe('coarseGrain edge cases (definition of shared/DESIGN.md)', () => {
  it('scale 1 returns an equal copy, not the same array', () => {
    const x = Float64Array.of(1, NaN, 3);
    const y = coarseGrain(x, 1);
    expect(y).not.toBe(x);
    expect(Array.from(y)).toEqual([1, NaN, 3]);
  });

  it('doc examples: (1..5) at scale 2 gives [1.5, 3.5], at offset 1 [2.5, 4.5]', () => {
    expect(Array.from(coarseGrain(Float64Array.of(1, 2, 3, 4, 5), 2))).toEqual([1.5, 3.5]);
    expect(Array.from(coarseGrain(Float64Array.of(1, 2, 3, 4, 5), 2, 1))).toEqual([2.5, 4.5]);
  });

  it('empty or too short input gives an empty array', () => {
    expect(coarseGrain(new Float64Array(0), 3).length).toBe(0);
    expect(coarseGrain(Float64Array.of(1, 2), 3).length).toBe(0);
    expect(coarseGrain(Float64Array.of(1, 2), 3, 2).length).toBe(0);
  });

  it('rejects a bad scale or offset with a message naming it', () => {
    expect(() => coarseGrain(Float64Array.of(1), 0)).toThrow('coarseGrain: scale must be an integer >= 1, got 0');
    expect(() => coarseGrain(Float64Array.of(1), 2, 2)).toThrow('coarseGrain: offset must be an integer in [0, 1], got 2');
  });
});

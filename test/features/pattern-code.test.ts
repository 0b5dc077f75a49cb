// The pattern and symbol codes: bijections checked by enumeration [D], and the ordered Bell
// numbers (OEIS A000670: 1, 3, 13, 75, 541, 4683, 47293, 545835, 7087261 [M]) confirmed here
// by counting the distinct symbols that windows of all weak orderings produce [D].
import { describe, expect, it } from 'vitest';
import {
  factorial,
  orderedBellNumber,
  ordinalPatternCode,
  ordinalPatternFromCode,
  ordinalSymbolCode,
  ordinalSymbolFromCode,
  successorPatternCode,
  symbolCodeSpace,
} from '../../src/features/index.ts';

/** All sequences of length m over 0..m-1 (covers every weak ordering and, with distinct values, every permutation). */
function* words(m: number): Generator<number[]> {
  const w = new Array<number>(m).fill(0);
  for (;;) {
    yield w.slice();
    let i = m - 1;
    while (i >= 0 && w[i] === m - 1) w[i--] = 0;
    if (i < 0) return;
    w[i]++;
  }
}

describe('factorial', () => {
  it('0! .. 9! and 18! (exact), NaN outside the domain', () => {
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 9].map(factorial)).toEqual([1, 1, 2, 6, 24, 120, 720, 5040, 40320, 362880]);
    expect(factorial(18)).toBe(6402373705728000);
    expect(factorial(-1)).toBeNaN();
    expect(factorial(2.5)).toBeNaN();
  });
});

describe('ordinal pattern code', () => {
  it.each([2, 3, 4, 5, 6, 7])('order %i: code -> pattern -> code is the identity on 0..m!-1', (m) => {
    const seen = new Set<string>();
    for (let code = 0; code < factorial(m); code++) {
      const pattern = ordinalPatternFromCode(code, m) as number[];
      // a window whose sorting permutation is `pattern`: sample pattern[r] gets value r
      const window = new Array<number>(m);
      pattern.forEach((sample, r) => (window[sample] = r));
      expect(ordinalPatternCode(window)).toBe(code);
      seen.add(pattern.join(','));
    }
    expect(seen.size).toBe(factorial(m));
  });

  it('doc examples: rising 5, falling 0 for order 3; invalid input', () => {
    expect(ordinalPatternCode([4, 7, 9])).toBe(5);
    expect(ordinalPatternCode([9, 7, 4])).toBe(0);
    expect(ordinalPatternFromCode(0, 3)).toEqual([2, 1, 0]);
    expect(ordinalPatternFromCode(5, 3)).toEqual([0, 1, 2]);
    expect(ordinalPatternCode([1, NaN])).toBe(-1);
    expect(ordinalPatternFromCode(6, 3)).toBeNull();
  });

  it('ties rank the earlier sample lower (a stable sort)', () => {
    expect(ordinalPatternCode([2, 2, 2])).toBe(ordinalPatternCode([1, 2, 3]));
    expect(ordinalPatternFromCode(ordinalPatternCode([5, 1, 5]), 3)).toEqual([1, 0, 2]);
  });

  it('successor codes match the code of the shifted window, for every window of order 4 and new rank', () => {
    for (const w of words(4)) {
      if (new Set(w).size < 4) continue;
      for (const next of [-1, 0.5, 1.5, 2.5, 9]) {
        const rank = w.slice(1).filter((v) => v <= next).length;
        expect(successorPatternCode(ordinalPatternCode(w), 4, rank)).toBe(ordinalPatternCode([...w.slice(1), next]));
      }
    }
  });
});

describe('ordinal symbol code (ties as symbols)', () => {
  it.each([
    [2, 3],
    [3, 13],
    [4, 75],
    [5, 541],
    [6, 4683],
  ])('order %i: %i distinct symbols, each decoding back to its dense ranks [M, D]', (m, bell) => {
    expect(orderedBellNumber(m)).toBe(bell);
    const codes = new Set<number>();
    for (const w of words(m)) {
      const code = ordinalSymbolCode(w);
      expect(code).toBeGreaterThanOrEqual(0);
      expect(code).toBeLessThan(symbolCodeSpace(m));
      const distinct = [...new Set(w)].sort((a, b) => a - b);
      expect(ordinalSymbolFromCode(code, m)).toEqual(w.map((v) => distinct.indexOf(v)));
      codes.add(code);
    }
    expect(codes.size).toBe(bell);
  });

  it('ordered Bell numbers of orders 7..9 [M]', () => {
    expect([7, 8, 9].map(orderedBellNumber)).toEqual([47293, 545835, 7087261]);
  });
});

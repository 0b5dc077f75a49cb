/**
 * Westfall & Young (1993) step-down max-T adjusted p-values: a hand-worked example [D], a
 * brute-force oracle of the step-down definition, and the invariants adjusted >= raw,
 * monotone in the observed score, <= 1 (fast-check).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { gridCellsOf, rawCellPValues, westfallYoungMaxT } from '../../../src/evaluate/grid-scan.ts';

/** The step-down definition written out plainly: for cell c, count permutations whose max over all cells scoring at most t_c reaches t_c. */
function oracle(observed: number[], nulls: number[][]): number[] {
  const order = observed.map((_, i) => i).sort((a, b) => observed[b] - observed[a] || a - b);
  const raw = order.map((c, rank) => {
    const rest = order.slice(rank);
    const b = nulls.filter((row) => Math.max(...rest.map((j) => row[j])) >= observed[c]).length;
    return (1 + b) / (1 + nulls.length);
  });
  const out = new Array<number>(observed.length);
  let running = 0;
  order.forEach((c, rank) => {
    running = Math.max(running, raw[rank]);
    out[c] = running;
  });
  return out;
}

describe('westfallYoungMaxT', () => {
  it('hand-worked example: observed [0.9, 0.6], null [[0.7, 0.8], [0.5, 0.65]] -> [1/3, 1] [D]', () => {
    expect(Array.from(westfallYoungMaxT([0.9, 0.6], [[0.7, 0.8], [0.5, 0.65]]))).toEqual([1 / 3, 1]);
    expect(Array.from(rawCellPValues([0.9, 0.6], [[0.7, 0.8], [0.5, 0.65]]))).toEqual([1 / 3, 1]);
  });

  it('equals the raw p-value for a single cell', () => {
    expect(Array.from(westfallYoungMaxT([0.7], [[0.6], [0.8], [0.7]]))).toEqual(Array.from(rawCellPValues([0.7], [[0.6], [0.8], [0.7]])));
  });

  const scores = fc.float({ min: 0, max: 1, noNaN: true });
  const problem = fc.integer({ min: 1, max: 6 }).chain((C) =>
    fc.record({
      observed: fc.array(scores, { minLength: C, maxLength: C }),
      nulls: fc.array(fc.array(scores, { minLength: C, maxLength: C }), { minLength: 0, maxLength: 40 }),
    }),
  );

  it('matches the brute-force step-down oracle and satisfies adjusted >= raw, monotone, <= 1', () => {
    fc.assert(
      fc.property(problem, ({ observed, nulls }) => {
        const adjusted = westfallYoungMaxT(observed, nulls);
        const raw = rawCellPValues(observed, nulls);
        const expected = oracle(observed, nulls);
        for (let c = 0; c < observed.length; c++) {
          expect(adjusted[c]).toBeCloseTo(expected[c], 12);
          expect(adjusted[c]).toBeGreaterThanOrEqual(raw[c]);
          expect(adjusted[c]).toBeLessThanOrEqual(1);
          for (let d = 0; d < observed.length; d++) if (observed[c] > observed[d]) expect(adjusted[c]).toBeLessThanOrEqual(adjusted[d]);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('leaves a cell with a NaN observed score out', () => {
    const adjusted = westfallYoungMaxT([NaN, 0.8], [[0.9, 0.5]]);
    expect(adjusted[0]).toBeNaN();
    expect(adjusted[1]).toBe(1 / 2);
  });
});

describe('gridCellsOf', () => {
  it('groups columns by (order, delay, scale), sorted', () => {
    const cells = gridCellsOf([
      { feature: 'a', order: 4, delay: 1, scale: 1 },
      { feature: 'a', order: 3, delay: 1, scale: 1 },
      { feature: 'b', order: 3, delay: 1, scale: 1 },
    ]);
    expect(cells.map((c) => [c.order, Array.from(c.columns)])).toEqual([
      [3, [1, 2]],
      [4, [0]],
    ]);
  });
});

import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { projectSubjects, standardiseColumns } from '../../src/report/projection.ts';
import type { GroupIndex } from '../../src/report/types.ts';

interface Case {
  name: string;
  rows: (number | null)[][];
  expected: { scores: [number, number][]; explained: [number, number]; usedColumns: number };
}

const reference = JSON.parse(readFileSync(new URL('./fixtures/pca-reference.json', import.meta.url), 'utf8')) as { cases: Case[] };

function inputOf(rows: (number | null)[][]) {
  return {
    subjects: rows.map((_, i) => `s${i}`),
    groups: rows.map((_, i) => (i % 2) as GroupIndex),
    columns: rows[0].map((_, j) => `c${j}`),
    rows,
  };
}

// Tolerance: 1e-9 absolute, far below display precision and far above SVD round-off here.
const TOL = 1e-9;

describe('projectSubjects', () => {
  for (const c of reference.cases) {
    it(`matches numpy's SVD on ${c.name} (fixture from scripts/fixtures/report-pca.py)`, () => {
      const frozen = structuredClone(c.rows);
      const p = projectSubjects(inputOf(c.rows));
      expect(p).not.toBeNull();
      expect(p!.usedColumns).toBe(c.expected.usedColumns);
      expect(p!.explained[0]).toBeCloseTo(c.expected.explained[0], 9);
      expect(p!.explained[1]).toBeCloseTo(c.expected.explained[1], 9);
      p!.scores.forEach((s, i) => {
        expect(Math.abs(s[0] - c.expected.scores[i][0])).toBeLessThan(TOL);
        expect(Math.abs(s[1] - c.expected.scores[i][1])).toBeLessThan(TOL);
      });
      expect(c.rows).toEqual(frozen); // input not mutated
    });
  }

  it('two standardised columns with correlation r explain (1 + r)/2 and (1 − r)/2 [D: eigenvalues of [[1, r], [r, 1]] are 1 ± r]', () => {
    const x = [1, 2, 3, 4, 5, 6];
    const y = [2, 1, 4, 3, 6, 8];
    const mx = 3.5, my = 4;
    const sxy = x.reduce((a, v, i) => a + (v - mx) * (y[i] - my), 0);
    const sxx = x.reduce((a, v) => a + (v - mx) ** 2, 0);
    const syy = y.reduce((a, v) => a + (v - my) ** 2, 0);
    const r = sxy / Math.sqrt(sxx * syy);
    const p = projectSubjects(inputOf(x.map((v, i) => [v, y[i]])))!;
    expect(p.explained[0]).toBeCloseTo((1 + r) / 2, 12);
    expect(p.explained[1]).toBeCloseTo((1 - r) / 2, 12);
  });

  it('returns null for fewer than three subjects or no usable column', () => {
    expect(projectSubjects(inputOf([[1], [2]]))).toBeNull();
    expect(projectSubjects(inputOf([[1, null], [1, null], [1, 5]]))).toBeNull();
  });

  it('drops constant and empty columns and fills missing values with the column median', () => {
    const { matrix, kept } = standardiseColumns([[1, 7, null], [2, 7, null], [null, 7, 1], [5, 7, null]], 3);
    expect(kept).toBe(1);
    // column 0: [1, 2, median(1, 2, 5) = 2, 5], mean 2.5, sample SD sqrt(3) [D]
    const sd = Math.sqrt(3);
    expect(matrix.map((r) => r[0])).toEqual([(1 - 2.5) / sd, (2 - 2.5) / sd, (2 - 2.5) / sd, (5 - 2.5) / sd].map((v) => expect.closeTo(v, 12)));
  });
});

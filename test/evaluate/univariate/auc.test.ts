import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { aucFromScores, aucWithInterval } from '../../../src/evaluate/auc.ts';
import { expectClose } from './helpers.ts';

/** Hanley & McNeil (1982), Radiology 143, 29: CT ratings 1..5 of 58 normal and 51 abnormal cases [S via secondary sources]. */
function hanleyMcNeilData(): { scores: number[]; labels: number[] } {
  const scores: number[] = [];
  const labels: number[] = [];
  const add = (counts: number[], label: number) =>
    counts.forEach((count, k) => {
      for (let i = 0; i < count; i++) {
        scores.push(k + 1);
        labels.push(label);
      }
    });
  add([33, 6, 6, 11, 2], 0);
  add([3, 2, 2, 11, 33], 1);
  return { scores, labels };
}

/** Brute-force oracle: share of (positive, negative) pairs ordered correctly, ties 1/2. */
function brutePairAuc(scores: number[], labels: number[]): number {
  let sum = 0;
  let pairs = 0;
  for (let i = 0; i < scores.length; i++) {
    if (labels[i] !== 1) continue;
    for (let j = 0; j < scores.length; j++) {
      if (labels[j] !== 0) continue;
      pairs++;
      sum += scores[i] > scores[j] ? 1 : scores[i] === scores[j] ? 0.5 : 0;
    }
  }
  return sum / pairs;
}

/** Brute-force DeLong et al. (1988) SE from the structural components V10, V01 (their eqs. for ψ). */
function bruteDelongSe(scores: number[], labels: number[]): number {
  const pos = scores.filter((_, i) => labels[i] === 1);
  const neg = scores.filter((_, i) => labels[i] === 0);
  const psi = (x: number, y: number) => (x > y ? 1 : x === y ? 0.5 : 0);
  const v10 = pos.map((x) => neg.reduce((s, y) => s + psi(x, y), 0) / neg.length);
  const v01 = neg.map((y) => pos.reduce((s, x) => s + psi(x, y), 0) / pos.length);
  const variance = (v: number[]) => {
    const m = v.reduce((a, b) => a + b, 0) / v.length;
    return v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1);
  };
  return Math.sqrt(variance(v10) / pos.length + variance(v01) / neg.length);
}

const scoresAndLabels = fc
  .array(fc.record({ score: fc.oneof(fc.integer({ min: 0, max: 5 }), fc.double({ min: -1e6, max: 1e6, noNaN: true })), label: fc.constantFrom(0, 1) }), {
    minLength: 2,
    maxLength: 60,
  })
  .filter((rows) => rows.some((r) => r.label === 1) && rows.some((r) => r.label === 0));

describe('aucFromScores', () => {
  it('Hanley & McNeil (1982) CT ratings: AUC 0.893171 [D from the published table; paper 0.893]', () => {
    const { scores, labels } = hanleyMcNeilData();
    expectClose(aucFromScores(scores, labels), 0.893171, 0, 5e-7);
  });

  it('doc example: 0.75 (3 of 4 pairs ordered, counted by hand)', () => {
    expect(aucFromScores([0.1, 0.4, 0.35, 0.8], [0, 0, 1, 1])).toBe(0.75);
  });

  it('equals U/(n1 n0) by brute-force pair count on random data (property)', () => {
    fc.assert(
      fc.property(scoresAndLabels, (rows) => {
        const scores = rows.map((r) => r.score);
        const labels = rows.map((r) => r.label);
        expectClose(aucFromScores(scores, labels), brutePairAuc(scores, labels), 1e-12, 1e-12);
      }),
    );
  });

  it('is NaN when a class is empty or a score is NaN', () => {
    expect(aucFromScores([1, 2], [1, 1])).toBeNaN();
    expect(aucFromScores([], [])).toBeNaN();
    expect(aucFromScores([1, Number.NaN, 3], [0, 1, 1])).toBeNaN();
  });

  it('rejects labels other than 0/1 and unequal lengths, naming the problem', () => {
    expect(() => aucFromScores([1, 2], [0, 2])).toThrow(/label 2 at position 1 — labels must be 0 \(negative\) or 1 \(positive\)/);
    expect(() => aucFromScores([1, 2, 3], [0, 1])).toThrow(/3 scores but 2 labels/);
  });
});

describe('aucWithInterval', () => {
  it('Hanley & McNeil (1982) CT ratings: DeLong SE 0.030724 [D]', () => {
    const { scores, labels } = hanleyMcNeilData();
    const r = aucWithInterval(scores, labels);
    expectClose(r.auc, 0.893171, 0, 5e-7);
    expectClose(r.se, 0.030724, 0, 5e-7);
    // Plain Wald interval: 0.893171 ± 1.959964 × 0.030724 [D arithmetic].
    expectClose(r.low, 0.893171 - 1.959964 * 0.030724, 0, 2e-6);
    expectClose(r.high, 0.893171 + 1.959964 * 0.030724, 0, 2e-6);
  });

  it('matches the brute-force DeLong structural components on random data (property)', () => {
    const twoPerClass = scoresAndLabels.filter(
      (rows) => rows.filter((r) => r.label === 1).length >= 2 && rows.filter((r) => r.label === 0).length >= 2,
    );
    fc.assert(
      fc.property(twoPerClass, (rows) => {
        const scores = rows.map((r) => r.score);
        const labels = rows.map((r) => r.label);
        expectClose(aucWithInterval(scores, labels).se, bruteDelongSe(scores, labels), 1e-9, 1e-12);
      }),
    );
  });

  it('doc example, clipped at 1 [D: structural components by hand]', () => {
    const r = aucWithInterval([1, 2, 3, 4, 5, 6], [0, 0, 1, 0, 1, 1]);
    expectClose(r.auc, 8 / 9, 1e-15);
    // V10 = (2/3, 1, 1), V01 = (1, 1, 2/3): both sample variances 1/27, so SE² = 2/81.
    expectClose(r.se, Math.sqrt(2 / 81), 1e-12);
    expectClose(r.low, 8 / 9 - 1.959963984540054 * Math.sqrt(2 / 81), 1e-12);
    expect(r.high).toBe(1);
  });

  it('widens with the level', () => {
    const { scores, labels } = hanleyMcNeilData();
    const narrow = aucWithInterval(scores, labels, 0.8);
    const wide = aucWithInterval(scores, labels, 0.99);
    expect(wide.high - wide.low).toBeGreaterThan(narrow.high - narrow.low);
  });

  it('gives NaN SE and interval with one member in a class, all NaN with an empty class', () => {
    const one = aucWithInterval([1, 2, 3], [0, 0, 1]);
    expect(one.auc).toBe(1);
    expect([one.se, one.low, one.high].every(Number.isNaN)).toBe(true);
    const none = aucWithInterval([1, 2], [0, 0]);
    expect([none.auc, none.se, none.low, none.high].every(Number.isNaN)).toBe(true);
  });

  it('rejects a level outside (0, 1)', () => {
    expect(() => aucWithInterval([1, 2], [0, 1], 1)).toThrow(/level must lie in \(0, 1\), got 1/);
  });
});

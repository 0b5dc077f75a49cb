import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rocCurve } from '../../../src/evaluate/roc.ts';

/** Area under a polyline by the trapezoid rule. */
function trapezoid(points: { fpr: number; tpr: number }[]): number {
  let area = 0;
  for (let i = 1; i < points.length; i++) area += ((points[i].fpr - points[i - 1].fpr) * (points[i].tpr + points[i - 1].tpr)) / 2;
  return area;
}

/** Brute-force Mann–Whitney AUC: share of (positive, negative) pairs ordered correctly, ties 1/2. */
function pairAuc(scores: number[], labels: number[]): number {
  let wins = 0;
  let pairs = 0;
  for (let i = 0; i < scores.length; i++)
    for (let j = 0; j < scores.length; j++)
      if (labels[i] === 1 && labels[j] === 0) {
        pairs++;
        wins += scores[i] > scores[j] ? 1 : scores[i] === scores[j] ? 0.5 : 0;
      }
  return wins / pairs;
}

describe('rocCurve', () => {
  it('gives the hand-worked points of the doc example [D]', () => {
    expect(rocCurve([0.9, 0.4, 0.6], [1, 0, 1])).toEqual([
      { fpr: 0, tpr: 0 },
      { fpr: 0, tpr: 0.5 },
      { fpr: 0, tpr: 1 },
      { fpr: 1, tpr: 1 },
    ]);
  });

  it('has area equal to the Mann–Whitney AUC, ties included (Bamber 1975, J. Math. Psychol. 12, 387) [S]', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 5 }), fc.integer({ min: 0, max: 1 })), { minLength: 2, maxLength: 40 }), (pairs) => {
        const scores = pairs.map((p) => p[0]);
        const labels = pairs.map((p) => p[1]);
        fc.pre(labels.includes(0) && labels.includes(1));
        expect(trapezoid(rocCurve(scores, labels))).toBeCloseTo(pairAuc(scores, labels), 12);
      }),
    );
  });

  it('returns no curve when a class is empty', () => {
    expect(rocCurve([0.1, 0.2], [1, 1])).toEqual([]);
  });
});

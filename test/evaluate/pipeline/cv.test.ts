/**
 * Fold assignment invariants (property tests with fast-check): stratification (Kohavi 1995:
 * each fold holds floor or ceil of each group's share), subject grouping (all recordings of
 * a subject in one fold), determinism under a seed, and the error for too few subjects.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { indexSubjects, repeatedSubjectFolds, rowFolds, stratifiedSubjectFolds } from '../../../src/evaluate/cv.ts';
import { InputError } from '../../../src/shared/errors.ts';

const study = fc
  .record({ folds: fc.integer({ min: 2, max: 10 }), extra0: fc.integer({ min: 0, max: 30 }), extra1: fc.integer({ min: 0, max: 30 }), seed: fc.integer({ min: 0, max: 2 ** 31 }) })
  .chain((r) =>
    fc.record({
      folds: fc.constant(r.folds),
      seed: fc.constant(r.seed),
      n0: fc.constant(r.folds + r.extra0),
      n1: fc.constant(r.folds + r.extra1),
      recordings: fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 2 * r.folds + r.extra0 + r.extra1, maxLength: 2 * r.folds + r.extra0 + r.extra1 }),
    }),
  );

function rowsOf(n0: number, recordings: number[]): { subjects: string[]; labels: Uint8Array } {
  const subjects: string[] = [];
  const labels: number[] = [];
  recordings.forEach((k, s) => {
    for (let r = 0; r < k; r++) {
      subjects.push(`s${s}`);
      labels.push(s < n0 ? 0 : 1);
    }
  });
  // interleave rows so that a subject's recordings are not adjacent
  const order = subjects.map((_, i) => i).sort((a, b) => (a % 3) - (b % 3) || a - b);
  return { subjects: order.map((i) => subjects[i]), labels: Uint8Array.from(order.map((i) => labels[i])) };
}

describe('stratified, subject-grouped folds', () => {
  it('keep every subject in one fold and balance each group over the folds', () => {
    fc.assert(
      fc.property(study, ({ folds, seed, n0, n1, recordings }) => {
        const rows = rowsOf(n0, recordings);
        const subjects = indexSubjects(rows.subjects, rows.labels);
        const subjectFold = stratifiedSubjectFolds(subjects.labels, folds, seed);
        const rowFold = rowFolds(subjectFold, subjects.ofRow);
        const foldOfSubject = new Map<string, number>();
        rows.subjects.forEach((s, r) => {
          const seen = foldOfSubject.get(s);
          if (seen !== undefined) expect(rowFold[r]).toBe(seen);
          foldOfSubject.set(s, rowFold[r]);
        });
        for (const [g, n] of [[0, n0], [1, n1]] as const) {
          const perFold = new Array<number>(folds).fill(0);
          subjects.labels.forEach((l, s) => {
            if (l === g) perFold[subjectFold[s]]++;
          });
          for (const count of perFold) {
            expect(count).toBeGreaterThanOrEqual(Math.floor(n / folds));
            expect(count).toBeLessThanOrEqual(Math.ceil(n / folds));
          }
        }
        const sizes = new Array<number>(folds).fill(0);
        subjectFold.forEach((f) => sizes[f]++);
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      }),
      { numRuns: 200 },
    );
  });

  it('are identical under the same seed and differ between repeats', () => {
    fc.assert(
      fc.property(study, ({ folds, seed, n0, recordings }) => {
        const rows = rowsOf(n0, recordings);
        const labels = indexSubjects(rows.subjects, rows.labels).labels;
        const a = repeatedSubjectFolds(labels, folds, 3, seed);
        const b = repeatedSubjectFolds(labels, folds, 3, seed);
        expect(a).toEqual(b);
        // repeat r is independent of how many repeats run
        expect(repeatedSubjectFolds(labels, folds, 1, seed)[0]).toEqual(a[0]);
      }),
      { numRuns: 100 },
    );
    const labels = Uint8Array.from({ length: 40 }, (_, i) => i % 2);
    const [r0, r1] = repeatedSubjectFolds(labels, 5, 2, 9);
    expect(r0).not.toEqual(r1);
  });

  it('refuse a group smaller than the number of folds, suggesting fewer folds', () => {
    const labels = Uint8Array.from([0, 0, 0, 1, 1, 1, 1, 1, 1]);
    expect(() => stratifiedSubjectFolds(labels, 5, 1)).toThrow(InputError);
    expect(() => stratifiedSubjectFolds(labels, 5, 1)).toThrow(
      'settings folds: group "0" has 3 subject(s), fewer than the 5 folds, so some folds would have none of it — use folds: 3 or fewer',
    );
  });

  it('refuse a subject whose recordings are in both groups', () => {
    expect(() => indexSubjects(['a', 'b', 'a'], Uint8Array.from([0, 1, 1]))).toThrow('subject "a" has rows in both groups');
  });
});

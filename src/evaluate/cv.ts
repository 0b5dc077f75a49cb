/**
 * Fold assignment for cross-validation: stratified by group, grouped by subject, repeated
 * with seeded splits.
 *
 * A subject's rows always share a fold, so no subject is ever both trained on and tested on
 * (grouped k-fold; Varma & Simon 2006, BMC Bioinformatics 7, 91, on why anything that sees
 * test subjects biases the estimate). Within each group the subjects are shuffled with a
 * seeded generator and dealt round-robin over the folds, continuing where the previous group
 * stopped, so every fold holds floor or ceil of each group's share of subjects (stratified
 * k-fold, Kohavi 1995, IJCAI, p. 1137).
 */
import { InputError } from '../shared/errors.ts';
import { createRng, deriveSeed, shuffleInPlace } from '../shared/random.ts';

/** Rows reduced to subjects: which subject each row belongs to and each subject's group. */
export interface SubjectIndex {
  /** Subject names in order of first appearance. */
  names: string[];
  /** Subject number (index into `names`) of every row. */
  ofRow: Int32Array;
  /** Group label (0/1) of every subject. */
  labels: Uint8Array;
}

/**
 * Collapses rows to subjects. Every row of a subject must carry the same label.
 *
 * Throws InputError when a subject's rows carry both labels or when lengths disagree.
 * Example: subjects ['a','a','b'], labels [0,0,1] -> names ['a','b'], ofRow [0,0,1], labels [0,1].
 */
export function indexSubjects(subjects: readonly string[], rowLabels: Uint8Array): SubjectIndex {
  if (subjects.length !== rowLabels.length) {
    throw new InputError(
      `feature matrix: ${subjects.length} subject names but ${rowLabels.length} labels — give one subject and one label per row`,
    );
  }
  const number = new Map<string, number>();
  const names: string[] = [];
  const labels: number[] = [];
  const ofRow = new Int32Array(subjects.length);
  for (let r = 0; r < subjects.length; r++) {
    const name = subjects[r];
    let s = number.get(name);
    if (s === undefined) {
      s = names.length;
      number.set(name, s);
      names.push(name);
      labels.push(rowLabels[r]);
    } else if (labels[s] !== rowLabels[r]) {
      throw new InputError(
        `feature matrix: subject "${name}" has rows in both groups — a subject belongs to exactly one group; rename one of them`,
      );
    }
    ofRow[r] = s;
  }
  return { names, ofRow, labels: Uint8Array.from(labels) };
}

/**
 * Checks that every group has at least `folds` subjects (otherwise a fold would miss a group)
 * and that `folds` is an integer >= 2. Throws InputError suggesting fewer folds.
 */
export function checkFoldsFeasible(subjectLabels: Uint8Array, folds: number, groupNames: readonly string[] = ['0', '1']): void {
  if (!Number.isInteger(folds) || folds < 2) {
    throw new InputError(`settings folds: must be an integer of at least 2, got ${folds} — use folds: 5 (common practice)`);
  }
  const counts = countByLabel(subjectLabels);
  for (let g = 0; g < 2; g++) {
    if (counts[g] < folds) {
      const fix = counts[g] >= 2 ? `use folds: ${Math.min(counts[g], counts[1 - g])} or fewer` : 'each group needs at least 2 subjects';
      throw new InputError(
        `settings folds: group "${groupNames[g]}" has ${counts[g]} subject(s), fewer than the ${folds} folds, so some folds would have none of it — ${fix}`,
      );
    }
  }
}

/** Number of subjects with label 0 and with label 1. */
export function countByLabel(labels: Uint8Array): [number, number] {
  let ones = 0;
  for (let i = 0; i < labels.length; i++) ones += labels[i];
  return [labels.length - ones, ones];
}

/**
 * Stratified fold of every subject: subjects of each group are shuffled by a generator seeded
 * with `seed` and dealt round-robin over `folds` folds; group 1 continues the deal where
 * group 0 stopped so that fold sizes differ by at most one overall.
 *
 * O(S) for S subjects. Returns an Int32Array of fold numbers (0..folds-1), one per subject.
 * Throws InputError when a group has fewer subjects than folds.
 * Example: labels [0,0,1,1], folds 2 -> each fold holds one subject of each group.
 */
export function stratifiedSubjectFolds(subjectLabels: Uint8Array, folds: number, seed: number): Int32Array {
  checkFoldsFeasible(subjectLabels, folds);
  const rng = createRng(seed);
  const fold = new Int32Array(subjectLabels.length);
  let next = 0;
  for (let g = 0; g < 2; g++) {
    const members: number[] = [];
    for (let s = 0; s < subjectLabels.length; s++) if (subjectLabels[s] === g) members.push(s);
    shuffleInPlace(members, rng);
    for (const s of members) {
      fold[s] = next;
      next = (next + 1) % folds;
    }
  }
  return fold;
}

/**
 * The fold assignments of `repeats` repeated stratified splits; repeat r uses the stream
 * deriveSeed(seed, 'cv', r), so a repeat's split never depends on how many repeats run.
 *
 * Returns one Int32Array of subject folds per repeat.
 * Example: repeatedSubjectFolds(labels, 5, 3, 42).length === 3.
 */
export function repeatedSubjectFolds(subjectLabels: Uint8Array, folds: number, repeats: number, seed: number): Int32Array[] {
  if (!Number.isInteger(repeats) || repeats < 1) {
    throw new InputError(`settings repeats: must be an integer of at least 1, got ${repeats} — use repeats: 1 or more`);
  }
  const out: Int32Array[] = [];
  for (let r = 0; r < repeats; r++) out.push(stratifiedSubjectFolds(subjectLabels, folds, deriveSeed(seed, 'cv', r)));
  return out;
}

/**
 * Spreads subject folds to rows: row r gets the fold of its subject.
 * Example: subjectFold [1,0], ofRow [0,0,1] -> [1,1,0].
 */
export function rowFolds(subjectFold: Int32Array, ofRow: Int32Array): Int32Array {
  const out = new Int32Array(ofRow.length);
  for (let r = 0; r < ofRow.length; r++) out[r] = subjectFold[ofRow[r]];
  return out;
}

/**
 * Shape checks of a ReportInput before rendering. The run stage builds the input, so a failure
 * here is an internal error (plain Error), with a message naming the field.
 */
import type { ReportInput } from './types.ts';

function fail(field: string, rule: string, got: unknown): never {
  throw new Error(`report input ${field}: ${rule}, got ${JSON.stringify(got)}`);
}

/**
 * Checks the invariants the page relies on: two distinct group names (the figures' colour
 * legend merges equal names), group indices 0 or 1, alpha in (0, 1), non-negative counts,
 * a projection whose rows match its subjects and columns.
 * Returns nothing; throws an Error naming the first field at fault.
 */
export function validateReportInput(input: ReportInput): void {
  const [a, b] = input.groupNames;
  if (typeof a !== 'string' || typeof b !== 'string') fail('groupNames', 'must be two strings', input.groupNames);
  if (a === b) fail('groupNames', 'must differ', input.groupNames);
  if (!(input.alpha > 0 && input.alpha < 1)) fail('alpha', 'must lie in (0, 1)', input.alpha);
  for (const [i, n] of input.subjectsPerGroup.entries()) if (!(Number.isInteger(n) && n >= 0)) fail(`subjectsPerGroup[${i}]`, 'must be a count', n);
  const h = input.headline;
  for (const k of ['permutations', 'repeats', 'folds'] as const) if (!(Number.isInteger(h[k]) && h[k] >= 0)) fail(`headline.${k}`, 'must be a count', h[k]);
  const groupOk = (g: unknown) => g === 0 || g === 1;
  input.cohort.forEach((r, i) => groupOk(r.group) || fail(`cohort[${i}].group`, 'must be 0 or 1', r.group));
  input.plane.forEach((p, j) => p.points.forEach((r, i) => groupOk(r.group) || fail(`plane[${j}].points[${i}].group`, 'must be 0 or 1', r.group)));
  const pr = input.projection;
  if (pr) {
    if (pr.groups.length !== pr.subjects.length || pr.rows.length !== pr.subjects.length) {
      fail('projection', 'needs one group and one row per subject', { subjects: pr.subjects.length, groups: pr.groups.length, rows: pr.rows.length });
    }
    pr.groups.forEach((g, i) => groupOk(g) || fail(`projection.groups[${i}]`, 'must be 0 or 1', g));
    pr.rows.forEach((r, i) => r.length === pr.columns.length || fail(`projection.rows[${i}]`, `must have ${pr.columns.length} values`, r.length));
  }
}

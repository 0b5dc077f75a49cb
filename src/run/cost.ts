/**
 * Rough cost estimates, so that a study that would take far longer than sensible, or ask for
 * more than its recordings can support, is caught by `check` and needs `--force` to `run`.
 *
 * The time model counts model fits: (1 + B) · repeats · folds · (1 + cells) for the permutation
 * tests (headline and grid scan), plus the nested cross-validation, repeats · folds · (cells ·
 * folds + 1). A forest fit costs about trees · subjects · 0.7 µs (5–7 ms for 100 trees on
 * 77–96 subjects × 60 columns, docs/classifiers.md) and a logistic fit about 0.2 ms on this
 * project's reference machine (2 cores), so the estimate is good to a factor of a few —
 * enough to tell minutes from days.
 */
import { factorial } from '../features/index.ts';
import type { Study } from '../study/index.ts';

/** CPU time above which a run needs --force (two hours). */
export const MAX_SENSIBLE_SECONDS = 2 * 3600;

export interface CostEstimate {
  fits: number;
  seconds: number;
}

/** Estimated model fits and CPU seconds of the statistics stage on one core. */
export function estimateStatisticsCost(study: Study): CostEstimate {
  const { folds, repeats, permutations, classifier, trees } = study.evaluation;
  const cells = study.grid.order.length * study.grid.delay.length * study.grid.scale.length;
  const subjects = new Set(study.recordings.map((r) => r.subject)).size;
  const scanned = cells >= 2 ? cells : 0;
  const fits = (1 + permutations) * repeats * folds * (1 + scanned) + (scanned ? repeats * folds * (scanned * folds + 1) : 0);
  const perFit = classifier === 'forest' ? trees * Math.max(subjects, 10) * 0.7e-6 : 2e-4;
  return { fits, seconds: fits * perFit };
}

/** "3 h 20 min", "45 min", "12 s". */
export function formatDuration(seconds: number): string {
  if (seconds >= 86400) return `${(seconds / 86400).toFixed(1)} days`;
  if (seconds >= 3600) return `${Math.floor(seconds / 3600)} h ${Math.round((seconds % 3600) / 60)} min`;
  if (seconds >= 60) return `${Math.round(seconds / 60)} min`;
  return `${Math.max(1, Math.round(seconds))} s`;
}

/**
 * Concerns that make `run` ask for --force: an estimated statistics time over two hours, and
 * a pattern order whose m! possible patterns outnumber the windows of the typical recording
 * (median length), so that its pattern distribution cannot be estimated at all.
 */
export function resourceConcerns(study: Study, recordingLengths: number[] = []): string[] {
  const concerns: string[] = [];
  const cost = estimateStatisticsCost(study);
  if (cost.seconds > MAX_SENSIBLE_SECONDS) {
    concerns.push(
      `the statistics would need about ${cost.fits.toExponential(1)} model fits, roughly ${formatDuration(cost.seconds)} of CPU time — lower evaluation.permutations (999 is usual), repeats or the grid, or add --force to run it anyway`,
    );
  }
  if (recordingLengths.length > 0) {
    const sorted = [...recordingLengths].sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)];
    const tooLarge = study.grid.order.filter((m) => factorial(m) > median);
    if (tooLarge.length > 0) {
      const m = Math.max(...tooLarge);
      concerns.push(
        `order ${tooLarge.join(', ')} has more possible patterns (${m}! = ${factorial(m)}) than the median recording has samples (${median}): its pattern distribution cannot be estimated — remove that order from grid.order, or add --force to run it anyway`,
      );
    }
  }
  return concerns;
}

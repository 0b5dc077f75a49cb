/**
 * Warnings about a study that do not stop it but that a careful reader must see: groups too
 * small for the folds, recordings too short for the grid, missing samples, coarse
 * quantisation, constant recordings.
 */
import { factorial } from '../features/index.ts';
import type { Study } from '../study/index.ts';
import type { RecordingInfo } from './read-cohort.ts';
import { resourceConcerns } from './cost.ts';

/** Share of adjacent equal samples above which a recording counts as coarsely quantised (our choice, documented in README). */
export const TIED_SHARE_WARNING = 0.05;

/** Valid windows of a gap-free series of n samples at (m, tau, s): floor(n/s) - (m-1)·tau. */
export function windowsAvailable(n: number, order: number, delay: number, scale: number): number {
  return Math.max(0, Math.floor(n / scale) - (order - 1) * delay);
}

/** Subjects per group (a subject with several recordings counts once). */
export function subjectsPerGroup(study: Study): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const group of study.groups) counts[group] = new Set(study.recordings.filter((r) => r.group === group).map((r) => r.subject)).size;
  return counts;
}

/** All warnings for a study whose recordings have been read. */
export function studyWarnings(study: Study, infos: RecordingInfo[]): string[] {
  const warnings: string[] = [];
  const perGroup = subjectsPerGroup(study);
  for (const group of study.groups) {
    if (perGroup[group] < study.evaluation.folds) {
      warnings.push(
        `group '${group}' has ${perGroup[group]} subject(s), fewer than evaluation.folds = ${study.evaluation.folds}: cross-validation cannot stratify — use at most ${perGroup[group]} folds`,
      );
    }
  }
  warnings.push(...resourceConcerns(study, infos.map((i) => i.summary.length)));
  warnings.push(...shortRecordingWarnings(study, infos));
  for (const info of infos) {
    const id = info.recording.id;
    if (info.caution) warnings.push(`recording '${id}' ${info.caution}`);
    if (info.summary.missing > 0) {
      warnings.push(
        `recording '${id}' has ${info.summary.missing} missing sample(s) (longest gap ${info.summary.longestGap}): windows and transitions across gaps are skipped`,
      );
    }
    if (info.summary.distinct <= 1) {
      warnings.push(`recording '${id}' is constant or empty: its ordinal patterns carry no information`);
    } else if (info.summary.tiedShare > TIED_SHARE_WARNING) {
      warnings.push(
        `recording '${id}' looks coarsely quantised: ${(100 * info.summary.tiedShare).toFixed(1)}% of adjacent samples are equal, which biases permutation entropy down (Zunino et al. 2017) — consider features.ties: jitter or symbols`,
      );
    }
  }
  return warnings;
}

/**
 * Recordings too short for the largest order at some (delay, scale) pairs, one warning per
 * distinct shortfall so that a cohort of equal-length recordings gets one line, not one each.
 */
function shortRecordingWarnings(study: Study, infos: RecordingInfo[]): string[] {
  const order = Math.max(...study.grid.order);
  const need = study.features.minWindowsPerPattern * factorial(order);
  const byShortfall = new Map<string, string[]>();
  for (const info of infos) {
    const n = info.summary.length;
    const short = study.grid.scale.flatMap((s) => study.grid.delay.map((d) => ({ s, d, w: windowsAvailable(n, order, d, s) }))).filter((c) => c.w < need);
    if (short.length === 0) continue;
    const worst = short.reduce((a, b) => (b.w < a.w ? b : a));
    const key = `${n} samples give ${worst.w} windows at delay ${worst.d}, scale ${worst.s}; ${short.length} (delay, scale) pair(s) below the minimum`;
    byShortfall.set(key, [...(byShortfall.get(key) ?? []), info.recording.id]);
  }
  return [...byShortfall.entries()].map(([key, ids]) => {
    const who = ids.length === 1 ? `recording '${ids[0]}' is` : `${ids.length} recordings (${ids.slice(0, 5).join(', ')}${ids.length > 5 ? ', …' : ''}) are`;
    return `${who} too short for order ${order}: ${key}, fewer than ${need} (${study.features.minWindowsPerPattern} x ${order}!) — those cells are flagged; use longer recordings or a smaller order`;
  });
}

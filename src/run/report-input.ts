/**
 * Maps a finished run (study, feature stage, evaluation, univariate table) to the report's
 * input. Every number comes from results.json's sources; nothing is recomputed here except
 * selections for display (which cells and features to plot).
 */
import { readFileSync } from 'node:fs';
import { arch, platform, release } from 'node:os';
import { complexityBounds } from '../features/index.ts';
import type { EvaluationResult, FeatureMatrix, UnivariateRow } from '../evaluate/index.ts';
import type { GroupIndex, ReportInput } from '../report/index.ts';
import type { Study } from '../study/index.ts';
import type { FeatureStage } from './run-study.ts';
import { TOOL_VERSION } from './version.ts';

/** Significance level used for the report's wording (the conventional 0.05). */
export const REPORT_ALPHA = 0.05;

const sameCell = (a: { order: number; delay: number; scale: number }, b: { order: number; delay: number; scale: number }) =>
  a.order === b.order && a.delay === b.delay && a.scale === b.scale;

/** Versions of the runtime dependencies, read from their installed package.json files. */
export function dependencyVersions(): Record<string, string> {
  const root = new URL('../../', import.meta.url);
  const pkg = JSON.parse(readFileSync(new URL('package.json', root), 'utf8')) as { dependencies: Record<string, string> };
  const out: Record<string, string> = {};
  for (const name of Object.keys(pkg.dependencies).sort()) {
    try {
      out[name] = (JSON.parse(readFileSync(new URL(`node_modules/${name}/package.json`, root), 'utf8')) as { version: string }).version;
    } catch {
      out[name] = pkg.dependencies[name];
    }
  }
  return out;
}

/** Cells to draw in the complexity–entropy plane: those nested CV picked most, else the best-scoring; at most 3. */
function planeCells(evaluation: EvaluationResult): { order: number; delay: number; scale: number }[] {
  const picked = [...(evaluation.nested?.selected_cells ?? [])].sort((a, b) => b.times_selected - a.times_selected);
  const byScore = [...evaluation.cells].sort((a, b) => (b.auc ?? -1) - (a.auc ?? -1));
  const chosen: { order: number; delay: number; scale: number }[] = [];
  for (const c of [...picked, ...byScore]) if (!chosen.some((d) => sameCell(c, d)) && chosen.length < 3) chosen.push(c);
  return chosen;
}

function column(matrix: FeatureMatrix, feature: string, cell: { order: number; delay: number; scale: number }): number {
  return matrix.columns.findIndex((c) => c.feature === feature && sameCell(c, cell));
}

const valueOrNull = (v: number) => (Number.isFinite(v) ? v : null);

/** Share of valid windows holding a tie at the recording's finest cell (smallest scale, delay and order). */
function finestCellTiedShare(stage: FeatureStage, recording: string): number | null {
  const rows = stage.quality.filter((q) => q.recording === recording && q.valid_windows > 0);
  if (rows.length === 0) return null;
  const finest = rows.reduce((a, b) => (b.scale < a.scale || (b.scale === a.scale && (b.delay < a.delay || (b.delay === a.delay && b.order < a.order))) ? b : a));
  return valueOrNull(finest.tied_window_share);
}

interface MapInput {
  study: Study;
  stage: FeatureStage;
  evaluation: EvaluationResult;
  univariate: UnivariateRow[];
  /** One row per subject (the recording matrix averaged by subject). */
  subjects: FeatureMatrix;
  commandLine: string[];
  started: Date;
  durationMs: number;
}

/** Builds the report input. */
export function toReportInput({ study, stage, evaluation, univariate, subjects, commandLine, started, durationMs }: MapInput): ReportInput {
  const p = subjects.columns.length;
  const groupOf = (label: number): GroupIndex => (label === 1 ? 1 : 0);
  const byEffect = [...univariate].filter((r) => r.hedgesG !== null).sort((a, b) => Math.abs(b.hedgesG!) - Math.abs(a.hedgesG!));
  const bestNaive = [...evaluation.cells].sort((a, b) => (b.auc ?? -1) - (a.auc ?? -1))[0];
  return {
    studyName: study.name,
    groupNames: study.groups,
    subjectsPerGroup: evaluation.data.group_sizes,
    alpha: REPORT_ALPHA,
    headline: {
      auc: evaluation.headline.auc,
      interval: { low: evaluation.headline.auc_ci?.[0] ?? null, high: evaluation.headline.auc_ci?.[1] ?? null, level: 0.95, method: 'DeLong (1988), on repeat-averaged out-of-fold probabilities' },
      permutationP: evaluation.headline.p_value,
      permutationPSe: evaluation.headline.p_value_se,
      permutations: evaluation.headline.permutations,
      repeats: evaluation.settings.repeats,
      folds: evaluation.settings.folds,
      classifier: evaluation.settings.classifier === 'forest' ? `random forest (${evaluation.settings.trees} trees)` : `L2 logistic regression (lambda ${evaluation.settings.l2})`,
    },
    cohort: stage.infos.map((info) => ({
      id: info.recording.id,
      subject: info.recording.subject,
      group: groupOf(info.recording.group === study.groups[1] ? 1 : 0),
      length: info.summary.length,
      missingShare: info.summary.length > 0 ? info.summary.missing / info.summary.length : null,
      tiedShare: finestCellTiedShare(stage, info.recording.id),
      warnings: stage.warnings.filter((w) => w.includes(`'${info.recording.id}'`)),
    })),
    warnings: stage.warnings.map((message) => ({ message })),
    notes: [...stage.notes, ...evaluation.notes],
    gridScan: evaluation.cells.map((c) => ({ order: c.order, delay: c.delay, scale: c.scale, auc: c.auc, adjustedP: c.p_adjusted })),
    selection: {
      naiveBest: bestNaive ? { order: bestNaive.order, delay: bestNaive.delay, scale: bestNaive.scale, auc: bestNaive.auc } : null,
      nestedAuc: evaluation.nested?.auc ?? null,
      pickedCells: evaluation.nested?.selected_cells.map((c) => ({ order: c.order, delay: c.delay, scale: c.scale, times: c.times_selected })),
    },
    univariate: univariate.map((r) => ({
      feature: r.feature,
      order: r.order,
      delay: r.delay,
      scale: r.scale,
      n: [r.group0.n, r.group1.n],
      mean: [r.group0.mean, r.group1.mean],
      sd: [r.group0.sd, r.group1.sd],
      hedgesG: r.hedgesG,
      gLow: r.gLow,
      gHigh: r.gHigh,
      mannWhitneyP: r.pValue,
      auc: r.auc,
      q: r.qValue,
      ...(r.reason ? { note: r.reason } : {}),
    })),
    plane: planeCells(evaluation).flatMap((cell) => {
      const h = column(subjects, 'permutation_entropy', cell);
      const c = column(subjects, 'statistical_complexity', cell);
      if (h < 0 || c < 0) return [];
      return [
        {
          cell,
          points: subjects.rowIds.map((subject, i) => ({ subject, group: groupOf(subjects.labels[i]), h: valueOrNull(subjects.values[i * p + h]), c: valueOrNull(subjects.values[i * p + c]) })),
          bounds: complexityBounds(cell.order, 120),
        },
      ];
    }),
    distributions: byEffect.slice(0, 6).map((r) => {
      const j = column(subjects, r.feature, r);
      const values: [number[], number[]] = [[], []];
      subjects.rowIds.forEach((_, i) => {
        const v = subjects.values[i * p + j];
        if (Number.isFinite(v)) values[subjects.labels[i]].push(v);
      });
      return { feature: r.feature, order: r.order, delay: r.delay, scale: r.scale, values };
    }),
    roc: evaluation.headline.roc,
    nullScores: evaluation.headline.null_aucs,
    projection: {
      subjects: subjects.rowIds,
      groups: Array.from(subjects.labels, groupOf),
      columns: subjects.columns.map((c) => `${c.feature} m${c.order} t${c.delay} s${c.scale}`),
      rows: subjects.rowIds.map((_, i) => Array.from(subjects.values.subarray(i * p, (i + 1) * p), valueOrNull)),
    },
    importance: {
      method: 'drop in out-of-fold AUC when one column is shuffled among held-out subjects, mean over repeats',
      rows: evaluation.importance.by_column.map((r) => ({ feature: r.feature, order: r.order, delay: r.delay, scale: r.scale, importance: r.importance })),
    },
    reproduction: {
      studyPath: study.file,
      studyText: study.text,
      commandLine,
      inputFiles: stage.infos.map((info) => ({ path: info.recording.relPath, sha256: info.sha256 })),
      toolVersion: TOOL_VERSION,
      nodeVersion: process.version,
      dependencies: dependencyVersions(),
      platform: `${platform()} ${release()} ${arch()}`,
      seed: study.seed,
      startedAt: started.toISOString(),
      durationMs,
    },
  };
}

/**
 * Runs a study end to end: read every recording, compute the features over the grid, and
 * write the output folder atomically. Later stages (evaluation, report) hang off the same
 * flow; `stage: 'features'` stops after features.csv and quality.csv.
 */
import type { Study } from '../study/index.ts';
import { featureRows, flaggedCellNotes, qualityRows, type FeatureRow, type QualityRow } from './feature-table.ts';
import type { RecordingInfo } from './read-cohort.ts';
import { computeRecordings, IN_THREAD, type FeatureWork } from './feature-work.ts';
import { lazyPool, type LazyPool, type WorkPool } from './worker-pool.ts';
import { featureWorkIsLarge, permutationWorkIsLarge } from './work-size.ts';
import { inThreadPermutationStage, nextTurn, pooledPermutationStage } from './permutation-stage.ts';
import type { Cell } from '../features/index.ts';
import { studyWarnings } from './warnings.ts';
import { toArrowBytes, toCsvText } from './csv.ts';
import { compareGroups, evaluateStudyWith, type EvaluationResult, type FeatureMatrix, type UnivariateRow } from '../evaluate/index.ts';
import { renderReport } from '../report/index.ts';
import { deriveSeed } from '../shared/random.ts';
import { recordingMatrix, subjectMatrix } from './feature-matrix.ts';
import { toReportInput } from './report-input.ts';
import { resourceConcerns } from './cost.ts';
import { pauseIfRequested } from './test-pause.ts';
import { InputError } from '../shared/errors.ts';
import { pseudonymiseStudy, type PseudonymKeyRow } from './pseudonyms.ts';
import { stageFolder, writeFileAtomic } from './output-folder.ts';
import { buildResults, type Results } from './results.ts';

export interface RunOptions {
  out: string;
  stage: 'features' | 'all';
  /** Start even when resourceConcerns() objects (the statistics stage only). */
  force?: boolean;
  /** The command line as typed, for the reproduction record. */
  commandLine: string;
  /** Progress callback: stage name, done, total. */
  onProgress?: (stage: string, done: number, total: number) => void;
  /** Worker threads for features and permutations (default 1: this thread only). Results do not depend on it. */
  jobs?: number;
  /** With `jobs` > 1: run small stages in this thread anyway (src/run/work-size.ts); default false (always use the threads). */
  poolOnlyWhenLarge?: boolean;
  /** Feature cache folder (default null: no cache). */
  cacheDir?: string | null;
  /** Called per recording with the cells computed rather than taken from the cache (for tests and counts). */
  onComputed?: (recordingId: string, cells: Cell[]) => void;
}

/** What a finished run hands back to the command line. */
export interface RunOutcome {
  out: string;
  files: string[];
  warnings: string[];
  notes: string[];
  results: Results;
  /** Where the pseudonym key was written (beside, never inside, the output folder), or null. */
  keyFile: string | null;
}

export const FEATURE_COLUMNS = ['subject', 'group', 'order', 'delay', 'scale', 'feature', 'value', 'recording', 'reason'];

/** Everything the feature stage produced for a study. */
export interface FeatureStage {
  infos: RecordingInfo[];
  rows: FeatureRow[];
  quality: QualityRow[];
  /** About the data and the cache: things that may bias or undermine the results. */
  warnings: string[];
  /** About the study as written (e.g. recordings outside the study folder): worth knowing, not a data problem. */
  notes: string[];
}

/**
 * Reads every recording and computes its features over the grid (one recording at a time per
 * thread), taking cells from the feature cache when `work` names one. Results in study order.
 */
export async function computeFeatureStage(study: Study, onProgress?: RunOptions['onProgress'], work: FeatureWork = IN_THREAD): Promise<FeatureStage> {
  const reduced = await computeRecordings(study, work, (done, total) => onProgress?.('features', done, total));
  const infos = reduced.map((r) => r.info);
  const quality = reduced.flatMap((r) => qualityRows(r.info, r.outcome.cells));
  const cacheWarnings = [...new Set(reduced.flatMap((r) => r.outcome.warnings))];
  return {
    infos,
    rows: reduced.flatMap((r) => featureRows(study, r.info, r.outcome.cells)),
    quality,
    warnings: [...studyWarnings(study, infos), ...flaggedCellNotes(quality, infos.length), ...cacheWarnings],
    notes: [...study.notes],
  };
}

/** Column name of a feature at a cell in the wide table, e.g. permutation_entropy_m3_d1_s2. */
export function wideColumnName(c: { feature: string; order: number; delay: number; scale: number }): string {
  return `${c.feature}_m${c.order}_d${c.delay}_s${c.scale}`;
}

/** One row per recording, one column per feature x cell; empty cells where a value is missing. */
function wideRows(matrix: FeatureMatrix): Record<string, string | number | null>[] {
  const p = matrix.columns.length;
  return matrix.rowIds.map((id, i) => {
    const row: Record<string, string | number | null> = { subject: matrix.subjects[i], recording: id, group: matrix.groupNames[matrix.labels[i]] };
    matrix.columns.forEach((c, j) => {
      const v = matrix.values[i * p + j];
      row[wideColumnName(c)] = Number.isFinite(v) ? v : null;
    });
    return row;
  });
}

/** Everything the statistics stage adds to a run. */
interface StatisticsStage {
  evaluation: EvaluationResult;
  univariate: UnivariateRow[];
  subjects: FeatureMatrix;
  recordings: FeatureMatrix;
}

async function computeStatistics(study: Study, stage: FeatureStage, pool: WorkPool | null, onProgress?: RunOptions['onProgress']): Promise<StatisticsStage> {
  const recordings = recordingMatrix(study, stage.rows);
  const subjects = subjectMatrix(recordings);
  const settings = { ...study.evaluation, seed: deriveSeed(study.seed, 'evaluation') };
  const permute = pool ? pooledPermutationStage(pool, recordings, settings) : inThreadPermutationStage;
  // let the event loop turn between grid cells, outer folds and repeats, so Ctrl-C is served
  const evaluation = await evaluateStudyWith(recordings, settings, permute, onProgress, nextTurn);
  return { evaluation, univariate: compareGroups(subjects), subjects, recordings };
}

/** Runs the study and writes the output folder. Throws InputError before anything is written. */
export async function runStudy(original: Study, given: RunOptions): Promise<RunOutcome> {
  const options: RunOptions = {
    ...given,
    onProgress: (stage, done, total) => {
      given.onProgress?.(stage, done, total);
      pauseIfRequested(stage, done);
    },
  };
  const started = new Date();
  const pseudonyms = original.report.pseudonyms ? pseudonymiseStudy(original) : null;
  const study = pseudonyms?.study ?? original;
  if (options.stage === 'all' && !options.force) refuseUnreasonable(study, []);
  const pools = lazyPool(options.jobs ?? 1);
  try {
    return await runWithPool(study, options, started, pseudonyms?.key ?? null, pools);
  } finally {
    await pools.close();
  }
}

async function runWithPool(study: Study, options: RunOptions, started: Date, pseudonymKey: PseudonymKeyRow[] | null, pools: LazyPool): Promise<RunOutcome> {
  const always = !options.poolOnlyWhenLarge;
  const work: FeatureWork = { cacheDir: options.cacheDir ?? null, pool: pools.get(always || featureWorkIsLarge(study)), onComputed: options.onComputed };
  const stage = await computeFeatureStage(study, options.onProgress, work);
  if (options.stage === 'all' && !options.force) refuseUnreasonable(study, stage.infos.map((i) => i.summary.length));
  const files: [string, string | Uint8Array][] = [
    ['features.csv', toCsvText(stage.rows, FEATURE_COLUMNS)],
    ['quality.csv', toCsvText(stage.quality)],
  ];
  let statistics: StatisticsStage | null = null;
  if (options.stage === 'all') {
    statistics = await computeStatistics(study, stage, pools.get(always || permutationWorkIsLarge(study)), options.onProgress);
    files.push(
      ['features-wide.csv', toCsvText(wideRows(statistics.recordings))],
      ['univariate.csv', toCsvText(statistics.univariate.map(flattenUnivariate))],
      ['predictions.csv', toCsvText(statistics.evaluation.predictions, ['subject', 'group', 'repeat', 'probability'])],
      ['features.arrow', toArrowBytes(stage.rows)],
    );
  }
  const finished = new Date();
  const results = buildResults(study, stage, {
    started,
    finished,
    commandLine: options.commandLine,
    stage: options.stage,
    evaluation: statistics?.evaluation ?? null,
    univariate: statistics?.univariate ?? null,
    outputs: [...files.map(([name]) => name), 'results.json', ...(statistics ? ['report.html'] : [])],
  });
  files.push(['results.json', JSON.stringify(results, null, 2) + '\n']);
  if (statistics) {
    const input = toReportInput({
      study,
      stage,
      evaluation: statistics.evaluation,
      univariate: statistics.univariate,
      subjects: statistics.subjects,
      commandLine: options.commandLine.split(' '),
      started,
      durationMs: finished.getTime() - started.getTime(),
    });
    files.push(['report.html', await renderReport(input)]);
  }
  const folder = stageFolder(options.out);
  try {
    for (const [name, content] of files) folder.write(name, content);
    pauseIfRequested('commit');
    folder.commit();
  } catch (e) {
    folder.abandon();
    throw e;
  }
  const keyFile = pseudonymKey ? writePseudonymKey(options.out, pseudonymKey) : null;
  return { out: options.out, files: files.map(([name]) => name), warnings: stage.warnings, notes: stage.notes, results, keyFile };
}

/** Throws InputError (exit 2, nothing written) when the study needs --force. */
function refuseUnreasonable(study: Study, lengths: number[]): void {
  const concerns = resourceConcerns(study, lengths);
  if (concerns.length > 0) throw new InputError(`${study.file}: ${concerns[0]}`);
}

/** A univariate row as a flat CSV record. */
function flattenUnivariate(r: UnivariateRow): Record<string, string | number | null> {
  return {
    feature: r.feature,
    order: r.order,
    delay: r.delay,
    scale: r.scale,
    n0: r.group0.n,
    mean0: r.group0.mean,
    sd0: r.group0.sd,
    n1: r.group1.n,
    mean1: r.group1.mean,
    sd1: r.group1.sd,
    hedges_g: r.hedgesG,
    g_low: r.gLow,
    g_high: r.gHigh,
    mann_whitney_u: r.u,
    auc: r.auc,
    p_value: r.pValue,
    p_method: r.pMethod,
    q_value: r.qValue,
    reason: r.reason,
  };
}

/** Writes the pseudonym key beside the output folder as `<folder>.pseudonym-key.csv`. */
function writePseudonymKey(out: string, key: PseudonymKeyRow[]): string {
  const path = `${out.replace(/[\\/]+$/, '')}.pseudonym-key.csv`;
  writeFileAtomic(path, toCsvText(key, ['pseudonym', 'subject', 'recording', 'file']));
  return path;
}

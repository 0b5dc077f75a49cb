/**
 * Runs a study end to end: read every recording, compute the features over the grid, and
 * write the output folder atomically. Later stages (evaluation, report) hang off the same
 * flow; `stage: 'features'` stops after features.csv and quality.csv.
 */
import type { Study } from '../study/index.ts';
import { featureRows, featuresOfSeries, flaggedCellNotes, qualityRows, type FeatureRow, type QualityRow } from './feature-table.ts';
import { forEachRecording, type RecordingInfo } from './read-cohort.ts';
import { studyWarnings } from './warnings.ts';
import { toCsvText } from './csv.ts';
import { stageFolder } from './output-folder.ts';
import { buildResults, type Results } from './results.ts';

export interface RunOptions {
  out: string;
  stage: 'features' | 'all';
  /** The command line as typed, for the reproduction record. */
  commandLine: string;
  /** Progress callback: stage name, done, total. */
  onProgress?: (stage: string, done: number, total: number) => void;
}

/** What a finished run hands back to the command line. */
export interface RunOutcome {
  out: string;
  files: string[];
  warnings: string[];
  results: Results;
}

export const FEATURE_COLUMNS = ['subject', 'group', 'order', 'delay', 'scale', 'feature', 'value', 'recording', 'reason'];

/** Everything the feature stage produced for a study. */
export interface FeatureStage {
  infos: RecordingInfo[];
  rows: FeatureRow[];
  quality: QualityRow[];
  warnings: string[];
}

/** Reads every recording and computes its features over the grid, one recording at a time. */
export async function computeFeatureStage(study: Study, onProgress?: RunOptions['onProgress']): Promise<FeatureStage> {
  const reduced = await forEachRecording(
    study,
    (series, info) => {
      const cells = featuresOfSeries(study, series, info.recording.id);
      return { rows: featureRows(study, info, cells), quality: qualityRows(info, cells) };
    },
    (done, total) => onProgress?.('features', done, total),
  );
  const infos = reduced.map((r) => r.info);
  const quality = reduced.flatMap((r) => r.value.quality);
  return {
    infos,
    rows: reduced.flatMap((r) => r.value.rows),
    quality,
    warnings: [...study.notes, ...studyWarnings(study, infos), ...flaggedCellNotes(quality, infos.length)],
  };
}

/** Runs the study and writes the output folder. Throws InputError before anything is written. */
export async function runStudy(study: Study, options: RunOptions): Promise<RunOutcome> {
  const started = new Date();
  const stage = await computeFeatureStage(study, options.onProgress);
  const files: [string, string][] = [
    ['features.csv', toCsvText(stage.rows, FEATURE_COLUMNS)],
    ['quality.csv', toCsvText(stage.quality)],
  ];
  const results = buildResults(study, stage, { started, finished: new Date(), commandLine: options.commandLine, stage: options.stage });
  files.push(['results.json', JSON.stringify(results, null, 2) + '\n']);
  const folder = stageFolder(options.out);
  try {
    for (const [name, content] of files) folder.write(name, content);
    folder.commit();
  } catch (e) {
    folder.abandon();
    throw e;
  }
  return { out: options.out, files: files.map(([name]) => name), warnings: stage.warnings, results };
}

/**
 * results.json: the machine-readable record of a run (schema in docs/results.md). It is the
 * one source of truth for the numbers the report shows.
 */
import { arch, platform, release } from 'node:os';
import type { Study } from '../study/index.ts';
import type { EvaluationResult, UnivariateRow } from '../evaluate/index.ts';
import { sha256Text } from './hash.ts';
import type { FeatureStage } from './run-study.ts';
import { subjectsPerGroup } from './warnings.ts';
import { TOOL_VERSION } from './version.ts';

export const RESULTS_SCHEMA_VERSION = 1;

export interface Results {
  schema: string;
  tool: { name: 'patternfold'; version: string };
  study: {
    name: string;
    description: string;
    file: string;
    sha256: string;
    seed: number;
    groups: [string, string];
    subjectsPerGroup: Record<string, number>;
    overrides: string[];
    /** Notes about the study as written (not data problems), e.g. recordings outside its folder. */
    notes: string[];
  };
  settings: Pick<Study, 'signal' | 'grid' | 'features' | 'evaluation' | 'report'>;
  recordings: {
    id: string;
    subject: string;
    group: string;
    file: string;
    sha256: string;
    format: string;
    channel: string;
    sampleRate: number | null;
    totalSamples: number;
    analysedSamples: number;
    missingSamples: number;
    adjacentTiedShare: number | null;
    covariates: Record<string, string>;
  }[];
  quality: { flaggedCells: number; cells: number; warnings: string[] };
  outputs: string[];
  /** The statistics (null for `patternfold features`); field documentation in src/evaluate/result.ts. */
  evaluation: EvaluationResult | null;
  /** Univariate comparison per feature x cell, subjects averaged over their recordings (src/evaluate/univariate.ts). */
  univariate: UnivariateRow[] | null;
  run: {
    stage: 'features' | 'all';
    commandLine: string;
    started: string;
    finished: string;
    durationSeconds: number;
    node: string;
    platform: string;
  };
}

interface RunMeta {
  evaluation: EvaluationResult | null;
  univariate: UnivariateRow[] | null;
  outputs: string[];
  started: Date;
  finished: Date;
  commandLine: string;
  stage: 'features' | 'all';
}

/** Assembles results.json from the study and the feature stage. */
export function buildResults(study: Study, stage: FeatureStage, meta: RunMeta): Results {
  return {
    schema: `patternfold-results/${RESULTS_SCHEMA_VERSION}`,
    tool: { name: 'patternfold', version: TOOL_VERSION },
    study: {
      name: study.name,
      description: study.description,
      file: study.file,
      sha256: sha256Text(study.text),
      seed: study.seed,
      groups: study.groups,
      subjectsPerGroup: subjectsPerGroup(study),
      overrides: study.overrides,
      notes: stage.notes,
    },
    settings: { signal: study.signal, grid: study.grid, features: study.features, evaluation: study.evaluation, report: study.report },
    recordings: stage.infos.map((info) => ({
      id: info.recording.id,
      subject: info.recording.subject,
      group: info.recording.group,
      file: info.recording.relPath,
      sha256: info.sha256,
      format: info.format,
      channel: info.channel,
      sampleRate: info.sampleRate,
      totalSamples: info.totalSamples,
      analysedSamples: info.summary.length,
      missingSamples: info.summary.missing,
      adjacentTiedShare: Number.isNaN(info.summary.tiedShare) ? null : info.summary.tiedShare,
      covariates: info.recording.covariates,
    })),
    quality: { flaggedCells: stage.quality.filter((q) => q.flagged).length, cells: stage.quality.length, warnings: stage.warnings },
    outputs: meta.outputs,
    evaluation: meta.evaluation,
    univariate: meta.univariate,
    run: {
      stage: meta.stage,
      commandLine: meta.commandLine,
      started: meta.started.toISOString(),
      finished: meta.finished.toISOString(),
      durationSeconds: (meta.finished.getTime() - meta.started.getTime()) / 1000,
      node: process.version,
      platform: `${platform()} ${release()} ${arch()}`,
    },
  };
}

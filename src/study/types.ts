/**
 * A validated study: everything later stages need, with defaults filled in and paths resolved.
 */
import type { FeatureName, Grid, ScaleForm, TieRule } from '../features/types.ts';
import type { EvaluationSettings } from '../evaluate/types.ts';

export interface Recording {
  /** Unique recording id: the file name without its extensions, or manifest subject (+ #k for repeats). */
  id: string;
  /** Subject the recording belongs to (cross-validation keeps a subject's recordings together). */
  subject: string;
  group: string;
  /** Absolute path. */
  path: string;
  /** Path as written relative to the study file's folder (for messages and the report). */
  relPath: string;
  /** Extra manifest columns. */
  covariates: Record<string, string>;
}

export interface SignalSettings {
  column: number | string;
  start: number;
  length: number | null;
}

export interface FeatureSettings {
  include: FeatureName[];
  ties: TieRule;
  jitterRepeats: number;
  scaleForm: ScaleForm;
  minWindowsPerPattern: number;
}

/** The evaluation settings of a study: those of the evaluation stage, less the seed (derived from the study's). */
export type EvaluationOptions = Omit<EvaluationSettings, 'seed'>;

export interface Study {
  /** Absolute path of the study file. */
  file: string;
  /** Folder of the study file; relative paths resolve against it. */
  dir: string;
  /** The study file verbatim (for the report's reproduction section). */
  text: string;
  /** The `--set` overrides applied, as given. */
  overrides: string[];
  name: string;
  description: string;
  seed: number;
  /** Reference group first; label 1 (the "positive" class) is groups[1]. */
  groups: [string, string];
  recordings: Recording[];
  signal: SignalSettings;
  grid: Grid;
  features: FeatureSettings;
  evaluation: EvaluationOptions;
  report: { pseudonyms: boolean };
  /** Notes found while loading that do not stop the study (e.g. paths outside the study folder). */
  notes: string[];
}

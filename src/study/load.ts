/**
 * Loads a study file: parse, validate against the schema, apply `--set` overrides, resolve
 * the recordings, and return a {@link Study} with every default filled in.
 */
import { readFileSync, statSync } from 'node:fs';
import { dirname, relative, resolve, sep } from 'node:path';
import type { FeatureName, ScaleForm, TieRule } from '../features/types.ts';
import type { ClassifierName } from '../evaluate/types.ts';
import { InputError, locate } from '../shared/errors.ts';
import { checkNameLength } from './names.ts';
import { parseOverride } from './overrides.ts';
import { recordingsFromGlobs, recordingsFromManifest } from './recordings.ts';
import type { Study } from './types.ts';
import { showValue, studyPosition, validateStudyText, type RawStudy } from './validate.ts';

export interface LoadOptions {
  /** `key.path=value` strings from `--set`. */
  overrides?: string[];
}

function readStudyText(file: string): string {
  try {
    if (statSync(file).isDirectory()) throw new InputError(`${file}: is a folder — give the study file (YAML), e.g. studies/demo.yaml`);
    return readFileSync(file, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : String(code);
    throw new InputError(`${file}: cannot read the study file: ${reason} — check the path, or create one with 'patternfold init'`);
  }
}

type Section = Record<string, unknown>;

/** Loads and validates a study file. Throws InputError naming the file, line and key on any problem. */
export function loadStudy(path: string, options: LoadOptions = {}): Study {
  const file = resolve(path);
  const label = path;
  const text = readStudyText(file);
  const overrides = (options.overrides ?? []).map(parseOverride);
  const raw: RawStudy = validateStudyText(text, label, overrides);
  const dir = dirname(file);
  const ctx = { label, text, dir };

  let groups: string[];
  let recordings;
  if (raw.subjects !== undefined) {
    if (raw.groups !== undefined && !Array.isArray(raw.groups)) {
      const pos = studyPosition(text, ['groups']);
      throw new InputError(`${label}:${pos?.line ?? 1}: groups: with a subjects manifest, groups is the list of the two group names (e.g. groups: [control, patient]), found a mapping — use one or the other`);
    }
    ({ recordings, groups } = recordingsFromManifest(ctx, String(raw.subjects), raw.groups as string[] | undefined));
    if (groups.length !== 2) throw new InputError(`${label}: the subjects manifest has ${groups.length} group(s) (${groups.join(', ')}) — patternfold compares exactly two groups`);
  } else if (raw.groups !== undefined && !Array.isArray(raw.groups)) {
    const mapping = raw.groups as Record<string, string | string[]>;
    groups = Object.keys(mapping);
    for (const group of groups) checkNameLength(group, 'group name', locate(label, studyPosition(text, ['groups', group])?.line));
    recordings = recordingsFromGlobs(ctx, mapping);
  } else {
    const pos = studyPosition(text, raw.groups ? ['groups'] : []);
    throw new InputError(
      `${label}:${pos?.line ?? 1}: ${raw.groups ? `groups is a list ${showValue(raw.groups)} but there is no subjects manifest` : "missing key 'groups'"} — give groups as a mapping name -> glob (groups: {fresh: data/fresh/*.csv, fatigued: data/fatigued/*.csv}) or add subjects: manifest.csv`,
    );
  }
  for (const group of groups) {
    if (!recordings.some((r) => r.group === group)) throw new InputError(`${label}: group '${group}' has no recordings — check its glob or the manifest`);
  }

  const signal = raw.signal as Section;
  const grid = raw.grid as Section;
  const features = raw.features as Section;
  const evaluation = raw.evaluation as Section;
  const notes: string[] = [];
  const outside = recordings.filter((r) => relative(dir, r.path).startsWith('..' + sep) || relative(dir, r.path) === '..');
  if (outside.length > 0) {
    notes.push(
      `${outside.length} recording(s) lie outside the study file's folder (e.g. ${outside[0].relPath}): keep the folders together when you share the study`,
    );
  }
  const sortNumbers = (v: unknown) => [...(v as number[])].sort((a, b) => a - b);
  return {
    file,
    dir,
    text,
    overrides: options.overrides ?? [],
    name: String(raw.name),
    description: String(raw.description ?? ''),
    seed: Number(raw.seed),
    groups: [groups[0], groups[1]],
    recordings: groups.flatMap((g) => recordings.filter((r) => r.group === g)),
    signal: { column: signal.column as number | string, start: Number(signal.start), length: (signal.length as number | null) ?? null },
    grid: { order: sortNumbers(grid.order), delay: sortNumbers(grid.delay), scale: sortNumbers(grid.scale) },
    features: {
      include: features.include as FeatureName[],
      ties: features.ties as TieRule,
      jitterRepeats: Number(features.jitter_repeats),
      scaleForm: features.scale_form as ScaleForm,
      minWindowsPerPattern: Number(features.min_windows_per_pattern),
    },
    evaluation: {
      folds: Number(evaluation.folds),
      repeats: Number(evaluation.repeats),
      permutations: Number(evaluation.permutations),
      classifier: evaluation.classifier as ClassifierName,
      trees: Number(evaluation.trees),
      l2: Number(evaluation.l2),
      stopEarly: Boolean(evaluation.stop_early),
    },
    report: { pseudonyms: Boolean((raw.report as Section).pseudonyms) },
    notes,
  };
}

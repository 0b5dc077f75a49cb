/**
 * The JSON Schema of a study file (draft 2020-12 subset understood by Ajv). It is the single
 * source of truth for keys, types, ranges and defaults: the loader validates against it,
 * `patternfold schema` and `npm run schema` write it to schema/study.schema.json for editors.
 *
 * Key names are plain trade terms (groups, subjects, grid, order, delay, scale, folds,
 * repeats, permutations, seed) or our own words.
 */
import { FEATURE_NAMES } from '../features/types.ts';

const positiveIntList = (min: number, max: number, description: string, fallback: number[]) => ({
  description,
  type: 'array',
  items: { type: 'integer', minimum: min, maximum: max },
  minItems: 1,
  uniqueItems: true,
  default: fallback,
});

const globList = {
  description: 'A glob (or list of globs) relative to the study file; every match is one recording.',
  anyOf: [
    { type: 'string', minLength: 1 },
    { type: 'array', items: { type: 'string', minLength: 1 }, minItems: 1 },
  ],
};

export const STUDY_SCHEMA = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: 'https://patternfold.invalid/study.schema.json',
  title: 'patternfold study file',
  description: 'Two groups of recordings and the ordinal-pattern analysis to compare them.',
  type: 'object',
  additionalProperties: false,
  required: ['name'],
  properties: {
    name: { description: 'Free text naming the study; used in the report and run folders.', type: 'string', minLength: 1, maxLength: 200 },
    description: { description: 'Free text shown in the report.', type: 'string', maxLength: 5000 },
    seed: {
      description: 'Every random draw (splits, permutations, forests, jitter) derives from this integer.',
      type: 'integer',
      minimum: 0,
      maximum: 4294967295,
      default: 1,
    },
    groups: {
      description:
        'Either a mapping group name -> glob(s) of recordings, or (with `subjects`) the list of the two group names, reference group first.',
      anyOf: [
        {
          type: 'object',
          minProperties: 2,
          maxProperties: 2,
          additionalProperties: globList,
        },
        { type: 'array', items: { type: 'string', minLength: 1 }, minItems: 2, maxItems: 2, uniqueItems: true },
      ],
    },
    subjects: {
      description:
        'A manifest table (CSV or tab-separated) relative to the study file with columns subject, group, file; other columns are covariates. A subject may have several rows (recordings).',
      type: 'string',
      minLength: 1,
    },
    signal: {
      description: 'Which part of each recording to analyse.',
      type: 'object',
      additionalProperties: false,
      default: {},
      properties: {
        column: {
          description: 'Text files: 1-based column number or header name. EDF files: 1-based signal number or label.',
          anyOf: [{ type: 'integer', minimum: 1 }, { type: 'string', minLength: 1 }],
          default: 1,
        },
        start: { description: 'Samples skipped at the start of each recording.', type: 'integer', minimum: 0, default: 0 },
        length: {
          description: 'Samples kept after `start` (all that remain when absent or null).',
          anyOf: [{ type: 'integer', minimum: 1 }, { type: 'null' }],
          default: null,
        },
      },
    },
    grid: {
      description: 'The parameter grid: every combination of order, delay and scale is one cell.',
      type: 'object',
      additionalProperties: false,
      default: {},
      properties: {
        order: positiveIntList(2, 9, 'Pattern orders m (window length), 2 to 9.', [3, 4, 5]),
        delay: positiveIntList(1, 1000, 'Delays tau between the samples of a window, in samples.', [1, 2]),
        scale: positiveIntList(1, 1000, 'Time scales s: the series is averaged over non-overlapping blocks of s samples first.', [1, 2, 4]),
      },
    },
    features: {
      description: 'How the ordinal features are computed.',
      type: 'object',
      additionalProperties: false,
      default: {},
      properties: {
        include: {
          description: 'The features to compute (all when absent).',
          type: 'array',
          items: { enum: [...FEATURE_NAMES] },
          minItems: 1,
          uniqueItems: true,
          default: [...FEATURE_NAMES],
        },
        ties: {
          description:
            'Tied values in a window: appearance (earlier sample ranks lower), jitter (seeded noise below the resolution, averaged), symbols (ties as symbols of their own).',
          enum: ['appearance', 'jitter', 'symbols'],
          default: 'appearance',
        },
        jitter_repeats: { description: 'Draws averaged when ties is jitter.', type: 'integer', minimum: 1, maximum: 1000, default: 10 },
        scale_form: {
          description: 'coarse: one coarse-graining per scale; composite: averaged over the s shifted coarse-grainings.',
          enum: ['coarse', 'composite'],
          default: 'coarse',
        },
        min_windows_per_pattern: {
          description: 'A cell with fewer than this many valid windows per possible pattern (N / m!) is flagged.',
          type: 'number',
          exclusiveMinimum: 0,
          default: 5,
        },
      },
    },
    evaluation: {
      description: 'Cross-validated classification and permutation tests.',
      type: 'object',
      additionalProperties: false,
      default: {},
      properties: {
        folds: { description: 'Cross-validation folds (stratified, grouped by subject).', type: 'integer', minimum: 2, maximum: 100, default: 5 },
        repeats: { description: 'Cross-validation repeats with different seeded splits.', type: 'integer', minimum: 1, maximum: 1000, default: 10 },
        permutations: {
          description: 'Label permutations for the p-values (0 skips the tests).',
          type: 'integer',
          minimum: 0,
          maximum: 1000000,
          default: 999,
        },
        classifier: { description: 'forest (random forest) or logistic (L2-penalised logistic regression).', enum: ['forest', 'logistic'], default: 'forest' },
        trees: { description: 'Trees of the random forest.', type: 'integer', minimum: 1, maximum: 10000, default: 100 },
        l2: { description: 'L2 penalty strength (lambda) of the logistic regression.', type: 'number', exclusiveMinimum: 0, default: 1 },
        stop_early: {
          description: 'Stop permuting once the result is clearly not significant (Besag & Clifford 1991).',
          type: 'boolean',
          default: false,
        },
      },
    },
    report: {
      description: 'What the report folder contains.',
      type: 'object',
      additionalProperties: false,
      default: {},
      properties: {
        pseudonyms: {
          description: 'Replace subject ids by stable pseudonyms in the report folder; the key goes to a separate file.',
          type: 'boolean',
          default: false,
        },
      },
    },
  },
} as const;

/**
 * Contract of the feature stage: what goes in (one recording as a Float64Array, a grid and
 * options) and what comes out (one CellFeatures per grid cell). Definitions are fixed by
 * shared/DESIGN.md and documented in README.md ("Features").
 */

/** Every feature the engine computes, in report order. */
export const FEATURE_NAMES = [
  'permutation_entropy',
  'weighted_permutation_entropy',
  'statistical_complexity',
  'missing_patterns',
  'transition_entropy',
  'conditional_entropy',
  'outdegree_mean',
  'outdegree_variance',
  'self_loop_fraction',
] as const;
export type FeatureName = (typeof FEATURE_NAMES)[number];

/**
 * How tied values inside a window are ordered.
 * - `appearance`: the earlier sample ranks lower (a stable sort) — the default;
 * - `jitter`: seeded uniform noise below the data's resolution is added, features are
 *   averaged over `jitterRepeats` draws;
 * - `symbols`: tied values form symbols of their own (Bian et al. 2012, Phys. Rev. E 85, 061902).
 */
export type TieRule = 'appearance' | 'jitter' | 'symbols';

/**
 * `coarse`: one coarse-graining per scale (Costa, Goldberger & Peng 2002);
 * `composite`: the feature averaged over the s shifted coarse-grainings (Wu et al. 2013).
 */
export type ScaleForm = 'coarse' | 'composite';

export interface Grid {
  order: number[];
  delay: number[];
  scale: number[];
}

export interface Cell {
  order: number;
  delay: number;
  scale: number;
}

export interface FeatureOptions {
  ties: TieRule;
  /** Draws averaged under the `jitter` tie rule. */
  jitterRepeats: number;
  scaleForm: ScaleForm;
  /** Seed of this recording's jitter stream (derive it per recording with deriveSeed). */
  seed: number;
  /** A cell with fewer than minWindowsPerPattern * m! valid windows is flagged (common practice: 5). */
  minWindowsPerPattern: number;
}

export interface CellQuality {
  /** Windows without NaN (N). */
  validWindows: number;
  /** N / m!. */
  windowsPerPattern: number;
  /** Share of valid windows holding at least one tie. */
  tiedShare: number;
  /** Share of missing samples in the (coarse-grained) series. */
  missingShare: number;
  /** True when validWindows < minWindowsPerPattern * m!. */
  flagged: boolean;
}

export interface CellFeatures extends Cell {
  /** null when the feature cannot be computed; the reason is then in `reasons`. */
  values: Record<FeatureName, number | null>;
  reasons: Partial<Record<FeatureName, string>>;
  quality: CellQuality;
}

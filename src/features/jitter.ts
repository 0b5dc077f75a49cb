import type { Rng } from '../shared/random.ts';
import { dataResolution } from './data-resolution.ts';

/**
 * A copy of y with independent uniform noise on [0, a) added to every finite sample, with a
 * = half the data's resolution ({@link dataResolution}). Two values that differed by at
 * least the resolution keep their order, so only tied values are ordered at random: the
 * tie-breaking by small noise discussed by Zunino et al. (2017, Phys. Lett. A 381, 1883).
 * A series with a single distinct value c gets a = |c|·2^-20 (1 when c = 0). NaN stays NaN.
 * The noise is drawn from `rng` in sample order, so a seed fixes the result.
 *
 * O(n log n) for the resolution (pass `resolution` when drawing repeatedly from one series),
 * O(n) for the noise; allocates one array of n values.
 * An empty y gives an empty array.
 *
 * @example jitterBelowResolution(Float64Array.of(1, 1, 2), createRng(7)) // e.g. [1.31, 1.07, 2.44]: 1 and 1 now ordered, 2 still the largest
 */
export function jitterBelowResolution(y: Float64Array, rng: Rng, resolution = dataResolution(y)): Float64Array {
  const amplitude = jitterAmplitude(y, resolution);
  const out = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) out[i] = Number.isFinite(y[i]) ? y[i] + amplitude * rng.next() : y[i];
  return out;
}

function jitterAmplitude(y: Float64Array, resolution: number): number {
  if (Number.isFinite(resolution)) return resolution / 2;
  const first = y.find((v) => Number.isFinite(v));
  return first === undefined || first === 0 ? 1 : Math.abs(first) * 2 ** -20;
}

/**
 * Resolution of a sampled signal: the smallest positive difference between two distinct
 * values. Coarse quantisation makes ties in ordinal patterns (Zunino et al. 2017, Phys.
 * Lett. A 381, 1883), and this step size is the scale below which a tie rule may jitter.
 *
 * NaN values are ignored. Complexity O(n log n) time (sort of a typed copy), O(n) memory;
 * the input is not modified.
 *
 * @returns the step, or null when fewer than two distinct non-NaN values exist (empty input included).
 * @example sampleResolution(Float64Array.of(3, 1, NaN, 1.5, 3)) // 0.5
 */
export function sampleResolution(values: Float64Array): number | null {
  const sorted = finiteCopy(values).sort();
  let step = Infinity;
  for (let i = 1; i < sorted.length; i++) {
    const d = sorted[i] - sorted[i - 1];
    if (d > 0 && d < step) step = d;
  }
  return step === Infinity ? null : step;
}

function finiteCopy(values: Float64Array): Float64Array {
  let n = 0;
  for (let i = 0; i < values.length; i++) if (!Number.isNaN(values[i])) n++;
  const out = new Float64Array(n);
  let k = 0;
  for (let i = 0; i < values.length; i++) if (!Number.isNaN(values[i])) out[k++] = values[i];
  return out;
}

/**
 * Slow, obvious implementation used only by the tests: sorts every window (a stable sort,
 * so the earlier of two equal samples ranks lower) and counts by the resulting permutation.
 * It shares no code with src/features.
 */
export interface SlowScan {
  counts: Map<string, number>;
  weights: Map<string, number>;
  validWindows: number;
  tiedWindows: number;
  transitions: Map<string, number>;
}

export function windowAt(y: ArrayLike<number>, t: number, order: number, delay: number): number[] {
  return Array.from({ length: order }, (_, k) => y[t + k * delay]);
}

/** The sorting permutation of a window (stable), as a key like "2,0,1". */
export function slowPatternKey(window: number[]): string {
  return window
    .map((value, index) => ({ value, index }))
    .sort((a, b) => a.value - b.value || a.index - b.index)
    .map((e) => e.index)
    .join(',');
}

/** The weak ordering of a window as dense ranks, as a key like "0,1,1". */
export function slowSymbolKey(window: number[]): string {
  const distinct = [...new Set(window)].sort((a, b) => a - b);
  return window.map((v) => distinct.indexOf(v)).join(',');
}

function populationVariance(values: number[]): number {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  return values.reduce((a, v) => a + (v - mean) ** 2, 0) / values.length;
}

export function slowScan(y: ArrayLike<number>, order: number, delay: number, symbols = false): SlowScan {
  const result: SlowScan = { counts: new Map(), weights: new Map(), validWindows: 0, tiedWindows: 0, transitions: new Map() };
  let previous: string | null = null;
  for (let t = 0; t + (order - 1) * delay < y.length; t++) {
    const window = windowAt(y, t, order, delay);
    if (window.some((v) => Number.isNaN(v))) {
      previous = null;
      continue;
    }
    const key = symbols ? slowSymbolKey(window) : slowPatternKey(window);
    result.counts.set(key, (result.counts.get(key) ?? 0) + 1);
    result.weights.set(key, (result.weights.get(key) ?? 0) + populationVariance(window));
    result.validWindows++;
    if (new Set(window).size < window.length) result.tiedWindows++;
    if (previous !== null) {
      const edge = `${previous}>${key}`;
      result.transitions.set(edge, (result.transitions.get(edge) ?? 0) + 1);
    }
    previous = key;
  }
  return result;
}

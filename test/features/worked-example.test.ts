// Bandt & Pompe (2002), Phys. Rev. Lett. 88, 174102: the worked example x = (4, 7, 9, 10, 6,
// 11, 3), delay 1. Pattern counts and entropies [M for the paper's text, D for the numbers,
// shared/REFERENCES.md]; weighted entropies and complexity [D, REFERENCES.md].
import { describe, expect, it } from 'vitest';
import {
  computeGridFeatures,
  countOrdinalPatterns,
  ordinalPatternCode,
  ordinalPatternFromCode,
  type FeatureOptions,
} from '../../src/features/index.ts';

const x = Float64Array.of(4, 7, 9, 10, 6, 11, 3);
const options: FeatureOptions = { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5 };
const BITS = Math.log(2);
/** Values quoted to 6 decimals: tolerance half a unit of the last place. */
const SIX_DECIMALS = 5e-7;

describe('Bandt & Pompe (2002) worked example', () => {
  const [order2, order3] = computeGridFeatures(x, { order: [2, 3], delay: [1], scale: [1] }, options);

  it('order 2: 4 rising and 2 falling pairs [M/D]', () => {
    const counts = countOrdinalPatterns(x, 2, 1).counts;
    expect(counts[ordinalPatternCode([1, 2])]).toBe(4);
    expect(counts[ordinalPatternCode([2, 1])]).toBe(2);
  });

  it('order 2: H = 0.918296 bits [D]; weighted 0.912591 bits [D]', () => {
    // normalised by ln 2! = ln 2, so the normalised value equals the entropy in bits
    expect(Math.abs((order2.values.permutation_entropy as number) - 0.918296)).toBeLessThan(SIX_DECIMALS);
    expect(Math.abs((order2.values.weighted_permutation_entropy as number) - 0.912591)).toBeLessThan(SIX_DECIMALS);
  });

  it('order 3: probabilities (2/5, 2/5, 1/5) over the patterns 012, 201 (i.e. 102 in rank form) and 102 [M/D]', () => {
    const { counts } = countOrdinalPatterns(x, 3, 1);
    const byPattern = new Map<string, number>();
    counts.forEach((c, code) => c > 0 && byPattern.set((ordinalPatternFromCode(code, 3) as number[]).join(''), c));
    // sorting permutations: (4,7,9),(7,9,10) -> 012; (9,10,6),(6,11,3) -> 201; (10,6,11) -> 102
    expect(Object.fromEntries(byPattern)).toEqual({ '012': 2, '201': 2, '102': 1 });
  });

  it('order 3: H = 1.521928 bits, normalised 0.588762 [D]; weighted 1.413962 bits, normalised 0.546995 [D]', () => {
    const pe = order3.values.permutation_entropy as number;
    const wpe = order3.values.weighted_permutation_entropy as number;
    expect(Math.abs(pe * Math.log(6) / BITS - 1.521928)).toBeLessThan(SIX_DECIMALS);
    expect(Math.abs(pe - 0.588762)).toBeLessThan(SIX_DECIMALS);
    expect(Math.abs(wpe * Math.log(6) / BITS - 1.413962)).toBeLessThan(SIX_DECIMALS);
    expect(Math.abs(wpe - 0.546995)).toBeLessThan(SIX_DECIMALS);
  });

  it('order 3: statistical complexity 0.289954 [D]; 3 of 6 patterns missing', () => {
    expect(Math.abs((order3.values.statistical_complexity as number) - 0.289954)).toBeLessThan(SIX_DECIMALS);
    expect(order3.values.missing_patterns).toBe(0.5);
  });

  it('order 3 network, counted by hand from the five windows [D]: 012>012, 012>201, 201>102, 102>201', () => {
    // four transitions, each once: transition entropy ln 4; sources 012 (2), 201 (1), 102 (1)
    expect(order3.values.transition_entropy).toBeCloseTo(Math.log(4), 14);
    const sourceEntropy = -(0.5 * Math.log(0.5) + 2 * 0.25 * Math.log(0.25));
    expect(order3.values.conditional_entropy).toBeCloseTo(Math.log(4) - sourceEntropy, 14);
    expect(order3.values.outdegree_mean).toBeCloseTo(4 / 3, 14); // 012: 2 successors, 201: 1, 102: 1
    expect(order3.values.outdegree_variance).toBeCloseTo(2 / 9, 14);
    expect(order3.values.self_loop_fraction).toBe(0.25);
  });

  it('quality: 5 valid windows, below 5·3! so flagged (common practice), no ties, nothing missing', () => {
    expect(order3.quality).toEqual({ validWindows: 5, windowsPerPattern: 5 / 6, tiedShare: 0, missingShare: 0, flagged: true });
  });
});

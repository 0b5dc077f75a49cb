/**
 * Permutation p-values: p = (1 + b) / (1 + B) (Phipson & Smyth 2010, Stat. Appl. Genet. Mol.
 * Biol. 9, art. 39 [S]) on crafted pipelines whose null distribution is known in closed
 * form [D]; Besag & Clifford (1991, Biometrika 78, 301) sequential stopping at h exceedances
 * giving h / L [M for the paper's notation]; order independence of permutation k.
 */
import { describe, expect, it } from 'vitest';
import {
  permutationLabels,
  permutationPValue,
  permutedStatistics,
  permutedStatisticsRange,
  runPermutationTest,
} from '../../../src/evaluate/permutation.ts';
import type { PermutablePipeline } from '../../../src/evaluate/permutation.ts';

const forty = Uint8Array.from({ length: 40 }, (_, i) => (i < 20 ? 0 : 1));

/** Statistic = number of subjects whose label is unchanged: the observed labels score 40, the maximum. */
function agreementPipeline(labels: Uint8Array): PermutablePipeline {
  return {
    subjectLabels: labels,
    seed: 5,
    statistics: (l) => Float64Array.of(l.reduce((n, v, i) => n + (v === labels[i] ? 1 : 0), 0)),
  };
}

describe('permutationPValue', () => {
  it('counts ties as exceedances: observed 0.8, null [0.5, 0.9, 0.8, 0.1] -> b 2, p 3/5 [D]', () => {
    const r = permutationPValue(0.8, [0.5, 0.9, 0.8, 0.1]);
    expect(r.exceedances).toBe(2);
    expect(r.p_value).toBe(3 / 5);
    expect(r.p_value_se).toBeCloseTo(Math.sqrt((0.6 * 0.4) / 4), 15);
  });

  it('is never 0: an observed score above every permuted one gives 1 / (1 + B)', () => {
    expect(permutationPValue(2, [0, 1, 1.5]).p_value).toBe(1 / 4);
  });
});

describe('runPermutationTest on crafted pipelines', () => {
  it('gives p = 1/(1+B) when no permutation can reach the observed statistic', () => {
    // P(a random permutation of 20 + 20 labels reproduces them) = 1 / C(40, 20) ~ 7e-12 [D].
    const pipeline = agreementPipeline(forty);
    const observed = pipeline.statistics(forty);
    const run = runPermutationTest(pipeline, observed, 199, null);
    expect(run.headline.p_value).toBe(1 / 200);
    expect(run.headline.exceedances).toBe(0);
    expect(run.stoppedEarly).toBe(false);
  });

  it('gives p = 1 when every permutation ties the observed statistic', () => {
    const pipeline: PermutablePipeline = { subjectLabels: forty, seed: 1, statistics: () => Float64Array.of(0.5) };
    expect(runPermutationTest(pipeline, Float64Array.of(0.5), 99, null).headline.p_value).toBe(1);
  });

  it('has a uniform null: with a statistic that is exchangeable under permutation, b/B estimates the tail', () => {
    // statistic = number of group-1 labels among the first 20 subjects, hypergeometric(40, 20, 20);
    // observed 10 (labels alternate). P(X = 10) = C(20,10)^2 / C(40,20) = 0.247629, so by symmetry
    // P(X >= 10) = 0.5 + 0.247629 / 2 = 0.623814 [D, closed form].
    const alternating = Uint8Array.from({ length: 40 }, (_, i) => i % 2);
    const pipeline: PermutablePipeline = {
      subjectLabels: alternating,
      seed: 3,
      statistics: (l) => Float64Array.of(l.subarray(0, 20).reduce((a, b) => a + b, 0)),
    };
    const B = 4000;
    const run = runPermutationTest(pipeline, pipeline.statistics(alternating), B, null);
    const tail = 0.5 + 0.24762886543609086 / 2;
    // 4 Monte Carlo standard errors: fails with probability < 1e-4 for a correct sampler.
    expect(Math.abs(run.headline.exceedances / B - tail)).toBeLessThan(4 * Math.sqrt((tail * (1 - tail)) / B));
  });

  it('stops after h exceedances with p = h / L (Besag & Clifford 1991)', () => {
    const alternating = Uint8Array.from({ length: 40 }, (_, i) => i % 2);
    const pipeline: PermutablePipeline = {
      subjectLabels: alternating,
      seed: 3,
      statistics: (l) => Float64Array.of(l.subarray(0, 20).reduce((a, b) => a + b, 0)),
    };
    const observed = pipeline.statistics(alternating);
    const run = runPermutationTest(pipeline, observed, 999, 10);
    expect(run.stoppedEarly).toBe(true);
    const L = run.nullStatistics.length;
    // independently: the first L permutations hold exactly 10 exceedances and the L-th is one
    let b = 0;
    for (let k = 0; k < L; k++) if (permutedStatistics(pipeline, k)[0] >= observed[0]) b++;
    expect(b).toBe(10);
    expect(permutedStatistics(pipeline, L - 1)[0]).toBeGreaterThanOrEqual(observed[0]);
    expect(run.headline.p_value).toBe(10 / L);
  });

  it('never stops early unless asked (default off)', () => {
    const pipeline: PermutablePipeline = { subjectLabels: forty, seed: 1, statistics: () => Float64Array.of(0.5) };
    const run = runPermutationTest(pipeline, Float64Array.of(0.5), 50, null);
    expect(run.nullStatistics.length).toBe(50);
  });
});

describe('permutation k is computed alone', () => {
  it('keeps group sizes and whole subjects', () => {
    const p = permutationLabels(forty, 11, 7);
    expect(p.reduce((a, b) => a + b, 0)).toBe(20);
    expect(Array.from(forty)).toEqual(Array.from({ length: 40 }, (_, i) => (i < 20 ? 0 : 1))); // input untouched
  });

  it('gives the same statistics whichever range or order computes it', () => {
    const pipeline = agreementPipeline(forty);
    const all = permutedStatisticsRange(pipeline, 0, 30);
    const back = [...permutedStatisticsRange(pipeline, 20, 30), ...permutedStatisticsRange(pipeline, 0, 20)];
    expect([...back.slice(10), ...back.slice(0, 10)]).toEqual(all);
    expect(permutedStatistics(pipeline, 17)).toEqual(all[17]);
  });
});

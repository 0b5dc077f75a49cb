/**
 * The calibration script's binomial interval against scipy: exact Clopper–Pearson (1934)
 * limits from scipy.stats.beta.ppf, printed by scripts/fixtures/pipeline/clopper_pearson.py [S].
 */
import { describe, expect, it } from 'vitest';
import { clopperPearson, simulateStudy } from '../../../scripts/calibrate.ts';

const SCIPY: [number, number, number, number][] = [
  [10, 200, 0.02423416547210855, 0.09002753770135137],
  [0, 20, 0, 0.1684334709830853],
  [1, 20, 0.0012650894979498038, 0.24873276277202777],
  [13, 200, 0.03506070865697905, 0.10858723650381519],
];

describe('clopperPearson', () => {
  for (const [x, n, low, high] of SCIPY) {
    it(`${x} of ${n}`, () => {
      const [l, h] = clopperPearson(x, n);
      expect(l).toBeCloseTo(low, 10);
      expect(h).toBeCloseTo(high, 10);
    });
  }
});

describe('simulateStudy', () => {
  it('draws both groups from one process when the shift is 0', () => {
    const m = simulateStudy(1, 20, 0);
    expect(m.values.length).toBe(40 * 12);
    expect(Array.from(m.labels).filter((l) => l === 1)).toHaveLength(20);
  });
});

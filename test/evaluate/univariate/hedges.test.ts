import { describe, expect, it } from 'vitest';
import { hedgesG, type HedgesG } from '../../../src/evaluate/hedges.ts';
import { expectClose } from './helpers.ts';

function computed(r: ReturnType<typeof hedgesG>): HedgesG {
  if ('reason' in r) throw new Error(`expected a value, got: ${r.reason}`);
  return r;
}

describe('hedgesG', () => {
  it('worked numbers: means 103 vs 100, SDs 5.5 and 4.5, n = 50 each (Borenstein et al. 2009 ch. 4 formulas [S], inputs [M], numbers [D])', () => {
    const r = computed(hedgesG({ n: 50, mean: 100, sd: 4.5 }, { n: 50, mean: 103, sd: 5.5 }));
    expectClose(r.d, 0.597022, 0, 5e-7);
    expectClose(r.correction, 0.992327, 0, 5e-7);
    expectClose(r.g, 0.592442, 0, 5e-7);
    expectClose(r.variance, 0.041143, 0, 5e-7);
    expectClose(r.low, 0.1949, 0, 5e-5);
    expectClose(r.high, 0.99, 0, 5e-5);
    expectClose(r.se, Math.sqrt(r.variance), 1e-15);
  });

  it('is antisymmetric in the groups and its interval is symmetric about g [D]', () => {
    const a = { n: 8, mean: 1.2, sd: 0.7 };
    const b = { n: 11, mean: 2.0, sd: 1.1 };
    const forward = computed(hedgesG(a, b));
    const backward = computed(hedgesG(b, a));
    expectClose(backward.g, -forward.g, 1e-15);
    expectClose(forward.high - forward.g, forward.g - forward.low, 1e-12);
  });

  it('J = 1 − 3/(4·df − 1) at df = 4 is 0.8 [D]', () => {
    const r = computed(hedgesG({ n: 3, mean: 7 / 3, sd: Math.sqrt(7 / 3) }, { n: 3, mean: 14 / 3, sd: Math.sqrt(7 / 3) }));
    expectClose(r.correction, 0.8, 1e-15);
    expectClose(r.d, (7 / 3) / Math.sqrt(7 / 3), 1e-14);
  });

  it('99% interval uses z = 2.575829 [S: standard normal table]', () => {
    const r = computed(hedgesG({ n: 50, mean: 100, sd: 4.5 }, { n: 50, mean: 103, sd: 5.5 }, 0.99));
    expectClose(r.high - r.g, 2.575829 * r.se, 1e-6);
  });

  it('gives a reason instead of a number for too few values or zero pooled variance', () => {
    expect(hedgesG({ n: 1, mean: 1, sd: Number.NaN }, { n: 5, mean: 2, sd: 1 })).toEqual({
      reason: 'needs at least 2 values per group (got 1 and 5)',
    });
    expect(hedgesG({ n: 4, mean: 1, sd: 0 }, { n: 4, mean: 2, sd: 0 })).toEqual({ reason: 'zero variance within both groups' });
    expect(hedgesG({ n: 4, mean: Number.NaN, sd: 1 }, { n: 4, mean: 2, sd: 1 })).toEqual({
      reason: 'a group mean or standard deviation is not finite',
    });
  });

  it('rejects a level outside (0, 1)', () => {
    expect(() => hedgesG({ n: 4, mean: 1, sd: 1 }, { n: 4, mean: 2, sd: 1 }, 95)).toThrow(/level must lie in \(0, 1\), got 95/);
  });
});

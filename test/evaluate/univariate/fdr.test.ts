import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { benjaminiHochberg } from '../../../src/evaluate/fdr.ts';
import { expectClose, loadScipyReference } from './helpers.ts';

const reference = loadScipyReference();

describe('benjaminiHochberg', () => {
  // Benjamini & Hochberg (1995), J. R. Stat. Soc. B 57, 289: the 15 p-values of their example
  // [S, via scipy's documentation of false_discovery_control].
  const p15 = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1.0];
  const q15 = [0.0015, 0.003, 0.0095, 0.035625, 0.0603, 0.06385714, 0.06385714, 0.0645, 0.0765, 0.486, 0.58118182, 0.714875, 0.75323077, 0.81321429, 1];

  it('Benjamini & Hochberg (1995) example: adjusted values [S]', () => {
    const q = benjaminiHochberg(p15);
    q15.forEach((expected, i) => expectClose(q[i], expected, 0, 5e-9));
  });

  it('Benjamini & Hochberg (1995) example: 4 rejections at q = 0.05 [S]', () => {
    expect(Array.from(benjaminiHochberg(p15)).filter((q) => q <= 0.05).length).toBe(4);
  });

  it('matches scipy.stats.false_discovery_control(method="bh") on random and tied p-values (fixture)', () => {
    for (const c of reference.benjamini_hochberg) {
      const q = benjaminiHochberg(c.p);
      c.q.forEach((expected, i) => expectClose(q[i], expected, 1e-13, 1e-300));
    }
  });

  it('keeps NaN as NaN and leaves it out of the family count (doc example, by hand)', () => {
    const q = benjaminiHochberg([0.01, 0.04, Number.NaN, 0.03]);
    expect(q[2]).toBeNaN();
    // m = 3, not 4: q = (0.03, 0.04, —, 0.04).
    expectClose(q[0], 0.03, 1e-15);
    expectClose(q[1], 0.04, 1e-15);
    expectClose(q[3], 0.04, 1e-15);
  });

  it('equals the q-values of the p-values without the NaN (property)', () => {
    const entry = fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.constant(Number.NaN));
    fc.assert(
      fc.property(fc.array(entry, { maxLength: 50 }), (p) => {
        const withNaN = benjaminiHochberg(p);
        const present = p.filter((v) => !Number.isNaN(v));
        const without = benjaminiHochberg(present);
        let k = 0;
        p.forEach((v, i) => {
          if (Number.isNaN(v)) expect(withNaN[i]).toBeNaN();
          else expect(withNaN[i]).toBe(without[k++]);
        });
      }),
    );
  });

  it('is monotone in p, at least p, and at most 1 (property; Benjamini & Hochberg 1995 step-up definition)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 80 }), (p) => {
        const q = benjaminiHochberg(p);
        for (let i = 0; i < p.length; i++) {
          expect(q[i]).toBeGreaterThanOrEqual(p[i]);
          expect(q[i]).toBeLessThanOrEqual(1);
          for (let j = 0; j < p.length; j++) if (p[i] <= p[j]) expect(q[i]).toBeLessThanOrEqual(q[j]);
        }
      }),
    );
  });

  it('handles empty input and rejects p outside [0, 1]', () => {
    expect(benjaminiHochberg([]).length).toBe(0);
    expect(() => benjaminiHochberg([0.2, 1.5])).toThrow(/p-value 1.5 at position 1 lies outside \[0, 1\]/);
  });
});

// A slow, obvious implementation (stable sort of every window, test/features/oracle.ts)
// against the incremental kernels, on random series with and without NaN and ties
// (property tests, fast-check). Counts, tied windows and transitions must agree exactly;
// summed window variances to 1e-9 relative (Welford vs. two-pass summation order).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  countOrdinalPatterns,
  ordinalPatternFromCode,
  ordinalSymbolFromCode,
  scanOrdinalPatterns,
  type OrdinalScan,
} from '../../src/features/index.ts';
import { slowScan } from './oracle.ts';

const sample = fc.oneof(
  { arbitrary: fc.integer({ min: -3, max: 3 }), weight: 4 }, // many ties
  { arbitrary: fc.double({ min: -1e3, max: 1e3, noNaN: true }), weight: 4 },
  { arbitrary: fc.constant(NaN), weight: 1 },
);
// size 'max': fast-check otherwise keeps arrays near 10 values, too short for orders >= 5
const series = fc.oneof(
  fc.array(sample, { maxLength: 160, size: 'max' }),
  fc.array(fc.integer({ min: 0, max: 4 }), { maxLength: 160, size: 'max' }), // ties everywhere, no NaN
  fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { maxLength: 160, size: 'max' }), // no NaN, no ties in practice
);
const orders = fc.uniqueArray(fc.integer({ min: 2, max: 9 }), { minLength: 1, maxLength: 4 });
const delay = fc.integer({ min: 1, max: 4 });

function keyOf(code: number, order: number, symbols: boolean): string {
  const decoded = symbols ? ordinalSymbolFromCode(code, order) : ordinalPatternFromCode(code, order);
  if (decoded === null) throw new Error(`code ${code} of order ${order} does not decode`);
  return decoded.join(',');
}

function expectAgreement(fast: OrdinalScan, values: number[], symbols: boolean): void {
  const slow = slowScan(values, fast.order, fast.delay, symbols);
  expect(fast.validWindows).toBe(slow.validWindows);
  expect(fast.tiedWindows).toBe(slow.tiedWindows);
  const counts = new Map<string, number>();
  fast.patterns.forEach((code, i) => {
    const key = keyOf(code, fast.order, symbols);
    counts.set(key, fast.counts[i]);
    const slowWeight = slow.weights.get(key) ?? NaN;
    expect(Math.abs(fast.weights[i] - slowWeight)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(slowWeight)));
  });
  expect(counts).toEqual(slow.counts);
  const edges = new Map<string, number>();
  fast.transitions.source.forEach((source, e) => {
    const edge = `${keyOf(source, fast.order, symbols)}>${keyOf(fast.transitions.target[e], fast.order, symbols)}`;
    expect(edges.has(edge)).toBe(false);
    edges.set(edge, fast.transitions.count[e]);
  });
  expect(edges).toEqual(slow.transitions);
}

describe('incremental kernels agree with sorting every window', () => {
  it('countOrdinalPatterns: exact counts, every order and delay', () => {
    fc.assert(
      fc.property(series, fc.integer({ min: 2, max: 9 }), delay, (values, order, tau) => {
        const fast = countOrdinalPatterns(Float64Array.from(values), order, tau);
        const slow = slowScan(values, order, tau);
        const counts = new Map<string, number>();
        fast.counts.forEach((c, code) => c > 0 && counts.set(keyOf(code, order, false), c));
        expect(counts).toEqual(slow.counts);
        expect(fast.validWindows).toBe(slow.validWindows);
      }),
      { numRuns: 400 },
    );
  });

  it('scanOrdinalPatterns, ties by appearance: counts, weights, ties, transitions', () => {
    fc.assert(
      fc.property(series, orders, delay, (values, list, tau) => {
        for (const scan of scanOrdinalPatterns(Float64Array.from(values), tau, list)) expectAgreement(scan, values, false);
      }),
      { numRuns: 300 },
    );
  });

  it('scanOrdinalPatterns, ties as symbols (Bian et al. 2012): the same against dense-rank keys', () => {
    fc.assert(
      fc.property(series, orders, delay, (values, list, tau) => {
        for (const scan of scanOrdinalPatterns(Float64Array.from(values), tau, list, 'symbols')) expectAgreement(scan, values, true);
      }),
      { numRuns: 300 },
    );
  });

  it('collected (sorted) transitions for large orders at delay >= 2 agree too', () => {
    const values = Array.from({ length: 3000 }, (_, i) => Math.sin(i * 1.7) * 100 + ((i * 7919) % 13));
    for (const scan of scanOrdinalPatterns(Float64Array.from(values), 2, [7, 8, 9])) expectAgreement(scan, values, false);
  });

  it('inputs are not changed', () => {
    const y = Float64Array.of(3, 1, NaN, 2, 2, 5, 4);
    const copy = y.slice();
    scanOrdinalPatterns(y, 1, [2, 3]);
    countOrdinalPatterns(y, 3, 1);
    expect(y).toEqual(copy);
  });
});

describe('a delay longer than the series', () => {
  it('counts nothing and returns at once', () => {
    expect(countOrdinalPatterns(Float64Array.of(1, 2, 3), 3, 2 ** 30).validWindows).toBe(0);
    expect(scanOrdinalPatterns(Float64Array.of(1, 2, 3), 2 ** 30, [3])[0].validWindows).toBe(0);
  });
});

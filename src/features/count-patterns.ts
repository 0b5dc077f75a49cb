import { assertDelay, assertOrder } from './check-arguments.ts';
import { factorial } from './factorial.ts';

/** Pattern counts of one (order, delay) over a series. */
export interface PatternCounts {
  order: number;
  delay: number;
  /** counts[code] = number of valid windows with that pattern (codes of ordinalPatternCode). */
  counts: Int32Array;
  /** Windows without NaN (N = sum of counts). */
  validWindows: number;
}

/**
 * Counts the ordinal patterns (Bandt & Pompe 2002, Phys. Rev. Lett. 88, 174102) of order m
 * and delay tau over y: every window (y_t, y_{t+tau}, ..., y_{t+(m-1)tau}) without NaN adds
 * one to counts[code], code as in {@link ordinalPatternCode} (ties: the earlier sample ranks
 * lower).
 *
 * Incremental: the series splits into tau chains (t mod tau) and each chain into stretches
 * free of NaN. Along a stretch the code of every order k is the previous window's code of
 * order k-1 plus (rank of the newest sample among the k-1 before it) · (k-1)!, so a step costs
 * m-1 branch-free comparisons and m-1 additions, kept in registers by one unrolled loop per
 * order: no sort, no allocation. O(n·m) time, O(m!) memory.
 *
 * Returns all-zero counts (validWindows 0) for a series shorter than (m-1)·tau + 1 or one
 * where every window holds a NaN. Throws a RangeError for an order outside 2..9 or a delay
 * below 1.
 *
 * @example countOrdinalPatterns(Float64Array.of(4, 7, 9, 10, 6, 11, 3), 2, 1).counts // [2, 4]
 */
export function countOrdinalPatterns(y: Float64Array, order: number, delay: number): PatternCounts {
  assertOrder(order, 'countOrdinalPatterns');
  assertDelay(delay, 'countOrdinalPatterns');
  const counts = new Int32Array(factorial(order));
  const countRun = RUN_COUNTERS[order];
  for (let chain = 0; chain < delay && chain < y.length; chain++) {
    let first = nextCompleteWindow(y, chain, delay, order);
    while (first < y.length) {
      const stop = countRun(y, first, delay, counts);
      first = nextCompleteWindow(y, stop + delay, delay, order);
    }
  }
  let valid = 0;
  for (let code = 0; code < counts.length; code++) valid += counts[code];
  return { order, delay, counts, validWindows: valid };
}

/**
 * First sample v >= from on the chain of `from` such that v, v+step, ..., v+(order-1)·step
 * all exist and hold no NaN; y.length when there is none.
 */
function nextCompleteWindow(y: Float64Array, from: number, step: number, order: number): number {
  let run = 0;
  for (let v = from; v < y.length; v += step) {
    if (y[v] !== y[v]) run = 0;
    else if (++run === order) return v - (order - 1) * step;
  }
  return y.length;
}

/** Code (as in ordinalPatternCode) of the window of the given order that ends at sample `end`. */
function prefixCode(y: Float64Array, end: number, order: number, step: number): number {
  const start = end - (order - 1) * step;
  let code = 0;
  for (let k = 1; k < order; k++) {
    const value = y[start + k * step];
    let below = 0;
    for (let j = 0; j < k; j++) if (y[start + j * step] <= value) below++;
    code += below * factorial(k);
  }
  return code;
}

type RunCounter = (y: Float64Array, first: number, step: number, counts: Int32Array) => number;

/*
 * One unrolled loop per order: the previous samples y1..y{m-1} and the codes c2..c{m-1} of the
 * shorter windows ending at the previous sample live in local variables, so the JIT keeps
 * them in registers. rK is the rank of the newest sample among the K-1 samples before it.
 * Each counts the windows of the chain first, first+step, ... from the one starting at
 * `first` (whose samples the caller checked) up to the first NaN, and returns the index of
 * that NaN (y.length when the chain ends first).
 */
function countRun2(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 1 * step;
  let y1 = y[v - step];
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    counts[r2]++;
    y1 = x0;
  }
  return n;
}

function countRun3(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 2 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step];
  let c2 = prefixCode(y, v - step, 2, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    counts[c2 + r3 * 2]++;
    c2 = r2;
    y2 = y1; y1 = x0;
  }
  return n;
}

function countRun4(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 3 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    counts[c3 + r4 * 6]++;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

function countRun5(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 4 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step], y4 = y[v - 4 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step), c4 = prefixCode(y, v - step, 4, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    const r5 = r4 + +(y4 <= x0);
    counts[c4 + r5 * 24]++;
    c4 = c3 + r4 * 6;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y4 = y3; y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

function countRun6(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 5 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step], y4 = y[v - 4 * step], y5 = y[v - 5 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step), c4 = prefixCode(y, v - step, 4, step), c5 = prefixCode(y, v - step, 5, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    const r5 = r4 + +(y4 <= x0);
    const r6 = r5 + +(y5 <= x0);
    counts[c5 + r6 * 120]++;
    c5 = c4 + r5 * 24;
    c4 = c3 + r4 * 6;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y5 = y4; y4 = y3; y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

function countRun7(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 6 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step], y4 = y[v - 4 * step], y5 = y[v - 5 * step], y6 = y[v - 6 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step), c4 = prefixCode(y, v - step, 4, step), c5 = prefixCode(y, v - step, 5, step), c6 = prefixCode(y, v - step, 6, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    const r5 = r4 + +(y4 <= x0);
    const r6 = r5 + +(y5 <= x0);
    const r7 = r6 + +(y6 <= x0);
    counts[c6 + r7 * 720]++;
    c6 = c5 + r6 * 120;
    c5 = c4 + r5 * 24;
    c4 = c3 + r4 * 6;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y6 = y5; y5 = y4; y4 = y3; y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

function countRun8(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 7 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step], y4 = y[v - 4 * step], y5 = y[v - 5 * step], y6 = y[v - 6 * step], y7 = y[v - 7 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step), c4 = prefixCode(y, v - step, 4, step), c5 = prefixCode(y, v - step, 5, step), c6 = prefixCode(y, v - step, 6, step), c7 = prefixCode(y, v - step, 7, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    const r5 = r4 + +(y4 <= x0);
    const r6 = r5 + +(y5 <= x0);
    const r7 = r6 + +(y6 <= x0);
    const r8 = r7 + +(y7 <= x0);
    counts[c7 + r8 * 5040]++;
    c7 = c6 + r7 * 720;
    c6 = c5 + r6 * 120;
    c5 = c4 + r5 * 24;
    c4 = c3 + r4 * 6;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y7 = y6; y6 = y5; y5 = y4; y4 = y3; y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

function countRun9(y: Float64Array, first: number, step: number, counts: Int32Array): number {
  const n = y.length;
  let v = first + 8 * step;
  let y1 = y[v - step], y2 = y[v - 2 * step], y3 = y[v - 3 * step], y4 = y[v - 4 * step], y5 = y[v - 5 * step], y6 = y[v - 6 * step], y7 = y[v - 7 * step], y8 = y[v - 8 * step];
  let c2 = prefixCode(y, v - step, 2, step), c3 = prefixCode(y, v - step, 3, step), c4 = prefixCode(y, v - step, 4, step), c5 = prefixCode(y, v - step, 5, step), c6 = prefixCode(y, v - step, 6, step), c7 = prefixCode(y, v - step, 7, step), c8 = prefixCode(y, v - step, 8, step);
  for (; v < n; v += step) {
    const x0 = y[v];
    if (x0 !== x0) return v;
    const r2 = +(y1 <= x0);
    const r3 = r2 + +(y2 <= x0);
    const r4 = r3 + +(y3 <= x0);
    const r5 = r4 + +(y4 <= x0);
    const r6 = r5 + +(y5 <= x0);
    const r7 = r6 + +(y6 <= x0);
    const r8 = r7 + +(y7 <= x0);
    const r9 = r8 + +(y8 <= x0);
    counts[c8 + r9 * 40320]++;
    c8 = c7 + r8 * 5040;
    c7 = c6 + r7 * 720;
    c6 = c5 + r6 * 120;
    c5 = c4 + r5 * 24;
    c4 = c3 + r4 * 6;
    c3 = c2 + r3 * 2;
    c2 = r2;
    y8 = y7; y7 = y6; y6 = y5; y5 = y4; y4 = y3; y3 = y2; y2 = y1; y1 = x0;
  }
  return n;
}

const RUN_COUNTERS: readonly RunCounter[] = [
  countRun2, countRun2, countRun2, countRun3, countRun4, countRun5, countRun6, countRun7, countRun8, countRun9,
];

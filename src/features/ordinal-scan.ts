import { assertDelay, assertOrder } from './check-arguments.ts';
import { factorial } from './factorial.ts';
import { orderedBellNumber } from './ordered-bell.ts';
import { symbolCodeSpace } from './symbol-code.ts';

/** Transitions between the patterns of consecutive valid windows: one entry per distinct edge. */
export interface TransitionEdges {
  /** Code of the earlier window's pattern; edges are sorted by source. */
  source: Int32Array;
  /** Code of the later window's pattern. */
  target: Int32Array;
  /** Number of times the edge occurs. */
  count: Float64Array;
}

/** Everything one pass learns about one order at one delay. */
export interface OrdinalScan {
  order: number;
  delay: number;
  ties: 'appearance' | 'symbols';
  /** Number of possible patterns: m! (appearance) or the ordered Bell number (symbols). */
  alphabetSize: number;
  /** Codes of the patterns seen at least once, ascending. */
  patterns: Int32Array;
  /** Valid windows per seen pattern (aligned with `patterns`). */
  counts: Float64Array;
  /** Sum of the population variances of those windows (aligned with `patterns`). */
  weights: Float64Array;
  /** Windows without NaN (N). */
  validWindows: number;
  /** Valid windows holding at least two equal values. */
  tiedWindows: number;
  transitions: TransitionEdges;
}

/** Code ranges up to this size are counted in dense typed arrays, larger ones in a Map. */
const DENSE_CODE_LIMIT = 2 ** 23;
/** Transition matrices up to this many cells are dense; beyond, edges are collected and sorted. */
const DENSE_EDGE_LIMIT = 2 ** 20;
/** ... and only up to this many cells per sample of the series (short coarse-grained series collect). */
const DENSE_EDGE_PER_SAMPLE = 4;

const enum EdgeMode {
  /** delay 1, appearance: the next code follows from (code, rank of the newest sample). */
  ByRank,
  /** a dense source x target matrix. */
  Dense,
  /** keys source·space + target appended, sorted at the end. */
  Collected,
}

/**
 * One pass over y at one delay that feeds every requested order at once: pattern counts,
 * variance-weighted counts (Fadlallah et al. 2013, Phys. Rev. E 87, 022911), tied windows and
 * the transitions of the ordinal network (Small 2013, Proc. IEEE ISCAS, 2509; McCullough et
 * al. 2015, Chaos 25, 053101) between windows t and t+1 when both are valid.
 *
 * Ties follow `ties`: 'appearance' (the earlier sample ranks lower, codes of
 * ordinalPatternCode) or 'symbols' (weak orderings, codes of ordinalSymbolCode). A window
 * holding a NaN is skipped. The codes of all orders are derived incrementally along each
 * chain t mod tau; the window variances of all orders come from one pass over the newest m_max
 * samples with sums shifted by the newest sample (the shifted-data algorithm of Chan, Golub &
 * LeVeque 1983, Am. Stat. 37, 242: the shift lies inside the window, which bounds the
 * cancellation; a constant window gives exactly 0). O(n · (m_max + orders)) time;
 * memory O(sum of m! + transition tables), plus 4 bytes per window (8 when the key
 * source·space + target can exceed 2^32) for orders whose transition matrix is too large to
 * hold densely (delay >= 2 with m >= 7, or symbols with m >= 5) or large beside the series
 * (more than 4 cells per sample), whose edges are then sorted (O(N log N)).
 *
 * Orders are deduplicated and returned ascending. A series too short for an order gives
 * validWindows 0 and empty lists. Throws a RangeError for an order outside 2..9, no order,
 * or a delay below 1.
 *
 * @example scanOrdinalPatterns(Float64Array.of(4, 7, 9, 10, 6, 11, 3), 1, [2])[0].counts // [2, 4]
 */
export function scanOrdinalPatterns(
  y: Float64Array,
  delay: number,
  orders: readonly number[],
  ties: 'appearance' | 'symbols' = 'appearance',
): OrdinalScan[] {
  assertDelay(delay, 'scanOrdinalPatterns');
  if (orders.length === 0) throw new RangeError('scanOrdinalPatterns: at least one order is needed');
  orders.forEach((m) => assertOrder(m, 'scanOrdinalPatterns'));
  const list = [...new Set(orders)].sort((a, b) => a - b);
  const symbols = ties === 'symbols';
  const tau = delay;
  const n = y.length;
  const maxOrder = list[list.length - 1];
  const groups = list.length;

  const digitWeight = new Float64Array(maxOrder);
  for (let k = 1; k < maxOrder; k++) digitWeight[k] = symbols ? symbolCodeSpace(k) : factorial(k);
  const reciprocal = new Float64Array(maxOrder + 1);
  for (let k = 1; k <= maxOrder; k++) reciprocal[k] = 1 / k;

  const order = Int32Array.from(list);
  const space = Float64Array.from(list, (m) => (symbols ? symbolCodeSpace(m) : factorial(m)));
  // Dense pattern counts and weights of all orders in one array each, order g at countOffset[g].
  const dense = Uint8Array.from(list, (_, g) => (space[g] <= DENSE_CODE_LIMIT ? 1 : 0));
  const countOffset = new Int32Array(groups);
  let countCells = 0;
  for (let g = 0; g < groups; g++) {
    countOffset[g] = countCells;
    if (dense[g] === 1) countCells += space[g];
  }
  const counts = new Float64Array(countCells);
  const weights = new Float64Array(countCells);
  const mapCounts = list.map(() => new Map<number, number>());
  const mapWeights = list.map(() => new Map<number, number>());
  // Transition counts, same layout; orders in EdgeMode.Collected append keys instead.
  // a dense matrix pays for all space² cells (allocation and the final sweep), collected keys
  // for a sort of the windows: dense only when the matrix is small beside the series
  const edgeMode = Int32Array.from(list, (m, g) => {
    if (!symbols && tau === 1) return EdgeMode.ByRank;
    const cells = space[g] * space[g];
    return cells <= DENSE_EDGE_LIMIT && cells <= DENSE_EDGE_PER_SAMPLE * n ? EdgeMode.Dense : EdgeMode.Collected;
  });
  const edgeOffset = new Int32Array(groups);
  let edgeCells = 0;
  for (let g = 0; g < groups; g++) {
    edgeOffset[g] = edgeCells;
    if (edgeMode[g] === EdgeMode.ByRank) edgeCells += space[g] * order[g];
    else if (edgeMode[g] === EdgeMode.Dense) edgeCells += space[g] * space[g];
  }
  const edgeCounts = new Float64Array(edgeCells);
  const collectedKeys = list.map((m, g) => {
    if (edgeMode[g] !== EdgeMode.Collected) return new Uint32Array(0);
    const length = Math.max(0, n - (m - 1) * tau - 1);
    return space[g] * space[g] <= 2 ** 32 ? new Uint32Array(length) : new Float64Array(length);
  });
  const collected = new Int32Array(groups);
  const validWindows = new Float64Array(groups);
  const tiedWindows = new Float64Array(groups);
  accumulate(y, {
    tau, maxOrder, symbols, digitWeight, reciprocal, order, space, dense, countOffset, counts, weights,
    mapCounts, mapWeights, edgeMode, edgeOffset, edgeCounts, collectedKeys, collected, validWindows, tiedWindows,
  });

  return list.map((m, g) => {
    const seen = dense[g] === 1
      ? seenFromDense(counts.subarray(countOffset[g], countOffset[g] + space[g]), weights.subarray(countOffset[g], countOffset[g] + space[g]))
      : seenFromMaps(mapCounts[g], mapWeights[g]);
    let transitions: TransitionEdges;
    if (edgeMode[g] === EdgeMode.ByRank) transitions = edgesByRank(edgeCounts.subarray(edgeOffset[g], edgeOffset[g] + space[g] * m), m);
    else if (edgeMode[g] === EdgeMode.Dense) transitions = edgesFromMatrix(edgeCounts.subarray(edgeOffset[g], edgeOffset[g] + space[g] * space[g]), space[g]);
    else transitions = edgesFromKeys(collectedKeys[g].subarray(0, collected[g]), space[g]);
    return {
      order: m,
      delay: tau,
      ties,
      alphabetSize: symbols ? orderedBellNumber(m) : factorial(m),
      ...seen,
      validWindows: validWindows[g],
      tiedWindows: tiedWindows[g],
      transitions,
    };
  });
}

/** Buffers and settings shared by the scan's set-up and its hot loop. */
interface ScanBuffers {
  tau: number;
  maxOrder: number;
  symbols: boolean;
  digitWeight: Float64Array;
  reciprocal: Float64Array;
  order: Int32Array;
  space: Float64Array;
  dense: Uint8Array;
  countOffset: Int32Array;
  counts: Float64Array;
  weights: Float64Array;
  mapCounts: Map<number, number>[];
  mapWeights: Map<number, number>[];
  edgeMode: Int32Array;
  edgeOffset: Int32Array;
  edgeCounts: Float64Array;
  collectedKeys: (Uint32Array | Float64Array)[];
  collected: Int32Array;
  validWindows: Float64Array;
  tiedWindows: Float64Array;
}

/** The hot loop of scanOrdinalPatterns: one step per sample, all orders. */
function accumulate(y: Float64Array, buffers: ScanBuffers): void {
  const { tau, maxOrder, symbols, digitWeight, reciprocal, order, space, dense, countOffset, counts, weights } = buffers;
  const { mapCounts, mapWeights, edgeMode, edgeOffset, edgeCounts, collectedKeys, collected, validWindows, tiedWindows } = buffers;
  const n = y.length;
  const groups = order.length;
  const previousValid = new Uint8Array(groups);
  const previousCode = new Int32Array(groups);

  // Per chain: codes of orders 1..maxOrder (slot k holds order k+1), latest NaN, latest start
  // of a pair of equal samples.
  // (a chain index never reaches n, so a huge delay costs no memory)
  const chains = Math.max(1, Math.min(tau, n));
  const codes = new Int32Array(chains * maxOrder);
  const lastMissing = new Float64Array(chains).fill(-1);
  const tieFrom = new Float64Array(chains).fill(-1);
  const digitAt = new Int32Array(maxOrder + 1);
  const varianceAt = new Float64Array(maxOrder + 1);
  const fullSpan = (maxOrder - 1) * tau;

  let chain = 0;
  for (let v = 0; v < n; v++) {
    const xv = y[v];
    const base = chain * maxOrder;
    if (xv !== xv) lastMissing[chain] = v;
    const kMax = v >= fullSpan ? maxOrder - 1 : Math.floor(v / tau);
    let carry = 0;
    let rank = 0;
    let equalSeen = 0;
    let nearestTie = 0;
    let shiftedSum = 0;
    let shiftedSquares = 0;
    for (let k = 1, u = v - tau; k <= kMax; k++, u -= tau) {
      const yu = y[u];
      let digit: number;
      if (symbols) {
        if (yu < xv) rank++;
        else if (yu === xv) equalSeen = 1;
        digit = 2 * rank + equalSeen;
      } else {
        rank += +(yu <= xv);
        digit = rank;
      }
      if (nearestTie === 0 && yu === xv) nearestTie = k;
      const old = codes[base + k];
      codes[base + k] = carry + digit * digitWeight[k];
      carry = old;
      digitAt[k + 1] = digit;
      const deviation = yu - xv;
      shiftedSum += deviation;
      shiftedSquares += deviation * deviation;
      const variance = (shiftedSquares - shiftedSum * shiftedSum * reciprocal[k + 1]) * reciprocal[k + 1];
      varianceAt[k + 1] = variance < 0 ? 0 : variance; // rounding can go below 0; NaN (infinite samples) stays NaN
    }
    if (nearestTie > 0 && v - nearestTie * tau > tieFrom[chain]) tieFrom[chain] = v - nearestTie * tau;

    for (let g = 0; g < groups; g++) {
      const m = order[g];
      const start = v - (m - 1) * tau;
      if (start < 0 || lastMissing[chain] >= start) {
        previousValid[g] = 0;
        continue;
      }
      const code = codes[base + m - 1];
      if (dense[g] === 1) {
        counts[countOffset[g] + code]++;
        weights[countOffset[g] + code] += varianceAt[m];
      } else {
        mapCounts[g].set(code, (mapCounts[g].get(code) ?? 0) + 1);
        mapWeights[g].set(code, (mapWeights[g].get(code) ?? 0) + varianceAt[m]);
      }
      validWindows[g]++;
      if (tieFrom[chain] >= start) tiedWindows[g]++;
      if (previousValid[g] === 1) {
        const mode = edgeMode[g];
        if (mode === EdgeMode.ByRank) edgeCounts[edgeOffset[g] + previousCode[g] * m + digitAt[m]]++;
        else if (mode === EdgeMode.Dense) edgeCounts[edgeOffset[g] + previousCode[g] * space[g] + code]++;
        else collectedKeys[g][collected[g]++] = previousCode[g] * space[g] + code;
      }
      previousValid[g] = 1;
      previousCode[g] = code;
    }
    if (++chain === tau) chain = 0;
  }

}

function seenFromDense(counts: Float64Array, weights: Float64Array): Pick<OrdinalScan, 'patterns' | 'counts' | 'weights'> {
  let distinct = 0;
  for (let code = 0; code < counts.length; code++) if (counts[code] > 0) distinct++;
  const seen = { patterns: new Int32Array(distinct), counts: new Float64Array(distinct), weights: new Float64Array(distinct) };
  for (let code = 0, i = 0; code < counts.length; code++) {
    if (counts[code] === 0) continue;
    seen.patterns[i] = code;
    seen.counts[i] = counts[code];
    seen.weights[i++] = weights[code];
  }
  return seen;
}

function seenFromMaps(counts: Map<number, number>, weights: Map<number, number>): Pick<OrdinalScan, 'patterns' | 'counts' | 'weights'> {
  const patterns = Int32Array.from(counts.keys()).sort();
  return {
    patterns,
    counts: Float64Array.from(patterns, (code) => counts.get(code) as number),
    weights: Float64Array.from(patterns, (code) => weights.get(code) as number),
  };
}

function allocateEdges(length: number): TransitionEdges {
  return { source: new Int32Array(length), target: new Int32Array(length), count: new Float64Array(length) };
}

function nonZero(table: Float64Array): number {
  let count = 0;
  for (let i = 0; i < table.length; i++) if (table[i] !== 0) count++;
  return count;
}

/**
 * Edges from counts indexed by source·m + rank of the newest sample (delay 1, appearance).
 * The next window's code is the code of the source's last m-1 samples plus rank·(m-1)!
 * (the incremental code of countOrdinalPatterns), so each edge is one table look-up.
 */
function edgesByRank(table: Float64Array, order: number): TransitionEdges {
  const edges = allocateEdges(nonZero(table));
  const suffix = suffixCodes(order);
  const newestWeight = factorial(order - 1);
  for (let cell = 0, e = 0; cell < table.length; cell++) {
    if (table[cell] === 0) continue;
    const source = Math.floor(cell / order);
    edges.source[e] = source;
    edges.target[e] = suffix[source] + (cell - source * order) * newestWeight;
    edges.count[e++] = table[cell];
  }
  return edges;
}

/** suffixCodes(m)[code]: code (order m-1) of the window `code` without its oldest sample; built once per order. */
const SUFFIX_CODES: Int32Array[] = [];

function suffixCodes(order: number): Int32Array {
  if (!SUFFIX_CODES[order]) {
    const scratch = new Int32Array(2 * order);
    // the successor with the newest sample ranked lowest has digit 0 in the newest place,
    // so its code is the suffix code itself
    SUFFIX_CODES[order] = Int32Array.from({ length: factorial(order) }, (_, code) => successorCode(code, order, 0, scratch));
  }
  return SUFFIX_CODES[order];
}

/** Edges from a dense source x target matrix. */
function edgesFromMatrix(table: Float64Array, space: number): TransitionEdges {
  const edges = allocateEdges(nonZero(table));
  for (let cell = 0, e = 0; cell < table.length; cell++) {
    if (table[cell] === 0) continue;
    edges.source[e] = Math.floor(cell / space);
    edges.target[e] = cell % space;
    edges.count[e++] = table[cell];
  }
  return edges;
}

/** Edges from collected keys source·space + target: sorted in place, then run-length counted. */
function edgesFromKeys(keys: Uint32Array | Float64Array, space: number): TransitionEdges {
  keys.sort();
  let distinct = 0;
  for (let i = 0; i < keys.length; i++) if (i === 0 || keys[i] !== keys[i - 1]) distinct++;
  const edges = allocateEdges(distinct);
  for (let i = 0, e = 0; i < keys.length; e++) {
    let j = i + 1;
    while (j < keys.length && keys[j] === keys[i]) j++;
    const source = Math.floor(keys[i] / space);
    edges.source[e] = source;
    edges.target[e] = keys[i] - source * space;
    edges.count[e] = j - i;
    i = j;
  }
  return edges;
}

/**
 * Code of the window after `code` (delay 1) whose newest sample ranks above `rank` of the
 * m-1 kept samples; the allocation-free twin of successorPatternCode. O(m^2).
 * `scratch` holds 2m integers: the window's ranks in [0, m), the next window's in [m, 2m).
 */
function successorCode(code: number, order: number, rank: number, scratch: Int32Array): number {
  // scratch[i] = rank of sample i within the window, built by insertion as in ordinalPatternFromCode
  let rest = code;
  for (let k = 0; k < order; k++) {
    const below = rest % (k + 1);
    rest = (rest - below) / (k + 1);
    for (let i = 0; i < k; i++) if (scratch[i] >= below) scratch[i]++;
    scratch[k] = below;
  }
  // drop sample 0, append the new sample at `rank`
  const next = order;
  for (let i = 1; i < order; i++) {
    const kept = scratch[i] > scratch[0] ? scratch[i] - 1 : scratch[i];
    scratch[next + i - 1] = kept >= rank ? kept + 1 : kept;
  }
  scratch[next + order - 1] = rank;
  let result = 0;
  let weight = 1;
  for (let k = 1; k < order; k++) {
    let below = 0;
    for (let j = 0; j < k; j++) if (scratch[next + j] < scratch[next + k]) below++;
    weight *= k;
    result += below * weight;
  }
  return result;
}

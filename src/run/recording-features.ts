/**
 * The unit of feature work: one recording, a list of grid cells, and the cache. Plain data
 * in and out, so that it runs the same in the main thread and in a worker thread.
 */
import { computeGridFeatures, FEATURE_DEFINITIONS_VERSION, type Cell, type CellFeatures, type FeatureOptions } from '../features/index.ts';
import { describeSeries, readRecordingFile, seriesOfFile, type RecordingFile, type Series, type SeriesSummary, type SignalFormat } from '../signals/index.ts';
import type { SignalSettings } from '../study/index.ts';
import { cacheKey, keyFamily, openFeatureCache, type FeatureCache } from './feature-cache.ts';
import { cellId, gridsCovering } from './cell-groups.ts';

/** What is learnt about a recording when it is read (cached per file content and selection). */
export interface RecordingFacts {
  sha256: string;
  format: SignalFormat;
  channel: string;
  sampleRate: number | null;
  totalSamples: number;
  summary: SeriesSummary;
  /** A caution about how the file was read (Series.caution), or null. */
  caution: string | null;
}

export interface RecordingTask {
  path: string;
  signal: SignalSettings;
  /** Feature options, with the recording's own jitter seed. */
  options: FeatureOptions;
  /** Cells wanted, in the order the results should come back. */
  cells: Cell[];
  /** Cache folder, or null for no cache. */
  cacheDir: string | null;
}

export interface RecordingOutcome {
  facts: RecordingFacts;
  /** Features of `task.cells`, aligned with it. */
  cells: CellFeatures[];
  /** The cells that were computed (not found in the cache). */
  computed: Cell[];
  /** True when the recording's file was parsed (false when every cell, or the samples themselves, came from the cache). */
  parsed: boolean;
  /** True when `facts` were computed from the samples (false when they came from the cache). */
  factsComputed: boolean;
  /**
   * The samples as parsed, for the series cache entry (so that a rerun that adds cells does
   * not parse the file again); null without a cache, when nothing was parsed, or when the
   * caller dropped them to bound memory (see computeRecordings).
   */
  series: Float64Array | null;
  /** True when every cell came from the recording's pack (so the pack needs no update). */
  packed: boolean;
  warnings: string[];
}

/**
 * The key parts shared by a recording's cells and its pack: file content, signal selection,
 * tie rule, jitter draws and seed (only under the jitter rule, the only one that draws), scale
 * form, the flagging threshold and FEATURE_DEFINITIONS_VERSION.
 */
function cellSettingsParts(sha256: string, signal: SignalSettings, options: FeatureOptions): Record<string, unknown> {
  const jitter = options.ties === 'jitter';
  return {
    definitions: FEATURE_DEFINITIONS_VERSION,
    file: sha256,
    signal: selectionParts(signal),
    ties: options.ties,
    jitterRepeats: jitter ? options.jitterRepeats : null,
    jitterSeed: jitter ? options.seed : null,
    scaleForm: options.scaleForm,
    minWindowsPerPattern: options.minWindowsPerPattern,
  };
}

/** The signal selection as a key part. */
const selectionParts = (signal: SignalSettings) => ({ column: signal.column, start: signal.start, length: signal.length });

/**
 * Cache keys of the cells of one recording (the shared parts of {@link cellSettingsParts} and
 * the cell), as SHA-256 hex strings; the shared parts are put in canonical form once.
 */
export function cellKeyMaker(sha256: string, signal: SignalSettings, options: FeatureOptions): (cell: Cell) => string {
  const keyOf = keyFamily(cellSettingsParts(sha256, signal, options), 'cell');
  return (cell) => keyOf({ order: cell.order, delay: cell.delay, scale: cell.scale });
}

/** Cache key of the pack of one recording's cells: the cell keys' parts without the cell. */
export function packCacheKey(sha256: string, signal: SignalSettings, options: FeatureOptions): string {
  return cacheKey({ pack: 1, ...cellSettingsParts(sha256, signal, options) });
}

/** The payload of a pack entry. */
interface CellPack {
  cells: CellFeatures[];
}

/** The cells of a pack by cellId (empty when the pack is absent or corrupt). */
function readPack(cache: FeatureCache, key: string): Map<string, CellFeatures> {
  const pack = cache.read<CellPack>('packs', key);
  return new Map((Array.isArray(pack?.cells) ? pack.cells : []).map((c) => [cellId(c), c]));
}

/**
 * Adds `cells` to the pack (read again just before, so cells another writer added stay),
 * ordered by (order, delay, scale). Concurrent writers of one pack may lose each other's
 * additions; those cells are still in their own entries, which a lookup falls back to.
 */
function updatePack(cache: FeatureCache, key: string, cells: readonly CellFeatures[]): void {
  const packed = readPack(cache, key);
  const before = packed.size;
  let changed = false;
  for (const cell of cells) {
    if (!packed.has(cellId(cell))) changed = true;
    packed.set(cellId(cell), cell);
  }
  if (!changed && before > 0) return;
  const sorted = [...packed.values()].sort((a, b) => a.order - b.order || a.delay - b.delay || a.scale - b.scale);
  cache.write('packs', key, { cells: sorted } satisfies CellPack);
}

/** Cache key of the parsed samples of one recording (file content and signal selection). */
export function seriesCacheKey(sha256: string, signal: SignalSettings): string {
  return cacheKey({ series: 1, file: sha256, signal: selectionParts(signal) });
}

/** Cache key of the facts of one recording (file content and signal selection). */
export function factsCacheKey(sha256: string, signal: SignalSettings): string {
  return cacheKey({ facts: 2, file: sha256, signal: selectionParts(signal) });
}

/**
 * Features of one recording at the task's cells: cells found in the cache are taken from it,
 * the rest are computed from the recording (its bytes read and fingerprinted once, parsed
 * only when a cell is missing, and released as soon as they are no longer needed). Nothing is
 * written here: the caller stores the new cells with {@link storeOutcome} once the whole
 * stage has succeeded, so that a failing run leaves no trace. With everything cached the
 * file is only hashed (SHA-256), never parsed.
 * Throws InputError for an unreadable recording (see readSeries).
 */
export async function recordingFeatures(task: RecordingTask): Promise<RecordingOutcome> {
  const cache = task.cacheDir === null ? null : openFeatureCache(task.cacheDir);
  const lookup = cache ? await lookUp(task, cache) : { file: await readRecordingFile(task.path), facts: null, found: [], samples: null, packedAll: false };
  if (lookup.facts && lookup.found.length === task.cells.length && lookup.found.every((c) => c !== null)) {
    return { facts: lookup.facts, cells: lookup.found as CellFeatures[], computed: [], parsed: false, factsComputed: false, series: null, packed: lookup.packedAll, warnings: cache?.warnings ?? [] };
  }
  return computeMissing(task, lookup, cache);
}

/** The file as read, and what the cache holds for its fingerprint (nothing without a cache). */
interface Lookup {
  /** Released (set to null) once parsed, so the bytes do not stay alive while features are counted. */
  file: RecordingFile | null;
  facts: RecordingFacts | null;
  found: (CellFeatures | null)[];
  /** The samples from the series entry, looked up only when a cell is missing and the facts are known. */
  samples: Float64Array | null;
  /** True when the pack held every cell asked for. */
  packedAll: boolean;
}

/** Reads the file once and looks its facts, cells and (when a cell is missing) samples up by its fingerprint. */
async function lookUp(task: RecordingTask, cache: FeatureCache): Promise<Lookup> {
  const file = await readRecordingFile(task.path);
  const stored = cache.read<RecordingFacts>('recordings', factsCacheKey(file.sha256, task.signal));
  const facts = stored?.sha256 === file.sha256 ? stored : null;
  const packed = readPack(cache, packCacheKey(file.sha256, task.signal, task.options));
  const keyOf = cellKeyMaker(file.sha256, task.signal, task.options);
  const found = task.cells.map((c) => packed.get(cellId(c)) ?? cache.read<CellFeatures>('cells', keyOf(c)));
  const samples = facts && found.some((c) => c === null) ? cache.readSamples(seriesCacheKey(file.sha256, task.signal)) : null;
  const packedAll = task.cells.every((c) => packed.has(cellId(c)));
  return { file, facts, found, samples: samples && samples.length === facts!.summary.length ? samples : null, packedAll };
}

/** Parses the file (unless its samples were cached) and computes the cells the lookup did not find. */
function computeMissing(task: RecordingTask, lookup: Lookup, cache: FeatureCache | null): RecordingOutcome {
  const { sha256 } = lookup.file!;
  const parsed = lookup.samples === null || lookup.facts === null ? seriesOfFile(lookup.file!, task.signal) : null;
  lookup.file = null;
  const values = parsed?.values ?? lookup.samples!;
  const facts = lookup.facts ?? factsOf(parsed!, sha256);
  const byId = new Map<string, CellFeatures>();
  const missing: Cell[] = [];
  for (const [i, cell] of task.cells.entries()) {
    const hit = lookup.found[i] ?? null;
    if (hit) byId.set(cellId(hit), hit);
    else missing.push(cell);
  }
  for (const grid of gridsCovering(missing)) {
    for (const computed of computeGridFeatures(values, grid, task.options)) byId.set(cellId(computed), computed);
  }
  return {
    facts,
    cells: task.cells.map((c) => byId.get(cellId(c))!),
    computed: missing,
    parsed: parsed !== null,
    factsComputed: lookup.facts === null,
    series: parsed !== null && cache !== null ? values : null,
    packed: false,
    warnings: cache?.warnings ?? [],
  };
}

/** What is learnt about a recording from its parsed series (O(n); see describeSeries). */
export function factsOf(series: Series, sha256: string): RecordingFacts {
  return {
    sha256,
    format: series.format,
    channel: series.channel,
    sampleRate: series.sampleRate,
    totalSamples: series.totalSamples,
    summary: describeSeries(series.values),
    caution: series.caution,
  };
}

/**
 * Writes what `recordingFeatures` computed for `task` into the cache: the cells in
 * outcome.computed and, when they were computed, the recording's facts. Nothing for a task without cache.
 */
export function storeOutcome(task: RecordingTask, outcome: RecordingOutcome, cache: FeatureCache): void {
  const computed = new Set(outcome.computed.map(cellId));
  const keyOf = cellKeyMaker(outcome.facts.sha256, task.signal, task.options);
  for (const cell of outcome.cells) {
    if (computed.has(cellId(cell))) cache.write('cells', keyOf(cell), cell);
  }
  if (!outcome.packed) updatePack(cache, packCacheKey(outcome.facts.sha256, task.signal, task.options), outcome.cells);
  if (outcome.series) cache.writeSamples(seriesCacheKey(outcome.facts.sha256, task.signal), outcome.series);
  if (outcome.factsComputed) cache.write('recordings', factsCacheKey(outcome.facts.sha256, task.signal), outcome.facts);
}

/**
 * Sharding: the (recording x cell) work of a study cut into N contiguous parts, so that N
 * machines can fill one shared cache folder and a later `run` finds everything cached.
 */
import type { Cell } from '../features/index.ts';
import { InputError } from '../shared/errors.ts';
import type { Recording, Study } from '../study/index.ts';
import { gridCells } from './cell-groups.ts';
import { computeRecordings, type FeatureWork } from './feature-work.ts';

export interface Shard {
  /** 1-based part number. */
  index: number;
  count: number;
}

/**
 * Reads "K/N" (1 <= K <= N). Throws InputError naming --shard otherwise.
 * Example: parseShard('2/3') -> { index: 2, count: 3 }.
 */
export function parseShard(text: string): Shard {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const index = m ? Number(m[1]) : NaN;
  const count = m ? Number(m[2]) : NaN;
  if (!m || count < 1 || index < 1 || index > count) {
    throw new InputError(`--shard: '${text}' is not K/N with 1 <= K <= N — e.g. --shard 2/8 computes the second of eight parts`);
  }
  return { index, count };
}

/**
 * The work items of shard K of N: units (recording, cell) are numbered recording-major in
 * study and grid order, 0..T-1, and shard K takes units floor((K-1)T/N) .. floor(KT/N)-1, so
 * the shards are disjoint, cover every unit, differ in size by at most one, and a shard
 * reads at most T/(N·cells) + 2 recordings. O(T).
 * Example: 2 recordings x 3 cells, shard 1/2 -> recording 1 at cells 1-3; shard 2/2 -> recording 2 at cells 1-3.
 */
export function shardItems(study: Study, shard: Shard): { recording: Recording; cells: Cell[] }[] {
  const cells = gridCells(study.grid);
  const total = study.recordings.length * cells.length;
  const from = Math.floor(((shard.index - 1) * total) / shard.count);
  const to = Math.floor((shard.index * total) / shard.count);
  const items: { recording: Recording; cells: Cell[] }[] = [];
  for (let unit = from; unit < to; unit++) {
    const recording = study.recordings[Math.floor(unit / cells.length)];
    const cell = cells[unit % cells.length];
    if (items.at(-1)?.recording !== recording) items.push({ recording, cells: [] });
    items.at(-1)!.cells.push(cell);
  }
  return items;
}

export interface ShardOutcome {
  recordings: number;
  units: number;
  computed: number;
  cached: number;
  warnings: string[];
}

/** Computes one shard into the cache (work.cacheDir must be set). */
export async function computeShard(study: Study, shard: Shard, work: FeatureWork, onProgress?: (done: number, total: number) => void): Promise<ShardOutcome> {
  if (work.cacheDir === null) throw new InputError('--shard writes into the feature cache, so it cannot run with --no-cache — drop --no-cache or give --cache DIR');
  const items = shardItems(study, shard);
  const results = await computeRecordings(study, work, onProgress, items);
  const units = items.reduce((a, i) => a + i.cells.length, 0);
  const computed = results.reduce((a, r) => a + r.outcome.computed.length, 0);
  return { recordings: items.length, units, computed, cached: units - computed, warnings: [...new Set(results.flatMap((r) => r.outcome.warnings))] };
}

/** `patternfold cache`: size of the feature cache, pruning and clearing. */
import { dirname, join, resolve } from 'node:path';
import { clearCache, pruneCache, summariseCache } from '../run/index.ts';
import { InputError } from '../shared/errors.ts';
import type { ParsedCommand } from './parse.ts';
import { safeText, type Io } from './terminal.ts';

/** Folder name of the default cache, beside the study file. */
export const DEFAULT_CACHE_FOLDER = '.patternfold-cache';

/** The cache folder a command uses: --cache DIR, else the default beside `studyFile`, else in the current folder. */
export function cacheFolderOf(option: string | undefined, studyFile: string | null): string {
  if (option !== undefined) return resolve(option);
  return studyFile ? join(dirname(resolve(studyFile)), DEFAULT_CACHE_FOLDER) : resolve(DEFAULT_CACHE_FOLDER);
}

/** "0 B", "1.5 kB", "2.3 MB", "4.0 GB" (powers of 1000, SI). */
export function formatBytes(bytes: number): string {
  const units = ['B', 'kB', 'MB', 'GB', 'TB'];
  let v = bytes;
  let u = 0;
  while (v >= 1000 && u < units.length - 1) {
    v /= 1000;
    u++;
  }
  return u === 0 ? `${v} B` : `${v.toFixed(1)} ${units[u]}`;
}

export function runCacheCommand(cmd: ParsedCommand, io: Io): number {
  const dir = cacheFolderOf(cmd.values.cache as string | undefined, cmd.positionals[0] ?? null);
  const prune = cmd.values['prune-older-than'] as string | undefined;
  if (prune !== undefined && cmd.values.clear) throw new InputError('cache: give either --prune-older-than DAYS or --clear, not both');
  if (prune !== undefined) {
    const days = Number(prune);
    if (prune.trim() === '' || !(days >= 0)) throw new InputError(`--prune-older-than: '${prune}' is not a number of days >= 0 — e.g. --prune-older-than 30`);
    const removed = pruneCache(dir, days);
    io.out(`removed ${removed.entries} entr${removed.entries === 1 ? 'y' : 'ies'} (${formatBytes(removed.bytes)}) not used in the last ${days} day(s)`);
  } else if (cmd.values.clear) {
    const removed = clearCache(dir);
    io.out(`removed ${removed.entries} entr${removed.entries === 1 ? 'y' : 'ies'} (${formatBytes(removed.bytes)})`);
  }
  const s = summariseCache(dir);
  if (!s.exists) {
    io.out(`feature cache ${safeText(dir)}: does not exist yet (a run creates it)`);
    return 0;
  }
  const day = (d: Date | null) => (d ? d.toISOString().slice(0, 10) : '-');
  io.out(`feature cache ${safeText(dir)}`);
  const count = (n: number, what: string) => `${n} ${what} entr${n === 1 ? 'y' : 'ies'}`;
  io.out(`  ${count(s.entries.cells, 'cell')}, ${count(s.entries.packs, 'pack')}, ${count(s.entries.recordings, 'recording')}, ${count(s.entries.series, 'series')}, ${formatBytes(s.bytes)}`);
  io.out(`  last used: oldest ${day(s.oldest)}, newest ${day(s.newest)}`);
  return 0;
}

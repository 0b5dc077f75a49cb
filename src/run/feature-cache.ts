/**
 * The feature cache: content-addressed entries on disk, one per (recording content, signal
 * selection, grid cell, feature settings, definitions version); a pack per (recording content,
 * signal selection, feature settings, definitions version) holding copies of its cells, so a
 * rerun reads one file per recording (an index: a cell missing from it is looked up on its
 * own); and two per (recording content, signal selection): what was learnt about the
 * recording when it was read, and its parsed samples.
 *
 * An entry file is one header line `patternfold-cache 1 <key> <sha256 of the rest>` followed
 * by the payload: JSON, or for samples their binary64 bytes. It is written under a temporary name and renamed into place (atomic on
 * POSIX file systems, so concurrent shards on a shared folder never see half an entry), and
 * verified on every read: a header, key or checksum that does not match makes the entry count
 * as absent, with a warning, so that it is recomputed and rewritten, never used.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join, resolve } from 'node:path';
import { InputError } from '../shared/errors.ts';
import { sha256Text } from './hash.ts';
import { writeFileAtomic } from './output-folder.ts';

const HEADER = 'patternfold-cache 1';
/** File that marks a folder as a patternfold cache; prune and clear refuse a folder without it. */
export const CACHE_MARKER = 'patternfold-cache.json';
/** Cache Directory Tagging Specification (Ford 2004): backup tools skip a folder holding it [M]. */
const CACHEDIR_TAG = 'Signature: 8a477f597d28d172789f06886806bc55\n# This folder is a patternfold feature cache; it can be deleted at any time.\n';
const KINDS = ['cells', 'packs', 'recordings', 'series'] as const;
export type EntryKind = (typeof KINDS)[number];

/** A cache folder, opened for reading and writing entries. */
export interface FeatureCache {
  /** Absolute path of the folder. */
  dir: string;
  /** The verified payload of an entry, or null when it is absent or corrupt (then a warning is recorded). */
  read<T>(kind: EntryKind, key: string): T | null;
  /** Writes an entry atomically (replacing any earlier one). */
  write(kind: EntryKind, key: string, payload: unknown): void;
  /** The verified samples of a series entry, or null when it is absent or corrupt (then a warning is recorded). */
  readSamples(key: string): Float64Array | null;
  /** Writes a series entry (the samples as binary64 bytes) atomically. */
  writeSamples(key: string, values: Float64Array): void;
  /** Warnings about corrupt entries met so far. */
  warnings: string[];
}

/**
 * Canonical key of a cache entry: the SHA-256 of the parts as JSON with sorted object keys,
 * so that the key does not depend on the order in which fields were written.
 * Example: cacheKey({ b: 1, a: 2 }) === cacheKey({ a: 2, b: 1 }).
 */
export function cacheKey(parts: unknown): string {
  return sha256Text(canonicalJson(parts));
}

/**
 * Keys of a family of entries that share every part but one: `keyFamily(shared, name)(v)`
 * equals `cacheKey({ ...shared, [name]: v })`, with the canonical JSON of the shared parts
 * built once (a rerun looks up thousands of cells of one recording).
 */
export function keyFamily(shared: Record<string, unknown>, name: string): (varying: unknown) => string {
  const entries = sortedEntries({ ...shared, [name]: null });
  const at = entries.findIndex(([k]) => k === name);
  const part = (list: [string, unknown][]) => list.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`);
  const before = part(entries.slice(0, at));
  const after = part(entries.slice(at + 1));
  const prefix = `{${before.map((p) => `${p},`).join('')}${JSON.stringify(name)}:`;
  const suffix = `${after.map((p) => `,${p}`).join('')}}`;
  return (varying) => sha256Text(`${prefix}${canonicalJson(varying)}${suffix}`);
}

function sortedEntries(value: Record<string, unknown>): [string, unknown][] {
  const entries = Object.entries(value).filter(([, v]) => v !== undefined);
  entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return entries;
}

function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    return `{${sortedEntries(value as Record<string, unknown>).map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/**
 * JSON that keeps every double exactly: NaN, ±Infinity and -0 (which JSON cannot hold)
 * become {"$n": "NaN"} etc.; finite numbers round-trip exactly (ECMA-262 Number::toString
 * gives the shortest string that reads back to the same double).
 */
export function exactJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (typeof v !== 'number' || (Number.isFinite(v) && !Object.is(v, -0))) return v;
    return { $n: Object.is(v, -0) ? '-0' : String(v) };
  });
}

/**
 * Samples as the payload of a series entry: the values' bytes, IEEE 754 binary64,
 * little-endian whatever the machine, so every double (NaN and -0 included) comes back bit
 * for bit and an entry reads the same on any machine. O(n) copy.
 * @example bytesToSamples(samplesToBytes(Float64Array.of(1.5, NaN))) // Float64Array [1.5, NaN]
 */
export function samplesToBytes(values: Float64Array): Uint8Array {
  if (LITTLE_ENDIAN) return new Uint8Array(values.buffer.slice(values.byteOffset, values.byteOffset + values.byteLength));
  const bytes = new Uint8Array(values.length * 8);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < values.length; i++) view.setFloat64(i * 8, values[i], true);
  return bytes;
}

/** Inverse of {@link samplesToBytes}; null when the byte count is not a multiple of 8. */
export function bytesToSamples(bytes: Uint8Array): Float64Array | null {
  if (bytes.length % 8 !== 0) return null;
  if (LITTLE_ENDIAN) return new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.length));
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  return Float64Array.from({ length: bytes.length / 8 }, (_, i) => view.getFloat64(i * 8, true));
}

const LITTLE_ENDIAN = new Uint8Array(Float64Array.of(1).buffer)[7] === 0x3f;

/** Inverse of {@link exactJson}. */
export function parseExactJson<T>(text: string): T {
  if (!text.includes('"$n"')) return JSON.parse(text) as T; // no tagged numbers: no reviver needed
  return JSON.parse(text, (_key, v: unknown) => {
    if (v !== null && typeof v === 'object' && !Array.isArray(v)) {
      const o = v as Record<string, unknown>;
      const keys = Object.keys(o);
      if (keys.length === 1 && keys[0] === '$n' && typeof o.$n === 'string') return o.$n === '-0' ? -0 : Number(o.$n);
    }
    return v;
  }) as T;
}

function entryPath(dir: string, kind: EntryKind, key: string): string {
  return join(dir, kind, key.slice(0, 2), `${key}.entry`);
}

/** Opens the cache folder `dir`; it is created with the first write. Throws InputError when `dir` is a file. */
export function openFeatureCache(dir: string): FeatureCache {
  const root = resolve(dir);
  if (existsSync(root) && !statSync(root).isDirectory()) throw new InputError(`--cache ${root}: is a file, not a folder — give a folder for the feature cache`);
  const warnings: string[] = [];
  let ready = false;
  return {
    dir: root,
    warnings,
    read<T>(kind: EntryKind, key: string): T | null {
      const body = readVerified(kind, key);
      if (body === null) return null;
      try {
        return parseExactJson<T>(body.toString('utf8'));
      } catch {
        warnings.push(`cache entry ${entryPath(root, kind, key)} is not readable JSON — recomputed and rewritten`);
        return null;
      }
    },
    write(kind: EntryKind, key: string, payload: unknown): void {
      writeEntry(kind, key, Buffer.from(exactJson(payload), 'utf8'));
    },
    readSamples(key: string): Float64Array | null {
      const body = readVerified('series', key);
      const values = body === null ? null : bytesToSamples(body);
      if (body !== null && values === null) warnings.push(`cache entry ${entryPath(root, 'series', key)} does not hold whole doubles — recomputed and rewritten`);
      return values;
    },
    writeSamples(key: string, values: Float64Array): void {
      writeEntry('series', key, samplesToBytes(values));
    },
  };

  /** The payload of an entry whose header names `key` and whose checksum matches; null (and a warning when it exists) otherwise. Marks the entry used. */
  function readVerified(kind: EntryKind, key: string): Buffer | null {
    const path = entryPath(root, kind, key);
    let bytes: Buffer;
    try {
      bytes = readFileSync(path);
    } catch {
      return null;
    }
    const body = verifiedPayload(bytes, key);
    if (body === null) {
      warnings.push(`cache entry ${path} is corrupt (its checksum does not match) — recomputed and rewritten`);
      return null;
    }
    touch(path);
    return body;
  }

  function writeEntry(kind: EntryKind, key: string, body: Uint8Array): void {
    if (!ready) ensureCacheFolder(root);
    ready = true;
    const header = Buffer.from(`${HEADER} ${key} ${createHash('sha256').update(body).digest('hex')}\n`, 'latin1');
    writeFileAtomic(entryPath(root, kind, key), Buffer.concat([header, body]));
  }
}

/** The payload of an entry when its header names `key` and its checksum (SHA-256 of the payload bytes) matches, else null. */
function verifiedPayload(bytes: Buffer, key: string): Buffer | null {
  const newline = bytes.indexOf(0x0a);
  if (newline < 0) return null;
  const [magic, version, entryKey, checksum, ...rest] = bytes.toString('latin1', 0, newline).split(' ');
  if (`${magic} ${version}` !== HEADER || entryKey !== key || rest.length > 0) return null;
  const body = bytes.subarray(newline + 1);
  return createHash('sha256').update(body).digest('hex') === checksum ? body : null;
}

/** Marks use of an entry, so that pruning by age removes what has not been used. */
function touch(path: string): void {
  const now = new Date();
  try {
    utimesSync(path, now, now);
  } catch {
    // a read-only shared cache still serves its entries
  }
}

function ensureCacheFolder(root: string): void {
  if (existsSync(join(root, CACHE_MARKER))) return;
  mkdirSync(root, { recursive: true });
  const marker = join(root, CACHE_MARKER);
  writeFileAtomic(join(root, 'CACHEDIR.TAG'), CACHEDIR_TAG);
  if (!existsSync(marker)) writeFileSync(marker, JSON.stringify({ format: 1, note: 'patternfold feature cache; safe to delete' }) + '\n');
}

/** Size and age of a cache folder. */
export interface CacheSummary {
  dir: string;
  exists: boolean;
  entries: Record<EntryKind, number>;
  bytes: number;
  /** Modification (last use) time of the oldest and newest entry, or null when empty. */
  oldest: Date | null;
  newest: Date | null;
}

function forEachEntry(root: string, visit: (path: string, kind: EntryKind, size: number, mtime: Date) => void): void {
  for (const kind of KINDS) {
    const kindDir = join(root, kind);
    if (!existsSync(kindDir)) continue;
    for (const prefix of readdirSync(kindDir)) {
      const folder = join(kindDir, prefix);
      for (const name of readdirSync(folder)) {
        const path = join(folder, name);
        const s = statSync(path);
        if (s.isFile()) visit(path, kind, s.size, s.mtime);
      }
    }
  }
}

/**
 * Counts the entries of a cache folder and their bytes. O(entries) file-system calls.
 * A folder that does not exist gives zero entries and exists: false.
 */
export function summariseCache(dir: string): CacheSummary {
  const root = resolve(dir);
  const summary: CacheSummary = { dir: root, exists: existsSync(root), entries: { cells: 0, packs: 0, recordings: 0, series: 0 }, bytes: 0, oldest: null, newest: null };
  if (!summary.exists) return summary;
  forEachEntry(root, (_path, kind, size, mtime) => {
    summary.entries[kind]++;
    summary.bytes += size;
    if (!summary.oldest || mtime < summary.oldest) summary.oldest = mtime;
    if (!summary.newest || mtime > summary.newest) summary.newest = mtime;
  });
  return summary;
}

function requireCacheFolder(root: string, action: string): void {
  if (!existsSync(join(root, CACHE_MARKER))) {
    throw new InputError(`${root}: is not a patternfold cache folder (no ${CACHE_MARKER} in it) — refusing to ${action} it; check --cache`);
  }
}

/**
 * Removes the entries not used (read or written) for more than `days` days before `now`.
 * Returns the number of entries and bytes removed. Throws InputError for a folder that is
 * not a patternfold cache, or a negative or non-numeric `days`.
 */
export function pruneCache(dir: string, days: number, now: Date = new Date()): { entries: number; bytes: number } {
  if (!(days >= 0)) throw new InputError(`--prune-older-than: ${days} is not a number of days >= 0 — e.g. --prune-older-than 30`);
  const root = resolve(dir);
  if (!existsSync(root)) return { entries: 0, bytes: 0 };
  requireCacheFolder(root, 'prune');
  const limit = now.getTime() - days * 86400000;
  const removed = { entries: 0, bytes: 0 };
  forEachEntry(root, (path, _kind, size, mtime) => {
    if (mtime.getTime() >= limit) return;
    rmSync(path, { force: true });
    removed.entries++;
    removed.bytes += size;
  });
  return removed;
}

/** Removes every entry (the folder and its marker stay). Same refusals as {@link pruneCache}. */
export function clearCache(dir: string): { entries: number; bytes: number } {
  const root = resolve(dir);
  if (!existsSync(root)) return { entries: 0, bytes: 0 };
  requireCacheFolder(root, 'clear');
  const before = summariseCache(root);
  for (const kind of KINDS) rmSync(join(root, kind), { recursive: true, force: true });
  return { entries: Object.values(before.entries).reduce((a, n) => a + n, 0), bytes: before.bytes };
}

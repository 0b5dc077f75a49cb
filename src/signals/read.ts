import { createHash } from 'node:crypto';
import { lstat, readFile, readlink, stat } from 'node:fs/promises';
import type { Stats } from 'node:fs';
import { InputError } from '../shared/errors.ts';
import { parseRecording } from './recording.ts';
import type { Series, SignalSelection } from './types.ts';

/** Plain words for the operating-system reasons a recording cannot be read. */
const OS_REASONS: Record<string, string> = {
  ENOENT: 'no such file',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EISDIR: 'is a directory',
  ENOTDIR: 'a part of the path is not a directory',
  ELOOP: 'too many symbolic links',
  ENAMETOOLONG: 'path too long',
  EMFILE: 'too many open files',
};

/**
 * Reads one channel of one recording file: a text table (optionally gzip-compressed) or
 * an EDF/EDF+ file, recognised by content. The only function of the intake stage that
 * touches the file system; all parsing is in {@link parseRecording}.
 *
 * Symbolic links are followed: a link is read as the file it points at. A file that changes
 * while it is read is refused: its size, modification time and inode are taken before and
 * after the read and must agree with each other and with the bytes read (a writer that
 * appends, truncates or replaces the file in between is caught; one that rewrites bytes in
 * place without changing size or time within the clock's resolution cannot be seen).
 * The returned series carries the SHA-256 (FIPS 180-4) of exactly the bytes that were parsed.
 *
 * @throws InputError naming the path: missing or unreadable file with the operating
 *   system's reason ("no such file", "permission denied", ...), a symbolic link whose target
 *   is missing, a directory or another non-regular file (device, pipe) given, a file that
 *   changed while it was read, and every error of the parsers.
 * @example await readSeries('data/s01.csv', { column: 'ecg', start: 0, length: 5000 })
 */
export async function readSeries(path: string, selection: SignalSelection): Promise<Series> {
  return seriesOfFile(await readRecordingFile(path), selection);
}

/** A recording file's bytes, read once, with their SHA-256 (FIPS 180-4, lowercase hex). */
export interface RecordingFile {
  path: string;
  bytes: Uint8Array;
  sha256: string;
}

/**
 * Reads a recording file's bytes and fingerprints them, with the checks of {@link readSeries}
 * (symbolic links followed; a file that changes while it is read refused), so that a caller
 * can look its fingerprint up (in a cache) before deciding to parse the same bytes.
 * @throws InputError as readSeries for a missing, unreadable or changing file.
 */
export async function readRecordingFile(path: string): Promise<RecordingFile> {
  const bytes = await readBytes(path);
  return { path, bytes, sha256: createHash('sha256').update(bytes).digest('hex') };
}

/** The series of a file read by {@link readRecordingFile}; throws the parsers' InputErrors. */
export function seriesOfFile(file: RecordingFile, selection: SignalSelection): Series {
  const series = parseRecording(file.bytes, selection, file.path);
  return { ...series, source: { bytes: file.bytes.length, sha256: file.sha256 } };
}

async function readBytes(path: string): Promise<Uint8Array> {
  try {
    const before = await stat(path);
    if (before.isDirectory()) throw new InputError(`${path}: is a directory — give one recording file`);
    if (!before.isFile()) throw new InputError(`${path}: is not a regular file (a device, pipe or socket) — give one recording file`);
    const bytes = await readFile(path);
    const after = await stat(path);
    const change = changeBetween(before, after, bytes.length);
    if (change) {
      throw new InputError(
        `${path}: changed while it was being read (${change}) — wait until the program writing it has finished (or copy the file and point the study at the copy), then run again`,
      );
    }
    return bytes;
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw new InputError(`${path}: cannot read — ${await reasonFor(path, error)}`);
  }
}

/** What differs between two looks at a file and the bytes read in between, or '' when nothing does. */
function changeBetween(before: Stats, after: Stats, bytesRead: number): string {
  if (before.ino !== after.ino || before.dev !== after.dev) return 'it was replaced by another file';
  if (before.size !== after.size) return `its size went from ${before.size} to ${after.size} bytes`;
  if (bytesRead !== after.size) return `${bytesRead} bytes were read of ${after.size}`;
  if (before.mtimeMs !== after.mtimeMs) return 'its modification time changed';
  return '';
}

/** The reason and the fix, with a broken symbolic link named as such. */
async function reasonFor(path: string, error: unknown): Promise<string> {
  const code = (error as { code?: unknown } | null)?.code;
  if (code === 'ENOENT' || code === 'ELOOP') {
    const target = await linkTarget(path);
    if (target !== undefined) {
      const what = code === 'ELOOP' ? 'that leads round in a loop of links' : 'whose target does not exist';
      return `it is a symbolic link to ${target} ${what}; fix or remove the link`;
    }
  }
  return `${osReason(error)}; check the path and its permissions`;
}

async function linkTarget(path: string): Promise<string | undefined> {
  try {
    return (await lstat(path)).isSymbolicLink() ? await readlink(path) : undefined;
  } catch {
    return undefined;
  }
}

function osReason(error: unknown): string {
  const code = (error as { code?: unknown } | null)?.code;
  if (typeof code === 'string') return OS_REASONS[code] ?? `${code}: ${(error as Error).message}`;
  return error instanceof Error ? error.message : String(error);
}

import { readFile, stat } from 'node:fs/promises';
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
 * @throws InputError naming the path: missing or unreadable file with the operating
 *   system's reason ("no such file", "permission denied", ...), a directory or another
 *   non-regular file (device, pipe) given, and
 *   every error of the parsers.
 * @example await readSeries('data/s01.csv', { column: 'ecg', start: 0, length: 5000 })
 */
export async function readSeries(path: string, selection: SignalSelection): Promise<Series> {
  return parseRecording(await readBytes(path), selection, path);
}

async function readBytes(path: string): Promise<Uint8Array> {
  try {
    const info = await stat(path);
    if (info.isDirectory()) throw new InputError(`${path}: is a directory — give one recording file`);
    if (!info.isFile()) throw new InputError(`${path}: is not a regular file (a device, pipe or socket) — give one recording file`);
    return await readFile(path);
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw new InputError(`${path}: cannot read — ${osReason(error)}; check the path and its permissions`);
  }
}

function osReason(error: unknown): string {
  const code = (error as { code?: unknown } | null)?.code;
  if (typeof code === 'string') return OS_REASONS[code] ?? `${code}: ${(error as Error).message}`;
  return error instanceof Error ? error.message : String(error);
}

import { gunzipSync } from 'node:zlib';
import { InputError } from '../shared/errors.ts';
import { parseDelimited } from './delimited.ts';
import { parseEdf } from './edf.ts';
import { sniffFormat } from './sniff.ts';
import type { Series, SignalSelection } from './types.ts';

/**
 * Reads one channel of a recording held in memory: recognises the format by its first
 * bytes ({@link sniffFormat}), undoes one layer of gzip compression (RFC 1952; detected by
 * the magic bytes 1f 8b, whatever the file name), then reads EDF/EDF+ with
 * {@link parseEdf} or decodes UTF-8 text and reads it with {@link parseDelimited}.
 * No file system access; decompression happens in memory.
 *
 * @throws InputError naming the file: empty file; "looks like a binary file" (NUL bytes or
 *   invalid UTF-8 in the first 1024 bytes); UTF-16 text; 24-bit BDF; damaged gzip data;
 *   invalid UTF-8 further on (with its line); and every error of the two parsers.
 * @example parseRecording(new TextEncoder().encode('1\n2\n4\n'), { column: 1, start: 0,
 *   length: null }, 'x.txt') // values [1, 2, 4], format 'text'
 */
export function parseRecording(bytes: Uint8Array, selection: SignalSelection, fileLabel: string): Series {
  const kind = sniffFormat(bytes);
  if (kind === 'gzip') return parseUncompressed(gunzip(bytes, fileLabel), selection, `${fileLabel} (gzip)`, fileLabel);
  return parseUncompressed(bytes, selection, fileLabel, fileLabel);
}

function parseUncompressed(bytes: Uint8Array, selection: SignalSelection, shownAs: string, fileLabel: string): Series {
  if (bytes.length === 0) throw new InputError(`${shownAs}: no samples — the file is empty; give a table of numbers or an EDF file`);
  switch (sniffFormat(bytes)) {
    case 'edf':
      return parseEdf(bytes, selection, fileLabel);
    case 'text':
      return parseDelimited(decodeUtf8(bytes, fileLabel), selection, fileLabel);
    case 'gzip':
      throw new InputError(`${fileLabel}: gzip data inside gzip data — decompress the file once and give the result`);
    case 'bdf':
      throw new InputError(`${shownAs}: a BDF file (24-bit BioSemi format), which patternfold does not read — convert it to EDF or to a text table`);
    case 'utf16':
      throw new InputError(`${shownAs}: UTF-16 text, which patternfold does not read — save the file as UTF-8 text`);
    case 'binary':
      throw new InputError(`${shownAs}: looks like a binary file (NUL bytes or bytes that are not UTF-8 text near its start) — give a text table (UTF-8), a .gz of one, or an EDF/EDF+ file`);
  }
}

function gunzip(bytes: Uint8Array, fileLabel: string): Uint8Array {
  try {
    return gunzipSync(bytes);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new InputError(`${fileLabel}: damaged gzip data (${reason}) — the file starts like gzip (bytes 1f 8b) but cannot be decompressed; check the download or compress it again`);
  }
}

/** Decodes UTF-8 strictly; invalid bytes further into the file are reported with their line. */
function decodeUtf8(bytes: Uint8Array, fileLabel: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    const lenient = new TextDecoder('utf-8').decode(bytes);
    const bad = lenient.indexOf('\ufffd');
    const line = lenient.slice(0, bad).split(/\r\n|\r|\n/).length;
    throw new InputError(`${fileLabel}:${line}: bytes that are not UTF-8 text — save the file as UTF-8`);
  }
}

/** What the first bytes of a recording say it is. */
export type SniffedKind = 'gzip' | 'edf' | 'bdf' | 'utf16' | 'binary' | 'text';

/** Bytes inspected for NUL bytes and invalid UTF-8. */
export const SNIFF_BYTES = 1024;

/**
 * Recognises a recording by its first bytes:
 * - `gzip`: magic bytes 1f 8b (RFC 1952, Deutsch 1996);
 * - `edf`: version field "0" padded with spaces to 8 bytes (Kemp et al. 1992; EDF+ too);
 * - `bdf`: byte ff then "BIOSEMI" (the 24-bit variant, not read by patternfold);
 * - `utf16`: a UTF-16 byte-order mark (ff fe or fe ff);
 * - `binary`: a NUL byte or invalid UTF-8 in the first 1024 bytes (a multi-byte
 *   character cut at byte 1024 is allowed);
 * - `text` otherwise (an empty file included).
 *
 * Complexity O(1024).
 *
 * @example sniffFormat(new TextEncoder().encode('1.5\n2.5\n')) // 'text'
 */
export function sniffFormat(bytes: Uint8Array): SniffedKind {
  if (bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b) return 'gzip';
  if (hasPrefix(bytes, '0       ')) return 'edf';
  if (bytes.length >= 8 && bytes[0] === 0xff && hasPrefix(bytes.subarray(1), 'BIOSEMI')) return 'bdf';
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) return 'utf16';
  const head = bytes.subarray(0, SNIFF_BYTES);
  if (head.includes(0)) return 'binary';
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: true });
  } catch {
    return 'binary';
  }
  return 'text';
}

function hasPrefix(bytes: Uint8Array, ascii: string): boolean {
  if (bytes.length < ascii.length) return false;
  for (let i = 0; i < ascii.length; i++) if (bytes[i] !== ascii.charCodeAt(i)) return false;
  return true;
}

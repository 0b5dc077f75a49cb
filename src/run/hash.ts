import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';

/** SHA-256 (FIPS 180-4) of a file's bytes, as lowercase hex. */
export function sha256File(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/** SHA-256 of a string (UTF-8), as lowercase hex. */
export function sha256Text(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}

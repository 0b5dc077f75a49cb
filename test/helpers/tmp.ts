/** Temporary study folders for tests, under test/.tmp (git-ignored), removed by the caller. */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '.tmp');

/** Creates a fresh folder holding the given files (name -> content) and returns its path. */
export function makeFolder(files: Record<string, string | Uint8Array>): string {
  mkdirSync(ROOT, { recursive: true });
  const dir = mkdtempSync(join(ROOT, 'case-'));
  for (const [name, content] of Object.entries(files)) {
    const path = join(dir, name);
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(path, content);
  }
  return dir;
}

/** A series of n values as one-value-per-line text, from a simple deterministic recurrence. */
export function seriesText(n: number, k = 1): string {
  const lines: string[] = [];
  let x = 0.1 + 0.01 * k;
  for (let i = 0; i < n; i++) {
    x = 3.9 * x * (1 - x);
    lines.push(x.toFixed(6));
  }
  return lines.join('\n') + '\n';
}

/** A two-group folder with `perGroup` recordings of `n` samples each, and a study file. */
export function twoGroupStudy(study: string, perGroup = 3, n = 200): string {
  const files: Record<string, string> = { 'study.yaml': study };
  for (let i = 0; i < perGroup; i++) {
    files[`a/a${i}.csv`] = seriesText(n, i);
    files[`b/b${i}.csv`] = seriesText(n, i + 10);
  }
  return makeFolder(files);
}

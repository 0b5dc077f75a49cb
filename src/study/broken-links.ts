/**
 * Symbolic links among the recordings. patternfold follows links (a link to a recording is read
 * as that recording), but a glob silently passes over a link whose target is missing or that
 * loops, which would drop a subject without a word. These helpers find such links so the loader
 * can name them.
 */
import { lstatSync, readdirSync, readlinkSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';

/** A link that cannot be followed: its path, what it points at, and why. */
export interface BrokenLink {
  path: string;
  target: string;
  reason: 'missing target' | 'loop';
}

/** Characters that make a path segment a glob beyond plain `*` and `?` (left to the glob library). */
const COMPLEX_SEGMENT = /[[\]{}()!+@]/;

/** Regular expression of a simple segment such as `*.csv` or `s??.txt`, or undefined for anything richer. */
function segmentPattern(segment: string): RegExp | undefined {
  if (COMPLEX_SEGMENT.test(segment) || segment === '**') return undefined;
  const body = segment.replace(/[.^$|\\]/g, '\\$&').replace(/\*/g, '[^/]*').replace(/\?/g, '[^/]');
  return new RegExp(`^${body}$`);
}

/**
 * Why the link at `path` cannot be followed, or undefined when it is not a link or can be.
 * Example: for a link a.csv -> gone.csv (no such file) returns { path, target: 'gone.csv', reason: 'missing target' }.
 */
export function brokenLink(path: string): BrokenLink | undefined {
  try {
    if (!lstatSync(path).isSymbolicLink()) return undefined;
  } catch {
    return undefined;
  }
  try {
    statSync(path);
    return undefined;
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return { path, target: readlinkSync(path), reason: code === 'ELOOP' ? 'loop' : 'missing target' };
  }
}

/**
 * Broken links whose names match the last segment of `pattern` (plain `*`/`?` segments only), in
 * the folders the glob visited: the folders of its matches and its fixed leading folder. Richer
 * patterns (braces, classes, `**`) are not searched. O(entries of those folders).
 *
 * @returns the broken links, sorted by path; [] when none or the pattern is too rich to check.
 */
export function brokenLinksBeside(pattern: string, baseDir: string, matches: readonly string[]): BrokenLink[] {
  const segments = pattern.split('/');
  const nameRule = segmentPattern(segments[segments.length - 1]);
  if (!nameRule) return [];
  const folders = new Set(matches.map((m) => dirname(m)));
  const fixedLead = segments.slice(0, -1);
  if (!fixedLead.some((s) => /[*?[\]{}()!+@]/.test(s))) folders.add(resolve(baseDir, ...fixedLead));
  const found: BrokenLink[] = [];
  for (const folder of folders) {
    let entries;
    try {
      entries = readdirSync(folder, { withFileTypes: true });
    } catch {
      continue;
    }
    for (const entry of entries) {
      if (!entry.isSymbolicLink() || !nameRule.test(entry.name)) continue;
      const broken = brokenLink(join(folder, entry.name));
      if (broken) found.push(broken);
    }
  }
  return found.sort((a, b) => (a.path < b.path ? -1 : 1));
}

/** Plain words for a broken link in a message. Example: "a symbolic link to ../x.csv, which does not exist". */
export function describeBrokenLink(link: BrokenLink): string {
  return link.reason === 'loop'
    ? `a symbolic link to ${link.target} that leads round in a loop of links`
    : `a symbolic link to ${link.target}, which does not exist`;
}

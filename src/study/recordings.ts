/**
 * Turns the `groups` globs or the `subjects` manifest into the list of recordings.
 *
 * Subject ids: the file name without its data extensions (`.gz`, then one of `.csv`, `.tsv`,
 * `.txt`, `.dat`, `.edf`), so `s01.csv.gz` is `s01` and `walk.2.csv` is `walk.2`. Files are
 * sorted by path within each group, so the order never depends on the file system.
 */
import { readFileSync, statSync } from 'node:fs';
import { basename, isAbsolute, relative, resolve } from 'node:path';
import { globSync } from 'tinyglobby';
import { InputError, locate } from '../shared/errors.ts';
import { checkNameLength } from './names.ts';
import { brokenLink, brokenLinksBeside, describeBrokenLink } from './broken-links.ts';
import { showValue, studyPosition } from './validate.ts';
import type { Recording } from './types.ts';
import { splitQuotedFields } from '../shared/quoted-fields.ts';

const DATA_EXTENSIONS = /\.(csv|tsv|txt|dat|edf)$/i;

/** Subject id of a file: its name without `.gz` and one data extension. Example: 's01.csv.gz' -> 's01'. */
export function subjectIdOf(path: string): string {
  return basename(path).replace(/\.gz$/i, '').replace(DATA_EXTENSIONS, '');
}

interface Context {
  label: string;
  text: string;
  dir: string;
}

function where(ctx: Context, path: (string | number)[]): string {
  const pos = studyPosition(ctx.text, path);
  return locate(ctx.label, pos?.line, pos?.column);
}

/** Expands one group's globs (relative to the study folder) into sorted absolute file paths. */
function expandGlobs(ctx: Context, group: string, globs: string[]): string[] {
  const files = new Set<string>();
  globs.forEach((pattern, i) => {
    const keyPath = globs.length > 1 ? ['groups', group, i] : ['groups', group];
    const matches = globSync(pattern, { cwd: ctx.dir, absolute: true, onlyFiles: true, dot: false, expandDirectories: false });
    const [broken] = brokenLinksBeside(pattern, ctx.dir, matches);
    if (broken) {
      throw new InputError(
        `${where(ctx, keyPath)}: groups.${group} pattern ${showValue(pattern)} would match ${relPath(ctx, broken.path)}, ${describeBrokenLink(broken)} — fix or remove the link (links are followed to the file they point at)`,
      );
    }
    if (matches.length === 0) {
      const folders = globSync(pattern, { cwd: ctx.dir, onlyDirectories: true, dot: false, expandDirectories: false });
      const what = folders.length > 0
        ? `matches only folder(s) (${folders.slice(0, 3).join(', ')}), no file`
        : `matches no file in ${ctx.dir}`;
      throw new InputError(
        `${where(ctx, keyPath)}: groups.${group} pattern ${showValue(pattern)} ${what} — check the path (it is relative to the study file) and the extension`,
      );
    }
    for (const m of matches) files.add(resolve(m));
  });
  return [...files].sort();
}

function relPath(ctx: Context, path: string): string {
  return relative(ctx.dir, path) || path;
}

/** Recordings from `groups: {name: glob(s)}`; each file is one subject. */
export function recordingsFromGlobs(ctx: Context, groups: Record<string, string | string[]>): Recording[] {
  const recordings: Recording[] = [];
  const seen = new Map<string, Recording>();
  for (const [group, globs] of Object.entries(groups)) {
    for (const path of expandGlobs(ctx, group, Array.isArray(globs) ? globs : [globs])) {
      const id = subjectIdOf(path);
      const rec: Recording = { id, subject: id, group, path, relPath: relPath(ctx, path), covariates: {} };
      const before = seen.get(id);
      if (before) {
        throw new InputError(
          `${where(ctx, ['groups', group])}: two recordings have the subject id '${id}': ${before.relPath} (${before.group}) and ${rec.relPath} (${group}) — rename one file, or use a subjects manifest if they are recordings of one subject`,
        );
      }
      seen.set(id, rec);
      recordings.push(rec);
    }
  }
  return recordings;
}

/** Throws InputError when a listed recording is missing or is a folder. */
function checkRecordingFile(path: string, at: string): void {
  try {
    if (statSync(path).isDirectory()) throw new InputError(`${at}: ${path} is a folder, not a recording file — name the file`);
  } catch (e) {
    if (e instanceof InputError) throw e;
    const link = brokenLink(path);
    if (link) throw new InputError(`${at}: the recording ${path} is ${describeBrokenLink(link)} — fix or remove the link (links are followed to the file they point at)`);
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(`${at}: cannot find the recording ${path}: ${code === 'ENOENT' ? 'no such file' : String(code)} — check the path (relative to the study file)`);
  }
}

/**
 * Recordings from a manifest table with columns subject, group, file (other columns are
 * covariates). Several rows of one subject are several recordings of it.
 */
export function recordingsFromManifest(ctx: Context, manifest: string, groupNames: string[] | undefined): { recordings: Recording[]; groups: string[] } {
  const manifestPath = resolve(ctx.dir, manifest);
  const at = where(ctx, ['subjects']);
  let text: string;
  try {
    if (statSync(manifestPath).isDirectory()) throw new InputError(`${at}: subjects ${showValue(manifest)} is a folder — name the manifest file (CSV with columns subject, group, file)`);
    text = readFileSync(manifestPath, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(`${at}: cannot read the subjects manifest ${manifestPath}: ${code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : String(code)} — check the path (relative to the study file)`);
  }
  const lines = text.split(/\r?\n/);
  const headerIndex = lines.findIndex((l) => l.trim() !== '' && !l.startsWith('#'));
  if (headerIndex < 0) throw new InputError(`${manifestPath}: the subjects manifest is empty — it needs a header row subject, group, file`);
  const delimiter = lines[headerIndex].includes('\t') ? '\t' : ',';
  const header = splitQuotedFields(lines[headerIndex], delimiter).map((h) => h.toLowerCase());
  for (const column of ['subject', 'group', 'file']) {
    if (!header.includes(column)) throw new InputError(`${manifestPath}:${headerIndex + 1}: the manifest has no column '${column}' (found: ${header.join(', ')}) — the header must name subject, group and file`);
  }
  const index = (name: string) => header.indexOf(name);
  const covariateColumns = header.filter((h) => !['subject', 'group', 'file'].includes(h));
  const recordings: Recording[] = [];
  const groupsSeen: string[] = [];
  const subjectGroup = new Map<string, string>();
  const perSubject = new Map<string, number>();
  const files = new Set<string>();
  for (let i = headerIndex + 1; i < lines.length; i++) {
    const line = lines[i];
    if (line.trim() === '' || line.startsWith('#')) continue;
    const cells = splitQuotedFields(line, delimiter);
    const lineAt = `${manifestPath}:${i + 1}`;
    if (cells.length !== header.length) throw new InputError(`${lineAt}: expected ${header.length} cells (${header.join(', ')}), found ${cells.length} — check the delimiters on that line`);
    const subject = cells[index('subject')];
    const group = cells[index('group')];
    const file = cells[index('file')];
    if (!subject || !group || !file) throw new InputError(`${lineAt}: subject, group and file must all be filled in`);
    checkNameLength(subject, 'subject id', lineAt);
    checkNameLength(group, 'group name', lineAt);
    if (groupNames && !groupNames.includes(group)) throw new InputError(`${lineAt}: subject '${subject}' is in group ${showValue(group)}, which the study does not list (groups: ${groupNames.join(', ')}) — fix the manifest or the study's groups`);
    if (!groupsSeen.includes(group)) groupsSeen.push(group);
    const earlierGroup = subjectGroup.get(subject);
    if (earlierGroup !== undefined && earlierGroup !== group) throw new InputError(`${lineAt}: subject '${subject}' appears in two groups (${earlierGroup} and ${group}) — a subject belongs to one group`);
    subjectGroup.set(subject, group);
    const path = resolve(ctx.dir, file);
    checkRecordingFile(path, `${lineAt} file`);
    if (files.has(path)) throw new InputError(`${lineAt}: the file ${file} is listed twice — each recording once`);
    files.add(path);
    const k = (perSubject.get(subject) ?? 0) + 1;
    perSubject.set(subject, k);
    const covariates: Record<string, string> = {};
    for (const c of covariateColumns) covariates[c] = cells[index(c)];
    recordings.push({ id: subject, subject, group, path, relPath: isAbsolute(file) ? file : relPath(ctx, path), covariates });
  }
  // Subjects with several recordings get ids subject#1, subject#2, ... in manifest order.
  const counter = new Map<string, number>();
  for (const rec of recordings) {
    if ((perSubject.get(rec.subject) ?? 1) > 1) {
      const k = (counter.get(rec.subject) ?? 0) + 1;
      counter.set(rec.subject, k);
      rec.id = `${rec.subject}#${k}`;
    }
  }
  if (recordings.length === 0) throw new InputError(`${manifestPath}: the subjects manifest lists no recordings — add rows subject, group, file`);
  return { recordings, groups: groupNames ?? groupsSeen };
}

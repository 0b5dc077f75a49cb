/**
 * Run records: each run without --out gets a folder of its own under
 * reports/<study>/<UTC time>-<study hash>, claimed atomically so that two runs never share one.
 */
import { mkdirSync, readdirSync, rmdirSync } from 'node:fs';
import { dirname } from 'node:path';
import type { Study } from '../study/index.ts';
import { sha256Text } from './hash.ts';

/**
 * The base name of a run's folder: reports/<study name as a slug>/<UTC time to the second>-<first
 * 8 hex digits of the SHA-256 of the study file and its --set overrides>.
 * Example: study "Fresh vs fatigued" at 2026-12-01T10:20:30Z -> reports/fresh-vs-fatigued/20261201-102030Z-<hash>.
 */
export function runFolderBase(study: Pick<Study, 'name' | 'text' | 'overrides'>, now: Date): string {
  const slug = study.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'study';
  const stamp = now.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z').replace('T', '-');
  const hash = sha256Text(study.text + '\n' + study.overrides.join('\n')).slice(0, 8);
  return `reports/${slug}/${stamp}-${hash}`;
}

/**
 * Claims a fresh folder: `base`, else `base-2`, `base-3`, ... — the first that mkdir can
 * create (mkdir fails when the folder exists, atomically, also between processes). Returns
 * the claimed path; the folder is empty until the run commits into it.
 */
export function claimRunFolder(base: string): string {
  mkdirSync(dirname(base), { recursive: true });
  for (let n = 1; ; n++) {
    const path = n === 1 ? base : `${base}-${n}`;
    try {
      mkdirSync(path);
      claimed.add(path);
      return path;
    } catch (e) {
      if ((e as { code?: string }).code !== 'EEXIST') throw e;
    }
  }
}

/** Folders this process claimed and has not released (an interrupted run releases them). */
const claimed = new Set<string>();

/** Releases every folder this process claimed that is still empty (on SIGINT/SIGTERM). */
export function releaseClaimedRunFolders(): void {
  for (const path of claimed) releaseRunFolder(path);
}

/** Removes a claimed folder if it is still empty (a run that failed before writing). */
export function releaseRunFolder(path: string): void {
  claimed.delete(path);
  try {
    if (readdirSync(path).length === 0) rmdirSync(path);
  } catch {
    // already gone or not empty: leave it
  }
}

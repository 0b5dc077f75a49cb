/**
 * Atomic output folders: every file of a run is written into a staging folder beside the
 * target, and the staging folder replaces the target only when all files are complete. A
 * run that fails or is killed leaves the previous complete folder (or none), never a mix.
 */
import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { randomBytes } from 'node:crypto';

export interface StagedFolder {
  /** Writes one file (relative name) into the staging folder. */
  write(name: string, content: string | Uint8Array): void;
  /** Moves the staging folder into place, replacing any previous folder. */
  commit(): void;
  /** Removes the staging folder (on failure). */
  abandon(): void;
}

/** Starts a staged folder for `target`. Nothing appears at `target` until commit(). */
export function stageFolder(target: string): StagedFolder {
  const final = resolve(target);
  const parent = dirname(final);
  mkdirSync(parent, { recursive: true });
  const tag = randomBytes(4).toString('hex');
  const staging = join(parent, `.${basename(final)}.staging-${tag}`);
  mkdirSync(staging);
  return {
    write(name, content) {
      const path = join(staging, name);
      mkdirSync(dirname(path), { recursive: true });
      writeFileSync(path, content);
    },
    commit() {
      if (existsSync(final)) {
        const old = join(parent, `.${basename(final)}.previous-${tag}`);
        renameSync(final, old);
        renameSync(staging, final);
        rmSync(old, { recursive: true, force: true });
      } else {
        renameSync(staging, final);
      }
    },
    abandon() {
      rmSync(staging, { recursive: true, force: true });
    },
  };
}

/** Writes one file atomically: a temporary name in the same folder, then a rename. */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  const final = resolve(path);
  mkdirSync(dirname(final), { recursive: true });
  const temporary = join(dirname(final), `.${basename(final)}.tmp-${randomBytes(4).toString('hex')}`);
  writeFileSync(temporary, content);
  renameSync(temporary, final);
}

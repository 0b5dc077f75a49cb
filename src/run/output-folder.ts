/**
 * Atomic output folders: every file of a run is written into a staging folder beside the
 * target, and the staging folder replaces the target only when all files are complete. A
 * run that fails or is killed leaves the previous complete folder (or none), never a mix.
 */
import { existsSync, mkdirSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
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

/** Staging folders of this process not yet committed or abandoned (removed on SIGINT/SIGTERM). */
const activeStaging = new Set<string>();

/** Removes this process's unfinished staging folders; returns how many there were. */
export function abandonActiveStaging(): number {
  const count = activeStaging.size;
  for (const path of activeStaging) rmSync(path, { recursive: true, force: true });
  activeStaging.clear();
  return count;
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Tidies what a killed run (SIGKILL, power loss) left beside `final`: its staging folder is
 * removed, and a previous folder it had moved aside is put back when the target is missing.
 */
function recoverAfterKilledRun(final: string): void {
  const parent = dirname(final);
  const pattern = new RegExp(`^\\.${basename(final).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\.(staging|previous)-(\\d+)-[0-9a-f]+$`);
  for (const name of readdirSync(parent)) {
    const match = pattern.exec(name);
    if (!match || processAlive(Number(match[2]))) continue;
    const path = join(parent, name);
    if (match[1] === 'previous' && !existsSync(final)) renameSync(path, final);
    else rmSync(path, { recursive: true, force: true });
  }
}

/** Starts a staged folder for `target`. Nothing appears at `target` until commit(). */
export function stageFolder(target: string): StagedFolder {
  const final = resolve(target);
  const parent = dirname(final);
  mkdirSync(parent, { recursive: true });
  recoverAfterKilledRun(final);
  const tag = `${process.pid}-${randomBytes(4).toString('hex')}`;
  const staging = join(parent, `.${basename(final)}.staging-${tag}`);
  mkdirSync(staging);
  activeStaging.add(staging);
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
      activeStaging.delete(staging);
    },
    abandon() {
      rmSync(staging, { recursive: true, force: true });
      activeStaging.delete(staging);
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

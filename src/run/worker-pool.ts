/**
 * A pool of worker threads (piscina) running the tasks of ./worker.ts. Each thread starts at
 * ./worker-entry.mjs, which registers tsx's loader in that thread before importing the
 * TypeScript, so the pool works from the installed command, under `node --import tsx` and
 * under the test runner alike.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { InputError } from '../shared/errors.ts';
import type { RecordingOutcome, RecordingTask } from './recording-features.ts';
import type { PermutationTask, Settled } from './worker.ts';

/** The outcome of a settled task, or its error rethrown with its class (InputError: exit 2). */
function unwrap<T>(settled: Settled<T>): T {
  if ('ok' in settled) return settled.ok;
  throw settled.input ? new InputError(settled.error) : new Error(settled.error);
}

export interface WorkPool {
  threads: number;
  features(task: RecordingTask, signal?: AbortSignal): Promise<RecordingOutcome>;
  permutations(task: PermutationTask, signal?: AbortSignal): Promise<Float64Array[]>;
  /** Ends every thread; the pool cannot be used afterwards. */
  close(): Promise<void>;
}

/** The default number of worker threads: os.availableParallelism(). */
export const defaultJobs = (): number => availableParallelism();

/**
 * Reads a --jobs value: an integer >= 1. Throws InputError naming the option otherwise.
 * Example: parseJobs('4') -> 4; parseJobs(undefined) -> os.availableParallelism().
 */
export function parseJobs(text: string | undefined): number {
  if (text === undefined) return defaultJobs();
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) throw new InputError(`--jobs: '${text}' is not a whole number of at least 1 — e.g. --jobs 4 (default: the number of cores, ${defaultJobs()})`);
  return n;
}

/** Starts a pool of `threads` worker threads (>= 1). */
export function createWorkPool(threads: number): WorkPool {
  const pool = new Piscina({
    filename: new URL('./worker-entry.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    execArgv: [],
    idleTimeout: 60000,
  });
  return {
    threads,
    features: async (task, signal) => unwrap((await pool.run(task, { name: 'features', signal })) as Settled<RecordingOutcome>),
    permutations: (task, signal) => pool.run(task, { name: 'permutations', signal }) as Promise<Float64Array[]>,
    close: () => pool.destroy(),
  };
}

/** A pool started on first use, so that a run whose stages are all small starts no thread. */
export interface LazyPool {
  /** The pool when `wanted` (starting it on first call), else null. */
  get(wanted: boolean): WorkPool | null;
  close(): Promise<void>;
}

/** A LazyPool of `threads` threads; with threads = 1 it never starts one. */
export function lazyPool(threads: number): LazyPool {
  let pool: WorkPool | null = null;
  return {
    get: (wanted) => (wanted && threads > 1 ? (pool ??= createWorkPool(threads)) : null),
    close: async () => {
      await pool?.close();
      pool = null;
    },
  };
}

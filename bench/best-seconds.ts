import { performance } from 'node:perf_hooks';

/** Best (shortest) wall time in seconds of `runs` calls of `task`. Shared by the bench scripts. */
export function bestSeconds(runs: number, task: () => unknown): number {
  let best = Infinity;
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    task();
    best = Math.min(best, (performance.now() - start) / 1000);
  }
  return best;
}

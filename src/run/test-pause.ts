/**
 * A hook for the interruption tests (test/robustness/kill.test.ts): when the environment
 * variable PATTERNFOLD_TEST_PAUSE is `<stage>:<count>` (e.g. `features:3`,
 * `permutations:10`) or `commit`, the run prints `patternfold-test-paused <stage>` on stderr
 * when it reaches that point and blocks there until it is killed. Without the variable it
 * does nothing.
 */
export function pauseIfRequested(stage: string, done = 0): void {
  const wanted = process.env.PATTERNFOLD_TEST_PAUSE;
  if (!wanted) return;
  const [wantedStage, wantedCount] = wanted.split(':');
  if (wantedStage !== stage || (wantedCount !== undefined && done < Number(wantedCount))) return;
  process.stderr.write(`patternfold-test-paused ${stage}\n`);
  const cell = new Int32Array(new SharedArrayBuffer(4));
  for (;;) Atomics.wait(cell, 0, 0, 60_000);
}

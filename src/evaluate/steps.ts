/**
 * Long computations written as generators that yield between units of work (a grid cell, an
 * outer fold, a repeat): run to the end in one go by {@link finishSteps}, or with a pause
 * between units by {@link driveSteps}, so that a caller on an event loop (the command line)
 * can serve a signal such as Ctrl-C between units. The numbers do not depend on which.
 */
export type Steps<T> = Generator<void, T, void>;

/** Runs the steps to the end without pausing and returns their result. */
export function finishSteps<T>(steps: Steps<T>): T {
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

/** Runs the steps, awaiting `pause()` (when given) after each unit, and returns their result. */
export async function driveSteps<T>(steps: Steps<T>, pause?: () => Promise<void>): Promise<T> {
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    if (pause) await pause();
  }
}

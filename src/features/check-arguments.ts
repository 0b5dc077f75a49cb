/** Throws a RangeError unless 2 <= order <= 9 is an integer (the orders patternfold counts). */
export function assertOrder(order: number, where: string): void {
  if (!Number.isInteger(order) || order < 2 || order > 9) {
    throw new RangeError(`${where}: order must be an integer from 2 to 9, got ${order}`);
  }
}

/** Throws a RangeError unless delay is an integer >= 1. */
export function assertDelay(delay: number, where: string): void {
  if (!Number.isInteger(delay) || delay < 1) {
    throw new RangeError(`${where}: delay must be an integer >= 1, got ${delay}`);
  }
}

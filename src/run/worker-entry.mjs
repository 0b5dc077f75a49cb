// Entry of a worker thread (src/run/worker-pool.ts): registers tsx's loader in this thread,
// then hands over to the TypeScript tasks in worker.ts. Plain JavaScript, because the loader
// is not yet there to read TypeScript when this file starts.
import { register } from 'tsx/esm/api';

register();
const tasks = await import('./worker.ts');

export const features = tasks.features;
export const permutations = tasks.permutations;

/**
 * `npm run bench`: every benchmark in turn. Each prints its own figures and ratios; none
 * fails on a slow machine. Run one alone with `node --import tsx bench/<name>.ts`.
 * Set BENCH_ONLY=features,classifiers to choose.
 */
const BENCHES: Record<string, () => Promise<unknown>> = {
  features: async () => (await import('./features.ts')).benchFeatures(),
  classifiers: async () => (await import('./classifiers.ts')).benchClassifiers(),
  evaluate: async () => (await import('./evaluate.ts')).benchEvaluate(),
  rerun: async () => (await import('./rerun.ts')).benchRerun(),
  workers: async () => (await import('./workers.ts')).benchWorkers(),
  memory: async () => (await import('./memory.ts')).benchMemory(),
  parse: async () => (await import('./parse.ts')).benchParse(),
};

const only = process.env.BENCH_ONLY?.split(',').map((s) => s.trim());
for (const [name, run] of Object.entries(BENCHES)) {
  if (only && !only.includes(name)) continue;
  console.log(`\n=== ${name} ===`);
  await run();
}

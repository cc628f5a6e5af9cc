import Piscina from 'piscina';
import { availableParallelism } from 'node:os';
import type { StemTask, StemTaskResult } from './check-worker';

// A worker pool for the delivery check: one task per stem, so stems are measured in parallel while
// the main thread (the API server) stays responsive.

export interface CheckPool {
  readonly threads: number;
  run(task: StemTask): Promise<StemTaskResult>;
  destroy(): Promise<void>;
}

export function createCheckPool(opts: { maxThreads?: number } = {}): CheckPool {
  const threads = Math.max(1, opts.maxThreads ?? Math.max(1, availableParallelism() - 1));
  const piscina = new Piscina<StemTask, StemTaskResult>({
    filename: new URL('./check-worker-entry.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    // Stems come in bursts per delivery; idle workers give their memory back after a minute.
    idleTimeout: 60_000,
    // The work lives in a few reused typed arrays; a small young generation keeps each worker's
    // short-lived garbage (promises, small buffers) from piling up tens of MB before a scavenge.
    resourceLimits: { maxYoungGenerationSizeMb: 4 },
  });
  return {
    threads,
    run: (task) => piscina.run(task),
    destroy: () => piscina.destroy(),
  };
}

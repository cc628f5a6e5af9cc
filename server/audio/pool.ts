import Piscina from 'piscina';
import { createRequire } from 'node:module';
import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { StemTask, StemTaskResult } from './check-worker';

// A worker pool for the delivery check: one task per stem, so stems are measured in parallel while
// the main thread (the API server) stays responsive.
//
// Workers on Node 20 do not inherit tsx. Loading tsx in each worker costs ~26 MB resident per worker
// (its loader-hooks thread and transform cache), a fifth of the check's memory budget, so the pool first
// bundles the worker's few plain-TypeScript modules into one .mjs with esbuild (already present as
// tsx's own transformer). If that is not possible it falls back to a shim that registers tsx.

export interface CheckPool {
  readonly threads: number;
  run(task: StemTask): Promise<StemTaskResult>;
  destroy(): Promise<void>;
}

const WORKER_SOURCE = fileURLToPath(new URL('./check-worker.ts', import.meta.url));
const TSX_SHIM = new URL('./check-worker-entry.mjs', import.meta.url).href;

interface EsbuildLike {
  buildSync(options: Record<string, unknown>): unknown;
}

function loadEsbuild(): EsbuildLike | null {
  try {
    // Resolved through tsx, which depends on it; not a dependency of ours to pin separately.
    const fromTsx = createRequire(createRequire(import.meta.url).resolve('tsx/package.json'));
    return fromTsx('esbuild') as EsbuildLike;
  } catch {
    return null;
  }
}

/** Bundles the worker into a temp folder; returns its URL and a cleanup, or null to use the tsx shim. */
function bundleWorker(): { url: string; cleanup: () => void } | null {
  const esbuild = loadEsbuild();
  if (!esbuild) return null;
  const dir = mkdtempSync(join(tmpdir(), 'kitlane-check-worker-'));
  const outfile = join(dir, 'check-worker.mjs');
  try {
    esbuild.buildSync({
      entryPoints: [WORKER_SOURCE],
      outfile,
      bundle: true,
      format: 'esm',
      platform: 'node',
      target: 'node20',
      packages: 'external',
      logLevel: 'silent',
      tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)),
    });
  } catch {
    rmSync(dir, { recursive: true, force: true });
    return null;
  }
  return { url: pathToFileURL(outfile).href, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

export function createCheckPool(opts: { maxThreads?: number } = {}): CheckPool {
  const threads = Math.max(1, opts.maxThreads ?? Math.max(1, availableParallelism() - 1));
  const bundle = bundleWorker();
  const piscina = new Piscina<StemTask, StemTaskResult>({
    filename: bundle?.url ?? TSX_SHIM,
    minThreads: threads,
    maxThreads: threads,
    // Stems come in bursts per delivery; idle workers give their memory back after a minute.
    idleTimeout: 60_000,
    // The work lives in a few typed arrays; a small young generation keeps each worker's short-lived
    // garbage (promises, small buffers) from piling up tens of MB before a scavenge.
    resourceLimits: { maxYoungGenerationSizeMb: 4 },
  });
  return {
    threads,
    run: (task) => piscina.run(task),
    destroy: async () => {
      await piscina.destroy();
      bundle?.cleanup();
    },
  };
}

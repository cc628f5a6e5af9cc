import { createRequire } from 'node:module';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { PreviewResult, PreviewTask } from './preview-encoder';

// Workers on Node 20 do not inherit tsx (STACK.md). As server/audio/pool.ts does, the worker is bundled
// once per process with the esbuild that tsx brings; the encoder package is bundled in too, so the file
// runs from a temp folder without a node_modules beside it. Without esbuild, a shim registers tsx.

const WORKER_SOURCE = fileURLToPath(new URL('./preview-worker.ts', import.meta.url));
let entry: string | null = null;

interface EsbuildLike {
  buildSync(options: Record<string, unknown>): unknown;
}

function loadEsbuild(): EsbuildLike | null {
  try {
    const fromTsx = createRequire(createRequire(import.meta.url).resolve('tsx/package.json'));
    return fromTsx('esbuild') as EsbuildLike;
  } catch {
    return null;
  }
}

function workerEntry(): string {
  if (entry) return entry;
  const dir = mkdtempSync(join(tmpdir(), 'kitlane-preview-worker-'));
  const outfile = join(dir, 'preview-worker.mjs');
  const esbuild = loadEsbuild();
  try {
    if (!esbuild) throw new Error('no esbuild');
    esbuild.buildSync({
      entryPoints: [WORKER_SOURCE],
      outfile,
      bundle: true,
      format: 'esm',
      platform: 'node',
      target: 'node20',
      logLevel: 'silent',
      tsconfig: fileURLToPath(new URL('../../../../tsconfig.json', import.meta.url)),
    });
  } catch {
    const tsxApi = pathToFileURL(createRequire(import.meta.url).resolve('tsx/esm/api')).href;
    writeFileSync(outfile, `import { register } from ${JSON.stringify(tsxApi)};\nregister();\nawait import(${JSON.stringify(pathToFileURL(WORKER_SOURCE).href)});\n`);
  }
  entry = outfile;
  return entry;
}

/** A failed preview; `unreadable` when the file itself is not a WAV we can read (retrying will not help). */
export class PreviewError extends Error {
  constructor(
    message: string,
    readonly unreadable: boolean,
  ) {
    super(message);
  }
}

/** Encodes one preview in its own worker thread; the thread ends with the task. */
export function runPreview(task: PreviewTask): Promise<PreviewResult> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(workerEntry(), { workerData: task, resourceLimits: { maxYoungGenerationSizeMb: 8 } });
    let settled = false;
    worker.once('message', (message: { ok: true; result: PreviewResult } | { ok: false; message: string; wavError: boolean }) => {
      settled = true;
      if (message.ok) resolve(message.result);
      else reject(new PreviewError(message.message, message.wavError));
      void worker.terminate();
    });
    worker.once('error', (error) => {
      if (!settled) reject(error);
      settled = true;
    });
    worker.once('exit', (code) => {
      if (!settled) reject(new Error(`the preview worker stopped (exit ${code})`));
    });
  });
}

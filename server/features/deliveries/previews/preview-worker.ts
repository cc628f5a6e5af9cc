import { parentPort, workerData } from 'node:worker_threads';
import { isWavError } from '../../../audio/wav-errors';
import { encodePreview, type PreviewTask } from './preview-encoder';

// A one-shot worker thread: encodes one preview and reports back, so the API thread never runs the encoder.
const task = workerData as PreviewTask;
encodePreview(task).then(
  (result) => parentPort?.postMessage({ ok: true, result }),
  (error: unknown) => parentPort?.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error), wavError: isWavError(error) && error.code !== 'io' }),
);

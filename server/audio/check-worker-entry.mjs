// piscina workers on Node 20 do not inherit tsx's loader from the main thread: register it here,
// then load the TypeScript worker. The pool points at this file.
import { register } from 'tsx/esm/api';

register();
const worker = await import('./check-worker.ts');

export default worker.default;

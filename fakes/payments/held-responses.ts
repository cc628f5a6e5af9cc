import type { ServerResponse } from 'node:http';

/** One API answer that was computed (and saved) but not yet sent. */
export interface HeldResponse {
  method: string;
  path: string;
  idempotencyKey: string | null;
  status: number;
  heldAt: number;
}

interface Waiting extends HeldResponse {
  send(): void;
}

/**
 * Crash tests need the moment after the processor did the work and before the caller heard about it: a
 * caller killed then must find, on its retry, that the work happened once. While a path is held, POSTs to
 * it run as usual (state saved, idempotency key stored, events queued) and only the HTTP answer waits
 * until it is released. Nothing of this changes what the API does; it only delays when it says so.
 */
export class ResponseHolds {
  private readonly paths = new Set<string>();
  private readonly waiting: Waiting[] = [];

  hold(path: string): void {
    this.paths.add(path);
  }

  holds(method: string, path: string): boolean {
    return method === 'POST' && this.paths.has(path);
  }

  /** Parks the answer; `send` writes it later (a caller that has died by then simply misses it). */
  park(res: ServerResponse, entry: Omit<HeldResponse, 'heldAt'>, send: () => void): void {
    const waiting: Waiting = { ...entry, heldAt: Date.now(), send };
    this.waiting.push(waiting);
    // A caller that gave up is dropped from the list so `held()` shows only answers someone waits for.
    res.once('close', () => {
      if (!res.writableEnded) this.drop(waiting);
    });
  }

  held(): HeldResponse[] {
    return this.waiting.map(({ method, path, idempotencyKey, status, heldAt }) => ({ method, path, idempotencyKey, status, heldAt }));
  }

  /** Stops holding every path and sends what was parked; answers how many were sent. */
  release(): number {
    this.paths.clear();
    const parked = this.waiting.splice(0);
    for (const entry of parked) entry.send();
    return parked.length;
  }

  private drop(entry: Waiting): void {
    const index = this.waiting.indexOf(entry);
    if (index >= 0) this.waiting.splice(index, 1);
  }
}

import { and, asc, eq, lte, ne, or, sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { Db } from '../db/client';
import { jobs } from '../db/schema';
import type { Logger } from '../logger';

export type JobHandler = (payload: any, ctx: { attempt: number; jobId: number }) => Promise<void> | void;

export type EnqueueOptions = {
  runAt?: number;
  dedupeKey?: string;
  maxAttempts?: number;
};

export type JobRunnerOptions = {
  pollMs?: number;
  leaseMs?: number;
  backoffBaseMs?: number;
  backoffMaxMs?: number;
  now?: () => number;
};

/**
 * A small durable job runner on SQLite. A job is claimed by one atomic UPDATE that also takes a
 * lease, so two runners (or two ticks) never run the same job at once; a runner that dies leaves
 * a lease that expires, and the job is picked up again after a restart.
 */
export class JobRunner {
  private handlers = new Map<string, JobHandler>();
  private timer: NodeJS.Timeout | null = null;
  private running = 0;
  private stopped = true;
  private idleWaiters: Array<() => void> = [];
  private readonly owner = randomUUID();
  private readonly pollMs: number;
  private readonly leaseMs: number;
  private readonly backoffBaseMs: number;
  private readonly backoffMaxMs: number;
  private readonly now: () => number;

  constructor(
    private readonly db: Db,
    private readonly logger: Logger,
    opts: JobRunnerOptions = {},
  ) {
    this.pollMs = opts.pollMs ?? 250;
    this.leaseMs = opts.leaseMs ?? 5 * 60_000;
    this.backoffBaseMs = opts.backoffBaseMs ?? 2_000;
    this.backoffMaxMs = opts.backoffMaxMs ?? 30 * 60_000;
    this.now = opts.now ?? Date.now;
  }

  register(kind: string, handler: JobHandler): void {
    this.handlers.set(kind, handler);
  }

  /** Enqueue inside or outside a transaction; with a dedupeKey a second enqueue is a no-op. */
  enqueue(kind: string, payload: unknown, opts: EnqueueOptions = {}, db: Pick<Db, 'insert'> = this.db): void {
    const now = this.now();
    db.insert(jobs)
      .values({
        kind,
        payload,
        dedupeKey: opts.dedupeKey ?? null,
        runAt: opts.runAt ?? now,
        maxAttempts: opts.maxAttempts ?? 8,
        createdAt: now,
      })
      .onConflictDoNothing({ target: jobs.dedupeKey })
      .run();
    this.kick();
  }

  start(): void {
    if (!this.stopped) return;
    this.stopped = false;
    this.recoverCutOff();
    this.schedule(0);
  }

  /**
   * One process owns the SQLite file (the delivery jobs rely on it too), so at start a job still marked
   * running belongs to a process that died (a crash, SIGKILL, a power cut). It is queued again now rather
   * than after its lease, which for a money job would leave a booking half-way for minutes. Handlers are
   * idempotent, so a job that had in fact finished its work just finds it done.
   */
  private recoverCutOff(): void {
    const now = this.now();
    const recovered = this.db
      .update(jobs)
      .set({ status: 'queued', lockedBy: null, lockedUntil: null, runAt: now })
      .where(and(eq(jobs.status, 'running'), ne(jobs.lockedBy, this.owner)))
      .returning({ id: jobs.id })
      .all();
    if (recovered.length > 0) this.logger.info(`requeued ${recovered.length} jobs cut off by a previous run`);
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    await this.waitIdle();
  }

  /** Resolves when no handler is running (used by graceful shutdown and tests). */
  waitIdle(): Promise<void> {
    if (this.running === 0) return Promise.resolve();
    return new Promise((resolve) => this.idleWaiters.push(resolve));
  }

  /** Runs every job that is due now, one after another; returns how many ran. For tests and ticks. */
  async drain(): Promise<number> {
    let count = 0;
    for (;;) {
      const job = this.claimNext();
      if (!job) return count;
      await this.execute(job);
      count += 1;
    }
  }

  private kick(): void {
    if (!this.stopped && this.running === 0) this.schedule(0);
  }

  private schedule(delay: number): void {
    if (this.stopped) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.tick(), delay);
    this.timer.unref?.();
  }

  private async tick(): Promise<void> {
    this.timer = null;
    try {
      await this.drain();
    } catch (err) {
      this.logger.error('job runner tick failed', err);
    }
    this.schedule(this.pollMs);
  }

  private claimNext(): typeof jobs.$inferSelect | null {
    const now = this.now();
    const due = this.db
      .select({ id: jobs.id })
      .from(jobs)
      .where(
        or(
          and(eq(jobs.status, 'queued'), lte(jobs.runAt, now)),
          and(eq(jobs.status, 'running'), lte(jobs.lockedUntil, now)),
        ),
      )
      .orderBy(asc(jobs.runAt), asc(jobs.id))
      .limit(1)
      .get();
    if (!due) return null;
    // The status/lease condition is repeated so a concurrent claim of the same row updates nothing.
    const claimed = this.db
      .update(jobs)
      .set({ status: 'running', lockedBy: this.owner, lockedUntil: now + this.leaseMs, attempts: sql`${jobs.attempts} + 1` })
      .where(
        and(
          eq(jobs.id, due.id),
          or(eq(jobs.status, 'queued'), and(eq(jobs.status, 'running'), lte(jobs.lockedUntil, now))),
        ),
      )
      .returning()
      .get();
    return claimed ?? null;
  }

  private async execute(job: typeof jobs.$inferSelect): Promise<void> {
    const handler = this.handlers.get(job.kind);
    this.running += 1;
    try {
      if (!handler) throw new Error(`no handler registered for job kind "${job.kind}"`);
      await handler(job.payload, { attempt: job.attempts, jobId: job.id });
      this.db
        .update(jobs)
        .set({ status: 'done', finishedAt: this.now(), lockedBy: null, lockedUntil: null, lastError: null })
        .where(eq(jobs.id, job.id))
        .run();
    } catch (err) {
      this.recordFailure(job, err);
    } finally {
      this.running -= 1;
      if (this.running === 0) this.idleWaiters.splice(0).forEach((resolve) => resolve());
    }
  }

  private recordFailure(job: typeof jobs.$inferSelect, err: unknown): void {
    const message = err instanceof Error ? err.message : String(err);
    const exhausted = job.attempts >= job.maxAttempts;
    const delay = Math.min(this.backoffMaxMs, this.backoffBaseMs * 2 ** (job.attempts - 1));
    this.logger.info(`job ${job.kind}#${job.id} attempt ${job.attempts} failed: ${message}`);
    this.db
      .update(jobs)
      .set({
        status: exhausted ? 'failed' : 'queued',
        runAt: this.now() + delay,
        lockedBy: null,
        lockedUntil: null,
        lastError: message.slice(0, 1000),
        finishedAt: exhausted ? this.now() : null,
      })
      .where(eq(jobs.id, job.id))
      .run();
  }
}

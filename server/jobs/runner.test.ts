import { afterEach, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDb, type Db } from '../db/client';
import { applyMigrations } from '../db/migrate';
import { jobs } from '../db/schema';
import { createLogger } from '../logger';
import { JobRunner } from './runner';

function freshDb(): Db {
  const db = openDb(':memory:');
  applyMigrations(db);
  return db;
}

async function until(probe: () => boolean): Promise<void> {
  for (let i = 0; i < 200 && !probe(); i++) await new Promise((r) => setTimeout(r, 10));
}

describe('JobRunner after a crash', () => {
  const runners: JobRunner[] = [];
  afterEach(async () => {
    for (const r of runners.splice(0)) await r.stop();
  });

  it('runs a job left running by a dead process at start, without waiting out its lease', async () => {
    const db = freshDb();
    const runner = new JobRunner(db, createLogger('silent'), { pollMs: 20 });
    runners.push(runner);
    const ran: unknown[] = [];
    runner.register('money.step', (payload) => void ran.push(payload));
    runner.enqueue('money.step', { booking: 'b1' });
    // As SIGKILL leaves it: claimed once, leased for an hour by another owner.
    db.update(jobs).set({ status: 'running', lockedBy: 'dead-owner', lockedUntil: Date.now() + 3_600_000, attempts: 1 }).run();
    runner.start();
    await until(() => ran.length > 0);
    expect(ran).toEqual([{ booking: 'b1' }]);
    await until(() => db.select().from(jobs).get()?.status === 'done');
    expect(db.select().from(jobs).get()).toMatchObject({ status: 'done', attempts: 2, lockedBy: null });
  });

  it('leaves a running job alone while the runner that claimed it is alive', async () => {
    const db = freshDb();
    const runner = new JobRunner(db, createLogger('silent'), { pollMs: 20 });
    runners.push(runner);
    let release: () => void = () => undefined;
    let calls = 0;
    runner.register('slow.step', () => {
      calls += 1;
      return new Promise<void>((r) => (release = r));
    });
    runner.enqueue('slow.step', {});
    runner.start();
    await until(() => calls === 1);
    // A second start (a no-op) must not put the job it is running back in the queue.
    runner.start();
    const row = db.select().from(jobs).where(eq(jobs.kind, 'slow.step')).get()!;
    expect(row.status).toBe('running');
    release();
    await until(() => db.select().from(jobs).get()?.status === 'done');
    expect(calls).toBe(1);
  });
});

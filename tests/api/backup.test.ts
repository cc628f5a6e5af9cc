import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, existsSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import Database from 'better-sqlite3';
import { startTestApp, type TestApp } from './helpers/test-app';
import { backup, restore } from '../../server/ops/backup';
import { jobs } from '../../server/db/schema';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
  // Keep the runner from touching the rows this test writes.
  await app.kitlane.ctx.jobs.stop();
});
afterAll(async () => {
  await app?.close();
});

/** Like the app: the file is stored completely first, then the row that points to it is committed. */
async function writeRowWithFile(i: number): Promise<number> {
  const key = `backup-test/${i}.bin`;
  await app.kitlane.ctx.storage.put(key, Readable.from([Buffer.from(`file ${i} `.repeat(200))]));
  const row = app.db
    .insert(jobs)
    .values({ kind: 'backup.test', payload: { key, i }, runAt: Date.now() + 3600_000, createdAt: Date.now() })
    .returning({ id: jobs.id })
    .get();
  return row.id;
}

describe('backup and restore', () => {
  it('backs up while writes are happening and restores every committed row and its file', async () => {
    const before: number[] = [];
    for (let i = 0; i < 100; i++) before.push(await writeRowWithFile(i));

    let writing = true;
    let n = 100;
    const writer = (async () => {
      while (writing) await writeRowWithFile(n++);
    })();
    const out = mkdtempSync(join(tmpdir(), 'kitlane-backups-'));
    const { folder, manifest } = await backup(app.dataDir, out);
    writing = false;
    await writer;
    expect(n).toBeGreaterThan(100); // writes really went on during the backup
    expect(manifest.files).toBeGreaterThanOrEqual(100);

    const restored = mkdtempSync(join(tmpdir(), 'kitlane-restored-'));
    await restore(folder, restored);
    const db = new Database(join(restored, 'kitlane.db'), { readonly: true });
    expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
    const rows = db.prepare("select id, payload from jobs where kind = 'backup.test'").all() as { id: number; payload: string }[];
    const ids = new Set(rows.map((r) => r.id));
    for (const id of before) expect(ids.has(id)).toBe(true);
    // Every row in the copy points to a complete file in the copy.
    for (const row of rows) {
      const { key, i } = JSON.parse(row.payload) as { key: string; i: number };
      const path = join(restored, 'files', key);
      expect(existsSync(path)).toBe(true);
      expect(readFileSync(path, 'utf8')).toBe(`file ${i} `.repeat(200));
    }
    db.close();
  });

  it('refuses to restore a folder that is not a backup', async () => {
    const empty = mkdtempSync(join(tmpdir(), 'kitlane-not-a-backup-'));
    await expect(restore(empty, mkdtempSync(join(tmpdir(), 'kitlane-target-')))).rejects.toThrow();
  });
});

import Database from 'better-sqlite3';
import { cp, mkdir, readdir, rename, rm, stat, writeFile, readFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';

export type BackupManifest = {
  createdAt: string;
  database: string;
  files: number;
  bytes: number;
};

/**
 * A consistent copy of the database (SQLite's online backup API: readers and writers go on while it
 * copies, and the copy is one point in time) plus the file store. Files are copied after the database,
 * so every file a copied row points to is already complete (uploads are renamed into place when done).
 */
export async function backup(dataDir: string, outRoot: string, now = new Date()): Promise<{ folder: string; manifest: BackupManifest }> {
  const stamp = now.toISOString().replace(/[:.]/g, '-');
  const folder = resolve(outRoot, `kitlane-${stamp}`);
  const partial = `${folder}.partial`;
  await mkdir(partial, { recursive: true });
  const source = new Database(join(dataDir, 'kitlane.db'), { fileMustExist: true });
  try {
    source.pragma('busy_timeout = 5000');
    await source.backup(join(partial, 'kitlane.db'));
  } finally {
    source.close();
  }
  const filesDir = join(dataDir, 'files');
  if (existsSync(filesDir)) {
    // Temporary upload parts are not part of the store.
    await cp(filesDir, join(partial, 'files'), { recursive: true, filter: (src) => !src.endsWith('.part') });
  }
  const { count, bytes } = await countFiles(join(partial, 'files'));
  const manifest: BackupManifest = { createdAt: now.toISOString(), database: 'kitlane.db', files: count, bytes };
  await writeFile(join(partial, 'manifest.json'), JSON.stringify(manifest, null, 2));
  // Only a finished backup gets its final name.
  await rename(partial, folder);
  return { folder, manifest };
}

/** Brings a backup back into dataDir; the current data is moved aside first, never deleted blindly. */
export async function restore(folder: string, dataDir: string): Promise<{ movedAside: string | null }> {
  const src = resolve(folder);
  const manifest = JSON.parse(await readFile(join(src, 'manifest.json'), 'utf8')) as BackupManifest;
  if (!existsSync(join(src, manifest.database))) throw new Error(`${folder} has no ${manifest.database}`);
  const target = resolve(dataDir);
  let movedAside: string | null = null;
  if (existsSync(join(target, 'kitlane.db')) || existsSync(join(target, 'files'))) {
    movedAside = `${target}.before-restore-${Date.now()}`;
    await mkdir(movedAside, { recursive: true });
    for (const name of await readdir(target)) {
      if (name === 'kitlane.db' || name.startsWith('kitlane.db-') || name === 'files') await rename(join(target, name), join(movedAside, name));
    }
  }
  await mkdir(target, { recursive: true });
  await cp(join(src, manifest.database), join(target, 'kitlane.db'));
  if (existsSync(join(src, 'files'))) await cp(join(src, 'files'), join(target, 'files'), { recursive: true });
  return { movedAside };
}

async function countFiles(dir: string): Promise<{ count: number; bytes: number }> {
  if (!existsSync(dir)) return { count: 0, bytes: 0 };
  let count = 0;
  let bytes = 0;
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true })) {
    if (!entry.isFile()) continue;
    count += 1;
    bytes += (await stat(join(entry.parentPath, entry.name))).size;
  }
  return { count, bytes };
}

export async function removeBackup(folder: string): Promise<void> {
  await rm(folder, { recursive: true, force: true });
}

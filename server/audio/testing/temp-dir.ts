import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh directory under the OS temp dir for one test file's WAVs, removed by `cleanup`. */
export async function makeTempDir(prefix = 'kitlane-audio-'): Promise<{ dir: string; path: (name: string) => string; cleanup: () => Promise<void> }> {
  const dir = await mkdtemp(join(tmpdir(), prefix));
  return { dir, path: (name) => join(dir, name), cleanup: () => rm(dir, { recursive: true, force: true }) };
}

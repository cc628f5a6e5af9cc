// npm run restore -- <backup folder>: stop the server first; the current data is moved aside, not deleted.
import { resolve } from 'node:path';
import { parseEnv } from '../server/env';
import { restore } from '../server/ops/backup';

const folder = process.argv[2];
if (!folder) {
  console.error('usage: npm run restore -- <backup folder>   (stop the server first)');
  process.exit(2);
}
const env = parseEnv();
try {
  const { movedAside } = await restore(folder, resolve(env.DATA_DIR));
  console.log(`Restored ${folder} into ${resolve(env.DATA_DIR)}.`);
  if (movedAside) console.log(`The data that was there is kept in ${movedAside}.`);
} catch (err) {
  console.error(`Restore failed: ${(err as Error).message}`);
  process.exit(1);
}

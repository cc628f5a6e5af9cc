// npm run backup [-- <out folder>]: a dated, consistent copy of the database and the file store.
import { resolve } from 'node:path';
import { parseEnv } from '../server/env';
import { backup } from '../server/ops/backup';

const env = parseEnv();
const out = process.argv[2] ?? resolve(env.DATA_DIR, '..', 'backups');
const { folder, manifest } = await backup(resolve(env.DATA_DIR), out);
console.log(`Backup written to ${folder} (${manifest.files} files, ${(manifest.bytes / 1e6).toFixed(1)} MB of stored files).`);
console.log(`Restore it with: npm run restore -- ${folder}`);

// npm run admin:grant -- <email>: the only way (besides the seed) to make someone an admin.
import { join, resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import { parseEnv } from '../server/env';
import { openDb } from '../server/db/client';
import { applyMigrations } from '../server/db/migrate';
import { users } from '../server/db/schema';
import { recordAudit } from '../server/features/audit/audit.service';

const email = process.argv[2]?.trim().toLowerCase();
if (!email) {
  console.error('usage: npm run admin:grant -- <email>');
  process.exit(2);
}
const env = parseEnv();
const db = openDb(join(resolve(env.DATA_DIR), 'kitlane.db'));
applyMigrations(db);
const user = db.select().from(users).where(eq(users.email, email)).get();
if (!user) {
  console.error(`No account with the email ${email}. The person must sign up first.`);
  process.exit(1);
}
if (user.roles.includes('admin')) {
  console.log(`${email} is already an admin.`);
} else {
  db.transaction((tx) => {
    tx.update(users).set({ roles: [...user.roles, 'admin'] }).where(eq(users.id, user.id)).run();
    // The command line has no signed-in actor; the audit log shows it as such.
    recordAudit(tx, { actorId: null, action: 'grant', targetType: 'user', targetId: user.id, note: 'npm run admin:grant' });
  });
  console.log(`${email} is now an admin. They get the admin desk at their next page load.`);
}
db.$client.close();

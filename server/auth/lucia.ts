import { Lucia, TimeSpan } from 'lucia';
import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';

// Lucia v3 is deprecated upstream (STACK.md); everything it touches stays in server/auth/ so it can be swapped.
export function createLucia(db: Db) {
  const adapter = new DrizzleSQLiteAdapter(db, sessions, users);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: {
      name: 'kitlane_session',
      expires: true,
      // Secure is set per request in session-cookie.ts (only when served over https).
      attributes: { sameSite: 'lax', secure: false },
    },
    getUserAttributes: (row) => ({
      email: row.email,
      displayName: row.displayName,
      roles: row.roles,
      emailVerifiedAt: row.emailVerifiedAt,
      disabledAt: row.disabledAt,
      timeZone: row.timeZone,
    }),
  });
}

export type AuthLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AuthLucia;
    DatabaseUserAttributes: {
      email: string;
      displayName: string;
      roles: string[];
      emailVerifiedAt: Date | null;
      disabledAt: Date | null;
      timeZone: string;
    };
  }
}

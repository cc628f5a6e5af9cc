import { createHash, randomBytes, randomUUID } from 'node:crypto';
import type { AuthLucia } from '../../auth/lucia';
import { hashPassword, verifyPassword, dummyVerify } from '../../auth/password';
import type { CurrentUser } from '../../auth/middleware';
import { AppError } from '../../http/app-error';
import type { Mailer } from '../../mail/outbox';
import { composeMail } from '../../mail/templates';
import type { AuthRepository, UserRow } from './auth.repository';
import type {
  ChangePasswordInput,
  LoginInput,
  ResetPasswordInput,
  SignupInput,
  UpdateAccountInput,
} from '@shared/schemas/auth';
import type { Db } from '../../db/client';

const VERIFY_TTL_MS = 48 * 3600_000;
const RESET_TTL_MS = 3600_000;

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export function toCurrentUser(row: UserRow): CurrentUser {
  return {
    id: row.id,
    email: row.email,
    displayName: row.displayName,
    roles: row.roles,
    emailVerified: row.emailVerifiedAt != null,
    timeZone: row.timeZone,
  };
}

export function createAuthService(deps: {
  db: Db;
  repo: AuthRepository;
  lucia: AuthLucia;
  mailer: Mailer;
  appUrl: string;
}) {
  const { db, repo, lucia, mailer, appUrl } = deps;

  function issueToken(userId: string, purpose: 'verify_email' | 'reset_password', ttlMs: number): string {
    const token = randomBytes(32).toString('base64url');
    const now = Date.now();
    repo.insertToken({ tokenHash: sha256(token), userId, purpose, expiresAt: new Date(now + ttlMs), createdAt: new Date(now) });
    return token;
  }

  function queueVerificationMail(user: UserRow): void {
    const token = issueToken(user.id, 'verify_email', VERIFY_TTL_MS);
    mailer.queue(
      composeMail({
        to: user.email,
        subject: 'Confirm your email for Kitlane',
        greeting: `Hello ${user.displayName},`,
        paragraphs: ['Welcome to Kitlane. Confirm this address so we can send you briefs, quotes and payment notices.'],
        link: { label: 'Confirm my email', url: `${appUrl}/verify-email?token=${token}` },
        footer: 'If you did not sign up for Kitlane, ignore this mail.',
      }),
    );
  }

  return {
    async signup(input: SignupInput): Promise<{ user: CurrentUser; sessionId: string }> {
      if (repo.findByEmail(input.email)) {
        throw new AppError('email_taken', 'An account with this email already exists', 409, {
          email: 'An account with this email already exists — sign in or reset your password',
        });
      }
      const passwordHash = await hashPassword(input.password);
      const id = randomUUID();
      const row = {
        id,
        email: input.email,
        displayName: input.displayName,
        passwordHash,
        roles: [...new Set(input.roles)],
        createdAt: new Date(),
        timeZone: 'UTC',
      };
      // The account and its first mail commit together: the outbox row is in the same transaction.
      try {
        db.transaction(() => {
          repo.insertUser(row);
          queueVerificationMail({ ...row, emailVerifiedAt: null, disabledAt: null });
        });
      } catch (err) {
        if (String(err).includes('UNIQUE')) throw new AppError('email_taken', 'An account with this email already exists', 409);
        throw err;
      }
      const session = await lucia.createSession(id, {});
      return { user: toCurrentUser(repo.findById(id)!), sessionId: session.id };
    },

    async login(input: LoginInput): Promise<{ user: CurrentUser; sessionId: string }> {
      const row = repo.findByEmail(input.email);
      const ok = row ? await verifyPassword(row.passwordHash, input.password) : await dummyVerify(input.password);
      // One answer for a wrong password and an unknown email, so accounts cannot be probed.
      if (!row || !ok) throw new AppError('invalid_credentials', 'Email or password is not right', 401);
      if (row.disabledAt) throw new AppError('account_disabled', 'This account has been disabled. Contact support.', 403);
      const session = await lucia.createSession(row.id, {});
      return { user: toCurrentUser(row), sessionId: session.id };
    },

    async logout(sessionId: string | null | undefined): Promise<void> {
      if (sessionId) await lucia.invalidateSession(sessionId);
    },

    async verifyEmail(token: string): Promise<{ user: CurrentUser; sessionId: string }> {
      const used = repo.consumeToken(sha256(token), 'verify_email', new Date());
      if (!used) throw new AppError('invalid_token', 'This link is not valid any more. Ask for a new one.', 400);
      repo.updateUser(used.userId, { emailVerifiedAt: new Date() });
      const session = await lucia.createSession(used.userId, {});
      return { user: toCurrentUser(repo.findById(used.userId)!), sessionId: session.id };
    },

    resendVerification(user: CurrentUser): void {
      if (user.emailVerified) throw new AppError('already_verified', 'Your email is already confirmed', 409);
      queueVerificationMail(repo.findById(user.id)!);
    },

    forgotPassword(email: string): void {
      const row = repo.findByEmail(email);
      // Same answer whether or not the address has an account.
      if (!row || row.disabledAt) return;
      const token = issueToken(row.id, 'reset_password', RESET_TTL_MS);
      mailer.queue(
        composeMail({
          to: row.email,
          subject: 'Reset your Kitlane password',
          greeting: `Hello ${row.displayName},`,
          paragraphs: ['Someone asked to reset the password of this Kitlane account. The link works for one hour, once.'],
          link: { label: 'Choose a new password', url: `${appUrl}/reset-password?token=${token}` },
          footer: 'If it was not you, ignore this mail; your password stays as it is.',
        }),
      );
    },

    async resetPassword(input: ResetPasswordInput): Promise<void> {
      const passwordHash = await hashPassword(input.password);
      const used = repo.consumeToken(sha256(input.token), 'reset_password', new Date());
      if (!used) throw new AppError('invalid_token', 'This reset link is not valid any more. Ask for a new one.', 400);
      // Following a mailed link also proves the address.
      const row = repo.findById(used.userId)!;
      repo.updateUser(used.userId, { passwordHash, emailVerifiedAt: row.emailVerifiedAt ?? new Date() });
      await lucia.invalidateUserSessions(used.userId);
    },

    async changePassword(user: CurrentUser, input: ChangePasswordInput): Promise<{ sessionId: string }> {
      const row = repo.findById(user.id)!;
      if (!(await verifyPassword(row.passwordHash, input.currentPassword))) {
        throw new AppError('invalid_credentials', 'Your current password is not right', 400, {
          currentPassword: 'This is not your current password',
        });
      }
      repo.updateUser(user.id, { passwordHash: await hashPassword(input.newPassword) });
      // Other devices are signed out; this one gets a fresh session.
      await lucia.invalidateUserSessions(user.id);
      const session = await lucia.createSession(user.id, {});
      return { sessionId: session.id };
    },

    updateAccount(user: CurrentUser, input: UpdateAccountInput): CurrentUser {
      const keepAdmin = user.roles.includes('admin') ? ['admin'] : [];
      repo.updateUser(user.id, {
        displayName: input.displayName,
        roles: [...new Set([...input.roles, ...keepAdmin])],
        timeZone: input.timeZone,
      });
      return toCurrentUser(repo.findById(user.id)!);
    },
  };
}
export type AuthService = ReturnType<typeof createAuthService>;

import { Router } from 'express';
import { validateBody, bodyOf } from '../../http/validate';
import { requireSignedIn, requireUser, setSessionCookie, clearSessionCookie } from '../../auth/middleware';
import type { AuthLucia } from '../../auth/lucia';
import type { AuthService } from './auth.service';
import { limiter, ipAndEmailKey, type Limits } from '../../http/rate-limit';
import {
  changePasswordInputSchema,
  forgotPasswordInputSchema,
  loginInputSchema,
  resetPasswordInputSchema,
  signupInputSchema,
  tokenInputSchema,
  updateAccountInputSchema,
} from '@shared/schemas/auth';

export function authRoutes(auth: AuthService, lucia: AuthLucia, limits: Limits): Router {
  const r = Router();
  // The sign-in family works signed out; the account's own settings do not.
  r.use('/account', requireSignedIn);

  r.post('/auth/signup', limiter('sign-up', limits.signup), validateBody(signupInputSchema), async (req, res) => {
    const { user, sessionId } = await auth.signup(bodyOf(res, signupInputSchema));
    setSessionCookie(req, res, lucia, sessionId);
    res.status(201).json({ user });
  });

  r.post(
    '/auth/login',
    limiter('sign-in', limits.login),
    limiter('sign-in', limits.loginPerAccount, ipAndEmailKey),
    validateBody(loginInputSchema),
    async (req, res) => {
    const { user, sessionId } = await auth.login(bodyOf(res, loginInputSchema));
    setSessionCookie(req, res, lucia, sessionId);
    res.json({ user });
  });

  r.post('/auth/logout', async (req, res) => {
    await auth.logout(res.locals.sessionId);
    clearSessionCookie(req, res, lucia);
    res.status(204).end();
  });

  r.post('/auth/verify-email', validateBody(tokenInputSchema), async (req, res) => {
    const { user, sessionId } = await auth.verifyEmail(bodyOf(res, tokenInputSchema).token);
    setSessionCookie(req, res, lucia, sessionId);
    res.json({ user });
  });

  // Signed out is refused before the limiter, so a stranger cannot spend an account's mail budget.
  r.post('/auth/resend-verification', requireSignedIn, limiter('mail', limits.passwordReset), (_req, res) => {
    auth.resendVerification(requireUser(res));
    res.status(202).json({ ok: true });
  });

  r.post(
    '/auth/forgot-password',
    limiter('password reset', limits.passwordReset),
    validateBody(forgotPasswordInputSchema),
    (_req, res) => {
      auth.forgotPassword(bodyOf(res, forgotPasswordInputSchema).email);
      res.status(202).json({ ok: true });
    },
  );

  r.post(
    '/auth/reset-password',
    limiter('password reset', limits.passwordReset),
    validateBody(resetPasswordInputSchema),
    async (_req, res) => {
      await auth.resetPassword(bodyOf(res, resetPasswordInputSchema));
      res.status(204).end();
    },
  );

  r.get('/me', (_req, res) => {
    res.json({ user: res.locals.user ?? null });
  });

  r.patch('/account', validateBody(updateAccountInputSchema), (_req, res) => {
    const user = auth.updateAccount(requireUser(res), bodyOf(res, updateAccountInputSchema));
    res.json({ user });
  });

  r.post('/account/password', validateBody(changePasswordInputSchema), async (req, res) => {
    const { sessionId } = await auth.changePassword(requireUser(res), bodyOf(res, changePasswordInputSchema));
    setSessionCookie(req, res, lucia, sessionId);
    res.status(204).end();
  });

  return r;
}

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate } from 'react-router-dom';
import { loginInputSchema } from '@shared/schemas/auth';
import { paths, safeNext } from '@/config/paths';
import { Alert, Button, TextField } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { useSignIn } from '../api/sign-in';
import { useCountdown } from '../hooks/use-countdown';
import { applyServerErrors } from './server-errors';

// Deliberately the same words whether the email is unknown or the password is wrong: accounts cannot be probed.
export const GENERIC_SIGN_IN_ERROR = 'That email and password do not match an account. Check both and try again.';

export function SignInForm({ next }: { next: string | null }) {
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const [blockedUntil, setBlockedUntil] = useState<number | null>(null);
  const waitSeconds = useCountdown(blockedUntil);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(loginInputSchema), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setBlockedUntil(null);
    signIn.mutate(values, {
      onSuccess: () => navigate(safeNext(next) ?? paths.home.getHref(), { replace: true }),
      onError: (error) => {
        if (isApiError(error) && error.code === 'invalid_credentials') setFormError(GENERIC_SIGN_IN_ERROR);
        else if (isApiError(error) && error.status === 429) setBlockedUntil(Date.now() + (error.retryAfterSeconds ?? 60) * 1000);
        else setFormError(applyServerErrors(error, setError, ['email', 'password']));
      },
    });
  });

  const blocked = waitSeconds > 0;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {blocked ? <Alert tone="error">Too many attempts, try again in {waitSeconds} s.</Alert> : null}
      <TextField label="Email" type="email" autoComplete="email" error={errors.email?.message} {...register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...register('password')} />
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" busy={signIn.isPending} busyLabel="Signing in…" disabled={blocked}>
          Sign in
        </Button>
        <Link to={paths.forgotPassword.getHref()} className="font-medium text-brand-800 underline underline-offset-2">
          Forgot your password?
        </Link>
      </div>
      <p className="text-ink-muted">
        New to Kitlane?{' '}
        <Link to={paths.signUp.getHref()} className="font-medium text-brand-800 underline underline-offset-2">
          Create an account
        </Link>
      </p>
    </form>
  );
}

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { resetPasswordInputSchema } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { Alert, Button, ButtonLink, TextField } from '@/components/ui';
import { useResetPassword } from '../api/reset-password';
import { applyServerErrors } from './server-errors';
import { PASSWORD_HINT } from './password-hint';

export function ResetPasswordForm({ token }: { token: string }) {
  const reset = useResetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(resetPasswordInputSchema), defaultValues: { token, password: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    reset.mutate(values, { onError: (error) => setFormError(applyServerErrors(error, setError, ['password'])) });
  });

  if (reset.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert tone="success" title="Your password is changed">
          For safety every device was signed out. Sign in with the new password.
        </Alert>
        <ButtonLink to={paths.signIn.getHref()}>Sign in</ButtonLink>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {errors.token ? <Alert tone="error">This reset link is incomplete. Open it again from the mail, or ask for a new one.</Alert> : null}
      {formError ? (
        <Alert tone="error">
          {formError}{' '}
          <Link to={paths.forgotPassword.getHref()} className="font-medium underline underline-offset-2">
            Ask for a new link
          </Link>
        </Alert>
      ) : null}
      <input type="hidden" {...register('token')} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" busy={reset.isPending} busyLabel="Saving…">
        Save new password
      </Button>
    </form>
  );
}

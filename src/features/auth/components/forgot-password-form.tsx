import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { forgotPasswordInputSchema } from '@shared/schemas/auth';
import { Alert, Button, TextField } from '@/components/ui';
import { useForgotPassword } from '../api/forgot-password';
import { applyServerErrors } from './server-errors';

// The same confirmation whether or not the address has an account, as the server answers.
export const FORGOT_PASSWORD_CONFIRMATION =
  'If an account uses that address, a link to choose a new password is on its way. It works once, for one hour.';

export function ForgotPasswordForm() {
  const forgot = useForgotPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(forgotPasswordInputSchema), defaultValues: { email: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    forgot.mutate(values, { onError: (error) => setFormError(applyServerErrors(error, setError, ['email'])) });
  });

  if (forgot.isSuccess) {
    return (
      <Alert tone="success" title="Check your inbox">
        {FORGOT_PASSWORD_CONFIRMATION}
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField label="Email" type="email" autoComplete="email" error={errors.email?.message} {...register('email')} />
      <Button type="submit" busy={forgot.isPending} busyLabel="Sending…">
        Send me a reset link
      </Button>
    </form>
  );
}

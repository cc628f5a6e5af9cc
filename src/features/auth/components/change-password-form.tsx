import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { changePasswordInputSchema } from '@shared/schemas/auth';
import { Alert, Button, TextField } from '@/components/ui';
import { useChangePassword } from '../api/change-password';
import { applyServerErrors } from './server-errors';
import { PASSWORD_HINT } from './password-hint';

export function ChangePasswordForm() {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({ resolver: zodResolver(changePasswordInputSchema), defaultValues: { currentPassword: '', newPassword: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    change.mutate(values, {
      onSuccess: () => reset(),
      onError: (error) => setFormError(applyServerErrors(error, setError, ['currentPassword', 'newPassword'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {change.isSuccess ? <Alert tone="success">Password changed. Your other devices were signed out.</Alert> : null}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
        error={errors.newPassword?.message}
        {...register('newPassword')}
      />
      <Button type="submit" busy={change.isPending} busyLabel="Changing…">
        Change password
      </Button>
    </form>
  );
}

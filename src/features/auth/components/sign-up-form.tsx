import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate } from 'react-router-dom';
import { signupInputSchema } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { Alert, Button, CheckboxGroup, TextField } from '@/components/ui';
import { useSignUp } from '../api/sign-up';
import { applyServerErrors } from './server-errors';
import { ROLE_OPTIONS } from './role-options';
import { PASSWORD_HINT } from './password-hint';

const FIELDS = ['email', 'password', 'displayName', 'roles'] as const;

export function SignUpForm() {
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(signupInputSchema),
    defaultValues: { email: '', password: '', displayName: '', roles: [] },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    signUp.mutate(values, {
      onSuccess: () => navigate(paths.checkInbox.getHref()),
      onError: (error) => setFormError(applyServerErrors(error, setError, FIELDS)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField label="Email" type="email" autoComplete="email" error={errors.email?.message} {...register('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Display name"
        autoComplete="nickname"
        hint="Shown to the people you work with. 2 to 60 characters."
        error={errors.displayName?.message}
        {...register('displayName')}
      />
      <CheckboxGroup
        legend="I am joining as"
        hint="Pick one or more. You can change this later in your account."
        options={ROLE_OPTIONS}
        error={errors.roles?.message ?? errors.roles?.root?.message}
        inputProps={register('roles')}
      />
      <Button type="submit" busy={signUp.isPending} busyLabel="Creating your account…" className="w-full sm:w-auto">
        Create account
      </Button>
      <p className="text-ink-muted">
        Already have an account?{' '}
        <Link to={paths.signIn.getHref()} className="font-medium text-brand-800 underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </form>
  );
}

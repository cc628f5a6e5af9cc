import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateAccountInputSchema, type MeUser } from '@shared/schemas/auth';
import { isRole, SELF_CHOSEN_ROLES } from '@shared/permissions';
import { Alert, Button, CheckboxGroup, SelectField, TextField } from '@/components/ui';
import { useUpdateAccount } from '../api/update-account';
import { applyServerErrors } from './server-errors';
import { ROLE_OPTIONS } from './role-options';
import { timeZoneOptions } from './time-zones';

const FIELDS = ['displayName', 'roles', 'timeZone'] as const;

function selfChosenRolesOf(user: MeUser) {
  return user.roles.filter(isRole).filter((r): r is (typeof SELF_CHOSEN_ROLES)[number] => r !== 'admin');
}

export function ProfileForm({ user }: { user: MeUser }) {
  const update = useUpdateAccount();
  const [formError, setFormError] = useState<string | null>(null);
  const zones = useMemo(() => timeZoneOptions(user.timeZone), [user.timeZone]);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useForm({
    resolver: zodResolver(updateAccountInputSchema),
    defaultValues: { displayName: user.displayName, roles: selfChosenRolesOf(user), timeZone: user.timeZone },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    update.mutate(values, {
      onSuccess: ({ user: saved }) => reset({ displayName: saved.displayName, roles: selfChosenRolesOf(saved), timeZone: saved.timeZone }),
      onError: (error) => setFormError(applyServerErrors(error, setError, FIELDS)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      {update.isSuccess && !isDirty ? <Alert tone="success">Your account is saved.</Alert> : null}
      <TextField label="Display name" autoComplete="nickname" error={errors.displayName?.message} {...register('displayName')} />
      <CheckboxGroup
        legend="Roles"
        layout="stack"
        hint="What you do on Kitlane. Keep at least one."
        options={ROLE_OPTIONS}
        error={errors.roles?.message ?? errors.roles?.root?.message}
        inputProps={register('roles')}
      />
      <SelectField
        label="Time zone"
        hint="Deadlines and messages are shown in this zone."
        options={zones}
        error={errors.timeZone?.message}
        {...register('timeZone')}
      />
      <Button type="submit" busy={update.isPending} busyLabel="Saving…">
        Save changes
      </Button>
    </form>
  );
}

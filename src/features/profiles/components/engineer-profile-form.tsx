import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  ENGINEER_SERVICE_LABELS,
  ENGINEER_SERVICES,
  engineerProfileInputSchema,
  type EngineerProfile,
  type EngineerProfileFormValues,
  type EngineerProfileInput,
} from '@shared/schemas/profiles';
import { Alert, Button, CheckboxGroup, FieldError, TextField, SelectField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { timeZoneOptions } from '@/features/auth/components/time-zones';
import { applyServerErrors } from '@/features/auth/components/server-errors';
import { useSaveEngineerProfile } from '../api/save-engineer-profile';

const FIELDS = ['headline', 'bio', 'services', 'town', 'country', 'timeZone'] as const;

export function EngineerProfileForm({ profile }: { profile: EngineerProfile }) {
  const save = useSaveEngineerProfile();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState } = useForm<EngineerProfileFormValues, unknown, EngineerProfileInput>({
    defaultValues: { headline: profile.headline, bio: profile.bio, services: profile.services, town: profile.town, country: profile.country, timeZone: profile.timeZone },
    resolver: zodResolver(engineerProfileInputSchema),
  });
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    setSaved(false);
    try {
      await save.mutateAsync(input);
      setSaved(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, FIELDS));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Engineer profile">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField label="Engineer headline" hint="Shown on your engineer page once filled in" error={errors.headline?.message} {...register('headline')} />
      <div className="space-y-1.5">
        <label htmlFor="engineer-bio" className="block font-medium">
          About your engineering
        </label>
        <textarea id="engineer-bio" rows={4} className={fieldClasses(Boolean(errors.bio))} {...register('bio')} />
        <FieldError message={errors.bio?.message} />
      </div>
      <CheckboxGroup legend="Services offered" error={errors.services?.message} options={ENGINEER_SERVICES.map((s) => ({ value: s, label: ENGINEER_SERVICE_LABELS[s] }))} inputProps={register('services')} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Town (engineer)" error={errors.town?.message} {...register('town')} />
        <TextField label="Country code (engineer)" maxLength={2} error={errors.country?.message} {...register('country')} />
      </div>
      <SelectField label="Time zone (engineer)" options={timeZoneOptions(profile.timeZone)} error={errors.timeZone?.message} {...register('timeZone')} />
      <div className="flex items-center gap-3">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…">
          Save engineer profile
        </Button>
        {saved ? (
          <p role="status" className="text-success-700">
            Saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}

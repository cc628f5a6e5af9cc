import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { fromMinor, MoneyError, toMinor } from '@shared/money';
import {
  DRUM_STYLES,
  RATE_CURRENCIES,
  drummerProfileInputSchema,
  styleLabel,
  type DrummerProfile,
  type DrummerProfileInput,
} from '@shared/schemas/profiles';
import { Alert, Button, CheckboxGroup, FieldError, SelectField, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { timeZoneOptions } from '@/features/auth/components/time-zones';
import { mapServerFields, schemaResolver, type Conversion } from '@/features/briefs/components/schema-resolver';
import { isApiError } from '@/lib/api-client';
import { useSaveDrummerProfile } from '../api/save-drummer-profile';

// The form holds what a person types (a rate like 250.00, tags as one line); the resolver converts it to
// the API's shape and checks it with the same shared schema the server uses.
export type DrummerFormValues = {
  headline: string;
  bio: string;
  styles: string[];
  tagsText: string;
  kit: string;
  rate: string;
  currency: string;
  turnaroundDays: string;
  revisionsIncluded: string;
  takingWork: boolean;
  town: string;
  country: string;
  timeZone: string;
  published: boolean;
};

const API_TO_FIELD: Record<string, keyof DrummerFormValues> = { baseRateMinor: 'rate', tags: 'tagsText' };
const fieldOf = (apiPath: string) => API_TO_FIELD[apiPath] ?? apiPath;
const numberOrNaN = (s: string) => (s.trim() === '' ? Number.NaN : Number(s));

export function toDrummerInput(v: DrummerFormValues): Conversion {
  const errors: Record<string, string> = {};
  let baseRateMinor = Number.NaN;
  try {
    baseRateMinor = toMinor(v.rate.trim() || 'x', v.currency);
  } catch (err) {
    errors.rate = err instanceof MoneyError && v.rate.trim() ? err.message : 'Enter your rate per song, e.g. 250 or 250.00';
  }
  return {
    errors,
    input: {
      headline: v.headline,
      bio: v.bio,
      styles: v.styles,
      tags: v.tagsText.split(',').map((t) => t.trim()).filter(Boolean),
      kit: v.kit,
      baseRateMinor,
      currency: v.currency,
      turnaroundDays: numberOrNaN(v.turnaroundDays),
      revisionsIncluded: numberOrNaN(v.revisionsIncluded),
      takingWork: v.takingWork,
      town: v.town,
      country: v.country,
      timeZone: v.timeZone,
      published: v.published,
    },
  };
}

function defaultsOf(p: DrummerProfile): DrummerFormValues {
  return {
    headline: p.headline,
    bio: p.bio,
    styles: p.styles,
    tagsText: p.tags.join(', '),
    kit: p.kit,
    rate: p.baseRateMinor > 0 ? fromMinor(p.baseRateMinor, p.currency) : '',
    currency: p.currency,
    turnaroundDays: String(p.turnaroundDays),
    revisionsIncluded: String(p.revisionsIncluded),
    takingWork: p.takingWork,
    town: p.town,
    country: p.country,
    timeZone: p.timeZone,
    published: p.published,
  };
}

export function DrummerProfileForm({ profile }: { profile: DrummerProfile }) {
  const save = useSaveDrummerProfile();
  const [formError, setFormError] = useState<string | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<DrummerFormValues, unknown, DrummerProfileInput>({
    defaultValues: defaultsOf(profile),
    resolver: schemaResolver(drummerProfileInputSchema, toDrummerInput, fieldOf),
  });
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    setSavedAt(null);
    try {
      const saved = await save.mutateAsync(input);
      setSavedAt(saved.profile.listed ? 'Saved. Your profile is listed in drummer search.' : 'Saved. It is not listed yet: publish it and give it a headline.');
    } catch (err) {
      if (isApiError(err) && Object.keys(err.fields).length) {
        for (const [field, message] of Object.entries(mapServerFields(err.fields, fieldOf))) setError(field as keyof DrummerFormValues, { type: 'server', message });
      } else setFormError(err instanceof Error ? err.message : 'The profile could not be saved.');
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Drummer profile">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <TextField label="Headline" hint="One line songwriters see in search, e.g. “Tight funk drums with ghost notes”" error={errors.headline?.message} {...register('headline')} />
      <div className="space-y-1.5">
        <label htmlFor="drummer-bio" className="block font-medium">
          About you
        </label>
        <textarea id="drummer-bio" rows={5} className={fieldClasses(Boolean(errors.bio))} aria-invalid={errors.bio ? true : undefined} {...register('bio')} />
        <FieldError message={errors.bio?.message} />
      </div>
      <CheckboxGroup legend="Styles" hint="Pick up to 8" error={errors.styles?.message} options={DRUM_STYLES.map((s) => ({ value: s, label: styleLabel(s) }))} inputProps={register('styles')} />
      <TextField label="Tags" hint="Your own words, separated by commas (e.g. brushes, double kick)" error={errors.tagsText?.message} {...register('tagsText')} />
      <div className="space-y-1.5">
        <label htmlFor="drummer-kit" className="block font-medium">
          Kit
        </label>
        <p id="drummer-kit-hint" className="text-sm text-ink-muted">
          Shells, sizes and cymbals by type, e.g. 22&quot; kick, 14&quot; wooden snare, dark 20&quot; ride
        </p>
        <textarea id="drummer-kit" rows={3} aria-describedby="drummer-kit-hint" className={fieldClasses(Boolean(errors.kit))} {...register('kit')} />
        <FieldError message={errors.kit?.message} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Base rate per song" inputMode="decimal" error={errors.rate?.message} {...register('rate')} />
        <SelectField label="Currency" options={RATE_CURRENCIES.map((c) => ({ value: c, label: c }))} error={errors.currency?.message} {...register('currency')} />
        <TextField label="Usual turnaround (days)" inputMode="numeric" error={errors.turnaroundDays?.message} {...register('turnaroundDays')} />
        <TextField label="Revisions included" inputMode="numeric" error={errors.revisionsIncluded?.message} {...register('revisionsIncluded')} />
        <TextField label="Town" error={errors.town?.message} {...register('town')} />
        <TextField label="Country code" hint="Two letters, e.g. DE" maxLength={2} error={errors.country?.message} {...register('country')} />
      </div>
      <SelectField label="Time zone" options={timeZoneOptions(profile.timeZone)} error={errors.timeZone?.message} {...register('timeZone')} />
      <div className="space-y-2">
        <label className="flex items-center gap-2">
          <input type="checkbox" className="size-4 accent-brand-700" {...register('takingWork')} />
          Taking work now
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="size-4 accent-brand-700" {...register('published')} />
          Publish my profile (shown in search once it has a headline)
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…">
          Save profile
        </Button>
        {savedAt ? (
          <p role="status" className="text-success-700">
            {savedAt}
          </p>
        ) : null}
      </div>
    </form>
  );
}

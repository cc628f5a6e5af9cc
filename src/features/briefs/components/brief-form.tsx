import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { fromMinor, MoneyError, SUPPORTED_CURRENCIES, toMinor } from '@shared/money';
import {
  BIT_DEPTH_LABELS,
  BIT_DEPTHS,
  briefInputSchema,
  formatMinutesSeconds,
  parseMinutesSeconds,
  SAMPLE_RATES,
  STEM_MODE_LABELS,
  STEM_MODES,
  TIME_SIGNATURES,
  todayIn,
  addDays,
  DEFAULT_DEADLINE_DAYS,
  type BriefValues,
  type BriefView,
} from '@shared/schemas/briefs';
import { DRUM_STYLES, styleLabel } from '@shared/schemas/profiles';
import { Alert, Button, FieldError, SelectField, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { mapServerFields, schemaResolver, type Conversion } from './schema-resolver';

export type BriefFormValues = {
  songTitle: string;
  description: string;
  drumNotes: string;
  style: string;
  tempoBpm: string;
  timeSignature: string;
  musicalKey: string;
  lengthUnit: 'bars' | 'time';
  lengthBars: string;
  lengthTime: string;
  songCount: string;
  referenceNotes: string;
  sampleRate: string;
  bitDepth: string;
  stemMode: string;
  stemListText: string;
  roughMix: boolean;
  budgetMin: string;
  budgetMax: string;
  currency: string;
  deadline: string;
  needsRoom: boolean;
};

const API_TO_FIELD: Record<string, keyof BriefFormValues> = {
  budgetMinMinor: 'budgetMin',
  budgetMaxMinor: 'budgetMax',
  lengthSeconds: 'lengthTime',
  stemList: 'stemListText',
};

function fieldOf(apiPath: string, values?: BriefFormValues): string {
  if (apiPath === 'lengthBars') return values?.lengthUnit === 'time' ? 'lengthTime' : 'lengthBars';
  return API_TO_FIELD[apiPath] ?? apiPath;
}

const numberOrNaN = (s: string) => (s.trim() === '' ? Number.NaN : Number(s));

function money(value: string, currency: string, field: string, errors: Record<string, string>): number | undefined {
  if (value.trim() === '') {
    errors[field] = 'Enter an amount';
    return undefined;
  }
  try {
    return toMinor(value.trim(), currency);
  } catch (err) {
    errors[field] = err instanceof MoneyError ? err.message : 'Enter an amount like 250 or 250.00';
    return undefined;
  }
}

export function toBriefInput(v: BriefFormValues): Conversion {
  const errors: Record<string, string> = {};
  const seconds = v.lengthUnit === 'time' && v.lengthTime.trim() ? parseMinutesSeconds(v.lengthTime) : null;
  if (v.lengthUnit === 'time' && v.lengthTime.trim() && seconds === null) errors.lengthTime = 'Write the length as minutes:seconds, e.g. 3:45';
  const currencyOk = (SUPPORTED_CURRENCIES as readonly string[]).includes(v.currency);
  return {
    errors,
    input: {
      songTitle: v.songTitle,
      description: v.description,
      drumNotes: v.drumNotes,
      style: v.style,
      tempoBpm: numberOrNaN(v.tempoBpm),
      timeSignature: v.timeSignature,
      musicalKey: v.musicalKey,
      lengthBars: v.lengthUnit === 'bars' && v.lengthBars.trim() ? numberOrNaN(v.lengthBars) : null,
      lengthSeconds: seconds,
      songCount: numberOrNaN(v.songCount),
      referenceNotes: v.referenceNotes,
      sampleRate: Number(v.sampleRate),
      bitDepth: v.bitDepth,
      stemMode: v.stemMode,
      stemList: v.stemMode === 'named' ? v.stemListText.split('\n').map((s) => s.trim()).filter(Boolean) : [],
      roughMix: v.roughMix,
      budgetMinMinor: currencyOk ? money(v.budgetMin, v.currency, 'budgetMin', errors) : 0,
      budgetMaxMinor: currencyOk ? money(v.budgetMax, v.currency, 'budgetMax', errors) : 0,
      currency: v.currency,
      deadline: v.deadline,
      needsRoom: v.needsRoom,
    },
  };
}

export function briefFormDefaults(brief: BriefView | null, timeZone: string): BriefFormValues {
  if (!brief) {
    return {
      songTitle: '',
      description: '',
      drumNotes: '',
      style: 'rock',
      tempoBpm: '',
      timeSignature: '4/4',
      musicalKey: '',
      lengthUnit: 'bars',
      lengthBars: '',
      lengthTime: '',
      songCount: '1',
      referenceNotes: '',
      sampleRate: '48000',
      bitDepth: '24',
      stemMode: 'every_mic',
      stemListText: '',
      roughMix: false,
      budgetMin: '',
      budgetMax: '',
      currency: 'USD',
      deadline: addDays(todayIn(timeZone), DEFAULT_DEADLINE_DAYS),
      needsRoom: false,
    };
  }
  return {
    songTitle: brief.songTitle,
    description: brief.description,
    drumNotes: brief.drumNotes,
    style: brief.style,
    tempoBpm: String(brief.tempoBpm),
    timeSignature: brief.timeSignature,
    musicalKey: brief.musicalKey,
    lengthUnit: brief.lengthBars != null ? 'bars' : 'time',
    lengthBars: brief.lengthBars != null ? String(brief.lengthBars) : '',
    lengthTime: brief.lengthSeconds != null ? formatMinutesSeconds(brief.lengthSeconds) : '',
    songCount: String(brief.songCount),
    referenceNotes: brief.referenceNotes,
    sampleRate: String(brief.sampleRate),
    bitDepth: brief.bitDepth,
    stemMode: brief.stemMode,
    stemListText: brief.stemList.join('\n'),
    roughMix: brief.roughMix,
    budgetMin: fromMinor(brief.budgetMinMinor, brief.currency),
    budgetMax: fromMinor(brief.budgetMaxMinor, brief.currency),
    currency: brief.currency,
    deadline: brief.deadline,
    needsRoom: brief.needsRoom,
  };
}

const resolver = schemaResolver<BriefFormValues, typeof briefInputSchema>(briefInputSchema, toBriefInput, fieldOf);

function TextArea({ label, hint, error, ...rest }: React.TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; hint?: string; error?: string; name: string }) {
  const id = `brief-${rest.name}`;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-medium">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <textarea
        id={id}
        rows={4}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined}
        className={fieldClasses(Boolean(error))}
        {...rest}
      />
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

function Check({ label, ...rest }: React.InputHTMLAttributes<HTMLInputElement> & { label: string }) {
  return (
    <label className="flex items-center gap-3 font-medium">
      <input type="checkbox" className="size-5 accent-brand-700" {...rest} />
      {label}
    </label>
  );
}

/** The brief form for a new draft and for editing one; `onSave` gets the API input. */
export function BriefForm({
  brief,
  timeZone,
  submitLabel,
  busy,
  onSave,
}: {
  brief: BriefView | null;
  timeZone: string;
  submitLabel: string;
  busy: boolean;
  onSave: (input: BriefValues) => Promise<unknown>;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors },
  } = useForm<BriefFormValues, unknown, BriefValues>({ resolver, defaultValues: briefFormDefaults(brief, timeZone) });
  const lengthUnit = watch('lengthUnit');
  const stemMode = watch('stemMode');
  const currency = watch('currency');

  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await onSave(input);
    } catch (error) {
      if (isApiError(error) && Object.keys(error.fields).length) {
        for (const [field, message] of Object.entries(mapServerFields(error.fields, (p) => fieldOf(p)))) {
          setError(field as keyof BriefFormValues, { type: 'server', message });
        }
        setFormError('Some fields need attention.');
      } else {
        setFormError(error instanceof Error ? error.message : 'The brief could not be saved.');
      }
    }
  });

  const err = (k: keyof BriefFormValues) => errors[k]?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-8">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <fieldset className="space-y-5">
        <legend className="text-xl font-bold">The song</legend>
        <TextField label="Song title" error={err('songTitle')} {...register('songTitle')} />
        <TextArea label="What the song is" hint="Genre, mood, what is already recorded." error={err('description')} {...register('description')} />
        <TextArea label="What the drums should do" hint="Feel, dynamics, fills, anything to avoid." error={err('drumNotes')} {...register('drumNotes')} />
        <div className="grid gap-5 sm:grid-cols-2">
          <SelectField label="Style" options={DRUM_STYLES.map((s) => ({ value: s, label: styleLabel(s) }))} error={err('style')} {...register('style')} />
          <TextField label="Key" hint="Optional, e.g. E minor" error={err('musicalKey')} {...register('musicalKey')} />
          <TextField label="Tempo (BPM)" inputMode="decimal" hint="20 to 300" error={err('tempoBpm')} {...register('tempoBpm')} />
          <SelectField label="Time signature" options={TIME_SIGNATURES.map((t) => ({ value: t, label: t }))} error={err('timeSignature')} {...register('timeSignature')} />
        </div>
        <fieldset className="space-y-3">
          <legend className="font-medium">Length</legend>
          <div className="flex gap-6">
            <label className="flex items-center gap-2">
              <input type="radio" value="bars" className="accent-brand-700" {...register('lengthUnit')} /> In bars
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="time" className="accent-brand-700" {...register('lengthUnit')} /> As minutes:seconds
            </label>
          </div>
          {lengthUnit === 'bars' ? (
            <TextField label="Length in bars" inputMode="numeric" error={err('lengthBars')} {...register('lengthBars')} />
          ) : (
            <TextField label="Length (minutes:seconds)" placeholder="3:45" error={err('lengthTime')} {...register('lengthTime')} />
          )}
        </fieldset>
        <TextField label="Number of songs" inputMode="numeric" error={err('songCount')} {...register('songCount')} />
        <TextArea label="Reference notes" hint="Sounds or records to aim for, in your own words." error={err('referenceNotes')} {...register('referenceNotes')} />
      </fieldset>

      <fieldset className="space-y-5">
        <legend className="text-xl font-bold">Deliverables</legend>
        <div className="grid gap-5 sm:grid-cols-2">
          <SelectField label="Sample rate" options={SAMPLE_RATES.map((r) => ({ value: String(r), label: `${r / 1000} kHz` }))} error={err('sampleRate')} {...register('sampleRate')} />
          <SelectField label="Bit depth" options={BIT_DEPTHS.map((b) => ({ value: b, label: BIT_DEPTH_LABELS[b] }))} error={err('bitDepth')} {...register('bitDepth')} />
        </div>
        <SelectField label="Stems" options={STEM_MODES.map((m) => ({ value: m, label: STEM_MODE_LABELS[m] }))} error={err('stemMode')} {...register('stemMode')} />
        {stemMode === 'named' ? <TextArea label="Stem list" hint="One stem per line, e.g. Kick, Snare, Overheads." error={err('stemListText')} {...register('stemListText')} /> : null}
        <Check label="Include a rough mix" {...register('roughMix')} />
      </fieldset>

      <fieldset className="space-y-5">
        <legend className="text-xl font-bold">Budget and deadline</legend>
        <div className="grid gap-5 sm:grid-cols-3">
          <SelectField label="Currency" options={SUPPORTED_CURRENCIES.map((c) => ({ value: c, label: c }))} error={err('currency')} {...register('currency')} />
          <TextField label={`Budget from (${currency})`} inputMode="decimal" error={err('budgetMin')} {...register('budgetMin')} />
          <TextField label={`Budget up to (${currency})`} inputMode="decimal" error={err('budgetMax')} {...register('budgetMax')} />
        </div>
        <TextField label="Deadline" type="date" hint={`A date in your time zone (${timeZone}).`} error={err('deadline')} {...register('deadline')} />
        <Check label="I need a room and an engineer too" {...register('needsRoom')} />
      </fieldset>

      <Button type="submit" busy={busy} busyLabel="Saving…">
        {submitLabel}
      </Button>
    </form>
  );
}

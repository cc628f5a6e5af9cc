import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { formatMoney, MoneyError, toMinor } from '@shared/money';
import { QUOTE_VALIDITY_DAYS, quoteInputSchema, RIGHTS_LABELS, RIGHTS_TERMS, type QuoteValues } from '@shared/schemas/quotes';
import type { BriefView } from '@shared/schemas/briefs';
import type { MicPackageView } from '@shared/schemas/mic-packages';
import { Alert, Button, FieldError, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { mapServerFields, schemaResolver, type Conversion } from '@/features/briefs/components/schema-resolver';
import { LegalCaution } from './quote-terms';
import { PackagePicker } from './package-picker';

type QuoteFormValues = {
  perSongFee: string;
  rushFee: string;
  extraRevision: string;
  revisionsIncluded: string;
  turnaroundDays: string;
  recordingDate: string;
  rightsTerms: string;
  royaltyPoints: string;
  message: string;
  validDays: string;
  withEngineer: boolean;
  packageId: string;
};

const API_TO_FIELD: Record<string, keyof QuoteFormValues> = {
  perSongFeeMinor: 'perSongFee',
  rushFeeMinor: 'rushFee',
  extraRevisionMinor: 'extraRevision',
  engineerId: 'packageId',
  engineerShareMinor: 'packageId',
};
const fieldOf = (apiPath: string) => API_TO_FIELD[apiPath] ?? apiPath;

function moneyOr(value: string, currency: string, field: string, errors: Record<string, string>, empty: number | null): number | null | undefined {
  if (value.trim() === '') return empty;
  try {
    return toMinor(value.trim(), currency);
  } catch (err) {
    errors[field] = err instanceof MoneyError ? err.message : 'Enter an amount like 150 or 150.00';
    return undefined;
  }
}

const num = (s: string) => (s.trim() === '' ? Number.NaN : Number(s));

function converter(currency: string) {
  return (v: QuoteFormValues): Conversion => {
    const errors: Record<string, string> = {};
    if (v.perSongFee.trim() === '') errors.perSongFee = 'Enter your fee per song';
    if (v.withEngineer && !v.packageId) errors.packageId = 'Pick a room and one of its mic packages';
    return {
      errors,
      input: {
        perSongFeeMinor: moneyOr(v.perSongFee, currency, 'perSongFee', errors, 0),
        rushFeeMinor: moneyOr(v.rushFee, currency, 'rushFee', errors, 0),
        extraRevisionMinor: moneyOr(v.extraRevision, currency, 'extraRevision', errors, 0),
        revisionsIncluded: num(v.revisionsIncluded),
        turnaroundDays: num(v.turnaroundDays),
        recordingDate: v.recordingDate || null,
        rightsTerms: v.rightsTerms,
        royaltyPoints: v.rightsTerms === 'points' && v.royaltyPoints.trim() ? num(v.royaltyPoints) : null,
        message: v.message,
        validDays: num(v.validDays),
        // The server fills in the engineer and their share from the package (resolvePackage).
        packageId: v.withEngineer ? v.packageId || null : null,
        engineerId: null,
        engineerShareMinor: null,
      },
    };
  };
}

/** A drummer's quote on a brief; prices are typed in the brief's currency and sent as minor units. */
export function QuoteForm({ brief, onSend, busy }: { brief: BriefView; onSend: (input: QuoteValues) => Promise<unknown>; busy: boolean }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [resolver] = useState(() => schemaResolver<QuoteFormValues, typeof quoteInputSchema>(quoteInputSchema, converter(brief.currency), fieldOf));
  const {
    register,
    handleSubmit,
    watch,
    setValue,
    setError,
    formState: { errors },
  } = useForm<QuoteFormValues, unknown, QuoteValues>({
    resolver,
    defaultValues: {
      perSongFee: '',
      rushFee: '',
      extraRevision: '',
      revisionsIncluded: '2',
      turnaroundDays: '7',
      recordingDate: '',
      rightsTerms: 'buyout',
      royaltyPoints: '',
      message: '',
      validDays: String(QUOTE_VALIDITY_DAYS.default),
      withEngineer: false,
      packageId: '',
    },
  });
  const rights = watch('rightsTerms');
  const withEngineer = watch('withEngineer');
  const perSong = watch('perSongFee');
  const packageId = watch('packageId');
  const [picked, setPicked] = useState<MicPackageView | null>(null);
  const preview = (() => {
    try {
      return perSong.trim() ? formatMoney(toMinor(perSong.trim(), brief.currency) * brief.songCount, brief.currency) : null;
    } catch {
      return null;
    }
  })();

  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await onSend(input);
    } catch (error) {
      if (isApiError(error) && Object.keys(error.fields).length) {
        for (const [field, message] of Object.entries(mapServerFields(error.fields, fieldOf))) setError(field as keyof QuoteFormValues, { type: 'server', message });
        setFormError('Some fields need attention.');
      } else setFormError(error instanceof Error ? error.message : 'The quote could not be sent.');
    }
  });
  const err = (k: keyof QuoteFormValues) => errors[k]?.message;
  const c = brief.currency;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField
          label={`Fee per song (${c})`}
          inputMode="decimal"
          hint={brief.songCount > 1 ? `× ${brief.songCount} songs${preview ? ` = ${preview}` : ''}` : undefined}
          error={err('perSongFee')}
          {...register('perSongFee')}
        />
        <TextField label={`Rush fee (${c})`} inputMode="decimal" hint="Optional" error={err('rushFee')} {...register('rushFee')} />
        <TextField label={`Each extra revision (${c})`} inputMode="decimal" hint="Not in the total" error={err('extraRevision')} {...register('extraRevision')} />
        <TextField label="Revisions included" inputMode="numeric" error={err('revisionsIncluded')} {...register('revisionsIncluded')} />
        <TextField label="Turnaround (days)" inputMode="numeric" error={err('turnaroundDays')} {...register('turnaroundDays')} />
        <TextField label="Proposed recording date" type="date" hint="Optional" error={err('recordingDate')} {...register('recordingDate')} />
      </div>

      <fieldset className="space-y-3">
        <legend className="font-medium">Rights</legend>
        {RIGHTS_TERMS.map((t) => (
          <label key={t} className="flex cursor-pointer items-start gap-3 rounded-lg border border-line-strong p-3 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50">
            <input type="radio" value={t} className="mt-1 accent-brand-700" {...register('rightsTerms')} />
            <span>
              <span className="block font-medium">{RIGHTS_LABELS[t].title}</span>
              <span className="block text-sm text-ink-muted">{RIGHTS_LABELS[t].explain}</span>
            </span>
          </label>
        ))}
        <FieldError message={err('rightsTerms')} />
        {rights === 'points' ? <TextField label="Royalty points" inputMode="decimal" error={err('royaltyPoints')} {...register('royaltyPoints')} /> : null}
        <LegalCaution />
      </fieldset>

      <fieldset className="space-y-3">
        <legend className="font-medium">Room and engineer</legend>
        <label className="flex items-center gap-3">
          <input type="checkbox" className="size-5 accent-brand-700" {...register('withEngineer')} />
          I record in a room listed on Kitlane (its engineer confirms before the songwriter can accept)
        </label>
        {withEngineer ? (
          <>
            <PackagePicker
              currency={c}
              value={packageId || null}
              error={err('packageId')}
              onChange={(id, pkg) => {
                setValue('packageId', id ?? '', { shouldValidate: false });
                setPicked(pkg);
              }}
            />
            {packageId && picked ? (
              <p className="text-sm">
                {picked.mine
                  ? 'This is your own package: no engineer needs to confirm, and nothing is added to the total.'
                  : `The package price, ${formatMoney(picked.priceMinor, c)}, is added to the quote total as ${picked.engineerName}’s share.`}
              </p>
            ) : null}
          </>
        ) : null}
      </fieldset>

      <div className="space-y-1.5">
        <label htmlFor="quote-message" className="block font-medium">
          Message to the songwriter
        </label>
        <textarea id="quote-message" rows={4} className={fieldClasses(Boolean(err('message')))} aria-invalid={err('message') ? true : undefined} {...register('message')} />
        <FieldError message={err('message')} />
      </div>
      <TextField label="Valid for (days)" inputMode="numeric" hint={`${QUOTE_VALIDITY_DAYS.min} to ${QUOTE_VALIDITY_DAYS.max}`} error={err('validDays')} {...register('validDays')} className="max-w-xs" />
      <Button type="submit" busy={busy} busyLabel="Sending…">
        Send quote
      </Button>
    </form>
  );
}

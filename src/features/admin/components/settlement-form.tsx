import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { formatMoney, fromMinor, MoneyError, toMinor } from '@shared/money';
import { DISPUTE_OUTCOME_LABELS, settleDisputeInputSchema, type SettleDisputeInput, type SettlementPreview } from '@shared/schemas/disputes';
import { Alert, Button, Card, FieldError, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { mapServerFields, schemaResolver, type Conversion } from '@/features/briefs/components/schema-resolver';
import { usePreviewSettlement, useSettleDispute } from '../api/settle-dispute';

type Values = { outcome: 'release' | 'refund' | 'split'; splitBy: 'percent' | 'amount'; percent: string; amount: string; note: string };

const API_TO_FIELD: Record<string, keyof Values> = { songwriterPercent: 'percent', refundMinor: 'amount' };
const fieldOf = (apiPath: string, values?: Values): string => {
  // The schema reports a missing split figure on songwriterPercent; show it on the field in use.
  if (apiPath === 'songwriterPercent' && values?.splitBy === 'amount') return 'amount';
  return API_TO_FIELD[apiPath] ?? apiPath;
};

function converter(currency: string) {
  return (v: Values): Conversion => {
    const errors: Record<string, string> = {};
    const split: Record<string, number> = {};
    if (v.outcome === 'split' && v.splitBy === 'percent') {
      if (v.percent.trim() === '') errors.percent = 'Enter the songwriter’s percentage';
      else split.songwriterPercent = Number(v.percent);
    }
    if (v.outcome === 'split' && v.splitBy === 'amount') {
      try {
        split.refundMinor = toMinor(v.amount.trim(), currency);
      } catch (err) {
        errors.amount = err instanceof MoneyError ? err.message : 'Enter an amount like 150 or 150.00';
      }
    }
    return { errors, input: { outcome: v.outcome, note: v.note, ...split } };
  };
}

function Confirmation({ preview, busy, onConfirm, onBack }: { preview: SettlementPreview; busy: boolean; onConfirm: () => void; onBack: () => void }) {
  const money = (minor: number) => formatMoney(minor, preview.currency);
  return (
    <Card className="space-y-4 border-brand-300" role="region" aria-labelledby="confirm-settlement-heading">
      <h3 id="confirm-settlement-heading" className="text-lg font-bold">
        Confirm: {DISPUTE_OUTCOME_LABELS[preview.outcome].toLowerCase()}
        {preview.songwriterPercent !== null ? ` (${preview.songwriterPercent} % to the songwriter)` : ''}
      </h3>
      <table className="w-full text-left text-sm" data-testid="settlement-preview">
        <caption className="sr-only">Exact amounts of this settlement</caption>
        <tbody>
          <tr>
            <th scope="row" className="py-1 pr-4 font-medium">Held in escrow</th>
            <td>{money(preview.heldMinor)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1 pr-4 font-medium">Back to the songwriter</th>
            <td data-testid="preview-songwriter">
              {money(preview.songwriterMinor)}
              {preview.serviceFeeRefundMinor > 0 ? ` + service fee ${money(preview.serviceFeeRefundMinor)}` : ''}
            </td>
          </tr>
          <tr>
            <th scope="row" className="py-1 pr-4 font-medium">To the drummer</th>
            <td data-testid="preview-drummer">
              {money(preview.drummer.gross)} − commission {money(preview.drummer.commission)} = {money(preview.drummer.net)}
            </td>
          </tr>
          {preview.engineer ? (
            <tr>
              <th scope="row" className="py-1 pr-4 font-medium">To the engineer</th>
              <td>
                {money(preview.engineer.gross)} − commission {money(preview.engineer.commission)} = {money(preview.engineer.net)}
              </td>
            </tr>
          ) : null}
          <tr>
            <th scope="row" className="py-1 pr-4 font-medium">Platform commission</th>
            <td>{money(preview.commissionMinor)}</td>
          </tr>
        </tbody>
      </table>
      <p className="text-sm text-ink-muted">
        The money moves through the payment processor as soon as you confirm. Both sides get this decision and your reasons by notification and mail.
      </p>
      <div className="flex flex-wrap gap-3">
        <Button onClick={onConfirm} busy={busy} busyLabel="Settling">
          Confirm and settle
        </Button>
        <Button variant="secondary" onClick={onBack} disabled={busy}>
          Change the decision
        </Button>
      </div>
    </Card>
  );
}

/** Release all, refund all, or split by percentage or amount; a confirmation step shows the exact amounts first. */
export function SettlementForm({ disputeId, currency, heldMinor }: { disputeId: string; currency: string; heldMinor: number }) {
  const previewMutation = usePreviewSettlement(disputeId);
  const settle = useSettleDispute(disputeId);
  const [pending, setPending] = useState<{ input: SettleDisputeInput; preview: SettlementPreview } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [resolver] = useState(() => schemaResolver<Values, typeof settleDisputeInputSchema>(settleDisputeInputSchema, converter(currency), fieldOf));
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors },
  } = useForm<Values, unknown, SettleDisputeInput>({ resolver, defaultValues: { outcome: 'split', splitBy: 'percent', percent: '', amount: '', note: '' } });
  const outcome = watch('outcome');
  const splitBy = watch('splitBy');

  function showServerError(error: unknown) {
    if (isApiError(error) && Object.keys(error.fields).length > 0) {
      for (const [field, message] of Object.entries(mapServerFields(error.fields, fieldOf))) setError(field as keyof Values, { type: 'server', message });
      return;
    }
    setFormError(error instanceof Error ? error.message : 'Something went wrong. Please try again.');
  }

  const review = handleSubmit(async (input) => {
    setFormError(null);
    try {
      const { note: _note, ...choice } = input;
      const preview = await previewMutation.mutateAsync(choice);
      setPending({ input, preview });
    } catch (error) {
      showServerError(error);
    }
  });

  async function confirm() {
    if (!pending) return;
    setFormError(null);
    try {
      await settle.mutateAsync({ ...pending.input, expectedHeldMinor: pending.preview.heldMinor });
      setPending(null);
    } catch (error) {
      setPending(null);
      showServerError(error);
    }
  }

  if (pending) return <Confirmation preview={pending.preview} busy={settle.isPending} onConfirm={() => void confirm()} onBack={() => setPending(null)} />;

  return (
    <form onSubmit={(e) => void review(e)} noValidate className="space-y-4" aria-label="Settle the dispute">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <fieldset>
        <legend className="font-medium">Outcome</legend>
        <p className="text-sm text-ink-muted">Escrow holds {formatMoney(heldMinor, currency)} for this booking.</p>
        <div className="mt-2 flex flex-col gap-2">
          {(['release', 'refund', 'split'] as const).map((o) => (
            <label key={o} className="flex items-center gap-2">
              <input type="radio" value={o} {...register('outcome')} />
              {o === 'release' ? 'Release all to the payees' : o === 'refund' ? 'Refund all to the songwriter (with the service fee)' : 'Split between the two sides'}
            </label>
          ))}
        </div>
      </fieldset>
      {outcome === 'split' ? (
        <fieldset className="space-y-3 rounded-lg border border-line p-4">
          <legend className="px-1 font-medium">Songwriter’s part</legend>
          <div className="flex flex-wrap gap-4">
            <label className="flex items-center gap-2">
              <input type="radio" value="percent" {...register('splitBy')} /> As a percentage
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="amount" {...register('splitBy')} /> As an amount
            </label>
          </div>
          {splitBy === 'percent' ? (
            <TextField label="Percentage back to the songwriter" inputMode="decimal" hint="0 to 100, at most two decimals; the parts are rounded by largest remainder so they add up exactly." error={errors.percent?.message} {...register('percent')} />
          ) : (
            <TextField label={`Amount back to the songwriter (${currency})`} inputMode="decimal" hint={`At most ${fromMinor(heldMinor, currency)}.`} error={errors.amount?.message} {...register('amount')} />
          )}
        </fieldset>
      ) : null}
      <div className="space-y-1.5">
        <label htmlFor="settle-note" className="block font-medium">
          Your reasons
        </label>
        <p id="settle-note-hint" className="text-sm text-ink-muted">
          Both sides receive this in writing with the amounts.
        </p>
        <textarea
          id="settle-note"
          rows={4}
          className={fieldClasses(Boolean(errors.note))}
          aria-invalid={errors.note ? true : undefined}
          aria-describedby={['settle-note-hint', errors.note ? 'settle-note-error' : ''].filter(Boolean).join(' ')}
          {...register('note')}
        />
        <FieldError id="settle-note-error" message={errors.note?.message} />
      </div>
      <Button type="submit" busy={previewMutation.isPending} busyLabel="Working out the amounts">
        Review the amounts
      </Button>
    </form>
  );
}

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { DISPUTE_REASONS, DISPUTE_REASON_LABELS, openDisputeInputSchema, type OpenDisputeInput } from '@shared/schemas/disputes';
import { Alert, Button, FieldError, SelectField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { applyServerErrors } from '@/features/auth/components/server-errors';
import { useOpenDispute } from '../api/open-dispute';

const REASON_OPTIONS = [{ value: '', label: 'Choose a reason' }, ...DISPUTE_REASONS.map((r) => ({ value: r, label: DISPUTE_REASON_LABELS[r] }))];

/** Either party opens a dispute; the booking freezes until an admin settles it. */
export function OpenDisputeForm({ bookingId, onDone }: { bookingId: string; onDone?: () => void }) {
  const mutation = useOpenDispute(bookingId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<OpenDisputeInput>({ resolver: zodResolver(openDisputeInputSchema), defaultValues: { reason: undefined, text: '' } });

  const submit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await mutation.mutateAsync(input);
      onDone?.();
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['reason', 'text']));
    }
  });

  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="space-y-4" aria-label="Open a dispute">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <SelectField label="Reason" options={REASON_OPTIONS} error={errors.reason?.message} {...register('reason')} />
      <div className="space-y-1.5">
        <label htmlFor="dispute-text" className="block font-medium">
          What happened
        </label>
        <p id="dispute-text-hint" className="text-sm text-ink-muted">
          An admin reads this with the agreed terms, your messages and the deliveries. Say what you expected and what you got.
        </p>
        <textarea
          id="dispute-text"
          rows={5}
          className={fieldClasses(Boolean(errors.text))}
          aria-invalid={errors.text ? true : undefined}
          aria-describedby={['dispute-text-hint', errors.text ? 'dispute-text-error' : ''].filter(Boolean).join(' ')}
          {...register('text')}
        />
        <FieldError id="dispute-text-error" message={errors.text?.message} />
      </div>
      <Button type="submit" variant="danger" busy={mutation.isPending} busyLabel="Opening the dispute">
        Open the dispute
      </Button>
    </form>
  );
}

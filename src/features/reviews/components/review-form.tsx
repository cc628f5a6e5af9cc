import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createReviewInputSchema, type CreateReviewInput, type ReviewSubjectRole } from '@shared/schemas/reviews';
import { Alert, Button, FieldError } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { applyServerErrors } from '@/features/auth/components/server-errors';
import { useCreateReview } from '../api/create-review';

type ReviewFormValues = { subjectRole: ReviewSubjectRole; rating: number; text: string };

/** The songwriter rates one person of a paid-out booking: 1–5 stars and a few words. */
export function ReviewForm({ bookingId, subjectRole, subjectName }: { bookingId: string; subjectRole: ReviewSubjectRole; subjectName: string }) {
  const mutation = useCreateReview(bookingId);
  const [formError, setFormError] = useState<string | null>(null);
  const idBase = `review-${subjectRole}`;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ReviewFormValues, unknown, CreateReviewInput>({ resolver: zodResolver(createReviewInputSchema), defaultValues: { subjectRole, text: '' } });

  const submit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await mutation.mutateAsync(input);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['rating', 'text']));
    }
  });

  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="space-y-3" aria-label={`Review ${subjectName}`}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <fieldset aria-describedby={errors.rating ? `${idBase}-rating-error` : undefined}>
        <legend className="font-medium">
          Rate {subjectName} ({subjectRole})
        </legend>
        <div className="mt-1 flex flex-wrap gap-3">
          {[1, 2, 3, 4, 5].map((n) => (
            <label key={n} className="flex items-center gap-1.5">
              <input type="radio" value={n} {...register('rating', { valueAsNumber: true })} />
              {n} {n === 1 ? 'star' : 'stars'}
            </label>
          ))}
        </div>
        <FieldError id={`${idBase}-rating-error`} message={errors.rating?.message} />
      </fieldset>
      <div className="space-y-1.5">
        <label htmlFor={`${idBase}-text`} className="block font-medium">
          Your review
        </label>
        <textarea
          id={`${idBase}-text`}
          rows={3}
          className={fieldClasses(Boolean(errors.text))}
          aria-invalid={errors.text ? true : undefined}
          aria-describedby={errors.text ? `${idBase}-text-error` : undefined}
          {...register('text')}
        />
        <FieldError id={`${idBase}-text-error`} message={errors.text?.message} />
      </div>
      <Button type="submit" busy={mutation.isPending} busyLabel="Sending the review">
        Send the review
      </Button>
    </form>
  );
}

import { forwardRef, useId, type InputHTMLAttributes, type ReactNode } from 'react';
import { cx } from './cx';

type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  hint?: ReactNode;
  /** Shown beside the field and tied to it with aria-describedby / aria-invalid. */
  error?: string;
};

export const fieldClasses = (invalid: boolean) =>
  cx(
    'block w-full rounded-lg border bg-canvas-raised px-3 py-2.5 text-base text-ink placeholder:text-ink-muted',
    invalid ? 'border-danger-700' : 'border-line-strong',
  );

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField(
  { label, hint, error, id, className, type = 'text', ...rest },
  ref,
) {
  const generated = useId();
  const inputId = id ?? generated;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={cx('space-y-1.5', className)}>
      <label htmlFor={inputId} className="block font-medium">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <input
        ref={ref}
        id={inputId}
        type={type}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={fieldClasses(Boolean(error))}
        {...rest}
      />
      <FieldError id={errorId} message={error} />
    </div>
  );
});

export function FieldError({ id, message }: { id?: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm font-medium text-danger-700">
      <svg viewBox="0 0 20 20" className="mt-0.5 size-4 shrink-0" aria-hidden="true">
        <path fill="currentColor" d="M10 2a8 8 0 1 0 0 16 8 8 0 0 0 0-16Zm-.9 4h1.8v5.2H9.1V6Zm0 6.8h1.8v1.8H9.1v-1.8Z" />
      </svg>
      {message}
    </p>
  );
}

import { useId, type InputHTMLAttributes, type ReactNode } from 'react';
import { FieldError } from './text-field';
import { cx } from './cx';

export type CheckboxOption = { value: string; label: string; description?: ReactNode };

type CheckboxGroupProps = {
  legend: string;
  hint?: string;
  error?: string;
  options: ReadonlyArray<CheckboxOption>;
  /** Props for every box, e.g. react-hook-form's register('roles'): one field name, an array of values. */
  inputProps: InputHTMLAttributes<HTMLInputElement>;
  className?: string;
  /** Side by side from small screens up (default), or one under the other in narrow columns. */
  layout?: 'row' | 'stack';
};

export function CheckboxGroup({ legend, hint, error, options, inputProps, className, layout = 'row' }: CheckboxGroupProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset
      className={cx('space-y-2', className)}
      aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
      aria-invalid={error ? true : undefined}
    >
      <legend className="font-medium">{legend}</legend>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <div className={cx('grid gap-2', layout === 'row' && 'sm:grid-cols-3')}>
        {options.map((option) => (
          <label
            key={option.value}
            className={cx(
              'flex cursor-pointer items-start gap-3 rounded-lg border bg-canvas-raised p-3 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50',
              error ? 'border-danger-700' : 'border-line-strong',
            )}
          >
            <input type="checkbox" value={option.value} className="mt-1 size-4 accent-brand-700" {...inputProps} />
            <span>
              <span className="block font-medium">{option.label}</span>
              {option.description ? <span className="block text-sm text-ink-muted">{option.description}</span> : null}
            </span>
          </label>
        ))}
      </div>
      <FieldError id={errorId} message={error} />
    </fieldset>
  );
}

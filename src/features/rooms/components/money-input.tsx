import { useId, useState } from 'react';
import { fromMinor, toMinor } from '@shared/money';
import { FieldError } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';

/** An amount typed in the currency's major unit (450.00) and kept in minor units; unreadable input becomes NaN for the schema to name. */
export function MoneyInput({ label, value, currency, onChange, error }: { label: string; value: number; currency: string; onChange: (minor: number) => void; error?: string }) {
  const id = useId();
  const [text, setText] = useState(() => (Number.isFinite(value) ? fromMinor(value, currency) : ''));
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-medium">
        {label} ({currency})
      </label>
      <input
        id={id}
        inputMode="decimal"
        className={fieldClasses(Boolean(error))}
        value={text}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => {
          setText(e.target.value);
          try {
            onChange(toMinor(e.target.value.trim(), currency));
          } catch {
            onChange(Number.NaN);
          }
        }}
      />
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

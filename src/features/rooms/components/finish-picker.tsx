import { useId } from 'react';
import { listMaterials, MATERIALS, OCTAVE_BANDS_HZ, type BandCoefficients, type MaterialId } from '@shared/acoustics';
import type { RoomInput } from '@shared/schemas/rooms';
import { FieldError } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';

export type Finish = RoomInput['surfaces']['floor'] | { kind: 'open' };
type Coefficients = Extract<RoomInput['surfaces']['floor'], { kind: 'custom' }>['coefficients'];
type FinishErrors = { message?: string; materialId?: { message?: string }; coefficients?: { message?: string } & Record<number, { message?: string } | undefined> } | undefined;

const CUSTOM = '__custom';
const OPEN = '__open';

function selectValue(f: Finish): string {
  if (f.kind === 'open') return OPEN;
  if (f.kind === 'custom') return CUSTOM;
  return f.materialId;
}

/** A surface finish: a material from the handbook table, or six custom coefficients (one per octave band), or open. */
export function FinishPicker({
  label,
  value,
  onChange,
  errors,
  allowOpen = false,
}: {
  label: string;
  value: Finish;
  onChange: (f: Finish) => void;
  errors?: FinishErrors;
  allowOpen?: boolean;
}) {
  const id = useId();
  const errorId = `${id}-error`;
  const pick = (v: string) => {
    if (v === OPEN) return onChange({ kind: 'open' });
    if (v === CUSTOM) {
      // Start from the material picked so far, so custom is a small edit rather than six blanks.
      const from: BandCoefficients = value.kind === 'material' ? MATERIALS[value.materialId].bands : [0.1, 0.1, 0.1, 0.1, 0.1, 0.1];
      return onChange({ kind: 'custom', coefficients: [...from] as Coefficients });
    }
    onChange({ kind: 'material', materialId: v as MaterialId });
  };
  const message = errors?.message ?? errors?.materialId?.message ?? errors?.coefficients?.message;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-medium">
        {label}
      </label>
      <select id={id} className={fieldClasses(Boolean(message))} value={selectValue(value)} onChange={(e) => pick(e.target.value)} aria-describedby={message ? errorId : undefined}>
        {listMaterials().map((m) => (
          <option key={m.id} value={m.id}>
            {m.label}
          </option>
        ))}
        <option value={CUSTOM}>Custom coefficients…</option>
        {allowOpen ? <option value={OPEN}>Open (nothing fills it)</option> : null}
      </select>
      <FieldError id={errorId} message={message} />
      {value.kind === 'custom' ? (
        <fieldset className="grid grid-cols-3 gap-2 sm:grid-cols-6">
          <legend className="sr-only">{label}: absorption coefficient per octave band (0–1)</legend>
          {OCTAVE_BANDS_HZ.map((hz, i) => {
            const bandId = `${id}-band-${hz}`;
            const bandError = errors?.coefficients?.[i]?.message;
            return (
              <div key={hz} className="space-y-1">
                <label htmlFor={bandId} className="block text-sm">
                  {hz >= 1000 ? `${hz / 1000}k` : hz} Hz
                </label>
                <input
                  id={bandId}
                  inputMode="decimal"
                  className={fieldClasses(Boolean(bandError))}
                  defaultValue={String(value.coefficients[i])}
                  aria-invalid={bandError ? true : undefined}
                  aria-describedby={bandError ? `${bandId}-error` : undefined}
                  onChange={(e) => {
                    const next = [...value.coefficients] as number[];
                    next[i] = e.target.value.trim() === '' ? Number.NaN : Number(e.target.value);
                    onChange({ ...value, coefficients: next as Coefficients });
                  }}
                />
                <FieldError id={`${bandId}-error`} message={bandError} />
              </div>
            );
          })}
        </fieldset>
      ) : value.kind === 'material' ? (
        <p className="text-xs text-ink-muted">
          {MATERIALS[value.materialId].bands.join(' / ')} at 125 Hz–4 kHz ({MATERIALS[value.materialId].source})
        </p>
      ) : null}
    </div>
  );
}

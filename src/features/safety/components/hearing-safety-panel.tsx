import { useId, useState } from 'react';
import { formatDuration, NIOSH_REL, OSHA_PEL, permissibleExposure, SAFETY_CAUTIONS, SOUND_LEVEL_PRESETS, soundLevelInputSchema } from '@shared/safety/noise-exposure';
import { Button, Card, FieldError } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';

const DEFAULT_LEVEL = 100;

/**
 * Permissible daily exposure at a sound level under the NIOSH recommendation and the OSHA limit
 * (shared/safety). Shown as a caution: local rules and a qualified professional decide.
 */
export function HearingSafetyPanel() {
  const inputId = useId();
  const errorId = useId();
  const [text, setText] = useState(String(DEFAULT_LEVEL));
  const parsed = soundLevelInputSchema.safeParse({ levelDbA: text.trim() === '' ? Number.NaN : Number(text) });
  const exposure = parsed.success ? permissibleExposure(parsed.data.levelDbA) : null;
  return (
    <Card className="space-y-4">
      <h2 className="text-xl font-bold">Hearing safety</h2>
      <p>{SAFETY_CAUTIONS.drums}</p>
      <div className="space-y-1.5">
        <label htmlFor={inputId} className="block font-medium">
          Sound level (dBA)
        </label>
        <div className="flex flex-wrap items-center gap-2">
          <input
            id={inputId}
            inputMode="decimal"
            className={`${fieldClasses(!parsed.success)} max-w-[8rem]`}
            value={text}
            onChange={(e) => setText(e.target.value)}
            aria-invalid={!parsed.success || undefined}
            aria-describedby={!parsed.success ? errorId : undefined}
          />
          {SOUND_LEVEL_PRESETS.map((p) => (
            <Button key={p.levelDbA} variant="secondary" size="sm" onClick={() => setText(String(p.levelDbA))} aria-label={`${p.levelDbA} dBA: ${p.label}`}>
              {p.levelDbA} dBA · {p.label}
            </Button>
          ))}
        </div>
        <FieldError id={errorId} message={parsed.success ? undefined : parsed.error.issues[0]?.message} />
      </div>
      {exposure ? (
        <dl className="grid gap-3 sm:grid-cols-2" aria-live="polite">
          <div className="rounded-lg bg-canvas-sunken p-3">
            <dt className="text-sm text-ink-muted">
              NIOSH recommendation ({NIOSH_REL.criterionDbA} dBA for 8 h, {NIOSH_REL.exchangeDb} dB exchange; {NIOSH_REL.source})
            </dt>
            <dd className="text-2xl font-bold">{formatDuration(exposure.nioshMinutes)} a day</dd>
          </div>
          <div className="rounded-lg bg-canvas-sunken p-3">
            <dt className="text-sm text-ink-muted">
              OSHA limit ({OSHA_PEL.criterionDbA} dBA for 8 h, {OSHA_PEL.exchangeDb} dB exchange; {OSHA_PEL.source})
            </dt>
            <dd className="text-2xl font-bold">{formatDuration(exposure.oshaMinutes)} a day</dd>
          </div>
        </dl>
      ) : null}
      <p>{SAFETY_CAUTIONS.protection}</p>
      <p className="text-sm text-ink-muted">{SAFETY_CAUTIONS.authority}</p>
    </Card>
  );
}

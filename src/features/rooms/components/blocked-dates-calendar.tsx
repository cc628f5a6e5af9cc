import { useMemo, useState } from 'react';
import { todayIn } from '@shared/schemas/briefs';
import { Alert, Button } from '@/components/ui';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

function monthDays(year: number, month: number): { date: string; day: number }[] {
  const count = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  return Array.from({ length: count }, (_, i) => ({ date: new Date(Date.UTC(year, month, i + 1)).toISOString().slice(0, 10), day: i + 1 }));
}

/**
 * A month at a time; the engineer toggles dates (in the room's time zone) and saves the whole set.
 * Read-only for everyone else, where blocked days simply show as unavailable.
 */
export function BlockedDatesCalendar({
  timeZone,
  blocked,
  editable,
  onSave,
  saving,
  error,
}: {
  timeZone: string;
  blocked: string[];
  editable: boolean;
  onSave?: (dates: string[]) => void;
  saving?: boolean;
  error?: string | null;
}) {
  const today = todayIn(timeZone);
  const [cursor, setCursor] = useState(() => ({ y: Number(today.slice(0, 4)), m: Number(today.slice(5, 7)) - 1 }));
  const [draft, setDraft] = useState<Set<string>>(() => new Set(blocked));
  const selected = editable ? draft : new Set(blocked);
  const days = useMemo(() => monthDays(cursor.y, cursor.m), [cursor]);
  const lead = (new Date(Date.UTC(cursor.y, cursor.m, 1)).getUTCDay() + 6) % 7;
  const title = new Date(Date.UTC(cursor.y, cursor.m, 1)).toLocaleDateString('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
  const shift = (delta: number) => setCursor((c) => ({ y: c.y + Math.floor((c.m + delta) / 12), m: (((c.m + delta) % 12) + 12) % 12 }));
  const toggle = (date: string) =>
    setDraft((d) => {
      const next = new Set(d);
      if (next.has(date)) next.delete(date);
      else next.add(date);
      return next;
    });
  return (
    <div className="space-y-3">
      <div className="flex items-center justify-between">
        <Button variant="ghost" size="sm" onClick={() => shift(-1)}>
          Previous month
        </Button>
        <p className="font-bold" aria-live="polite">
          {title}
        </p>
        <Button variant="ghost" size="sm" onClick={() => shift(1)}>
          Next month
        </Button>
      </div>
      <div className="grid grid-cols-7 gap-1 text-center text-sm" role="group" aria-label={`Blocked dates, ${title}`}>
        {WEEKDAYS.map((w) => (
          <span key={w} className="font-medium text-ink-muted" aria-hidden="true">
            {w}
          </span>
        ))}
        {Array.from({ length: lead }, (_, i) => (
          <span key={`lead-${i}`} aria-hidden="true" />
        ))}
        {days.map(({ date, day }) => {
          const isBlocked = selected.has(date);
          const past = date < today;
          const label = `${date}${isBlocked ? ', blocked' : ', free'}`;
          const classes = `rounded-md py-1.5 ${isBlocked ? 'bg-ink text-white' : 'bg-canvas-sunken'} ${past ? 'opacity-50' : ''}`;
          return editable ? (
            <button key={date} type="button" className={classes} aria-pressed={isBlocked} aria-label={label} disabled={past} onClick={() => toggle(date)}>
              {day}
            </button>
          ) : (
            <span key={date} className={classes} aria-label={label} role="img">
              {day}
            </span>
          );
        })}
      </div>
      {editable ? (
        <div className="space-y-2">
          {error ? <Alert tone="error">{error}</Alert> : null}
          <Button size="sm" busy={saving} busyLabel="Saving" onClick={() => onSave?.([...draft].sort())}>
            Save blocked dates
          </Button>
        </div>
      ) : (
        <p className="text-sm text-ink-muted">Dark days are blocked (dates in {timeZone.replace(/_/g, ' ')}).</p>
      )}
    </div>
  );
}

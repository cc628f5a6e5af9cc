import { useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { Controller, useFieldArray, useForm, type Path, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  channelWarnings,
  guidanceFor,
  listSources,
  listTemplates,
  MIC_TYPE_LABELS,
  MIC_TYPES,
  packagePairs,
  POLAR_PATTERN_LABELS,
  POLAR_PATTERNS,
  SOURCES,
  type TemplateId,
} from '@shared/mic-package';
import { micPackageInputSchemaForRoom, type MicChannelInput, type MicPackageInput } from '@shared/schemas/mic-packages';
import { Alert, Button, Card, FieldError, SelectField, TextField } from '@/components/ui';
import { MoneyInput } from '@/features/rooms/components/money-input';
import { GeneralCautions } from '@/features/safety/components/general-cautions';
import { isApiError } from '@/lib/api-client';
import { moveChannel, newChannel, templateChannels } from './channel-defaults';
import { PackageCalculators } from './package-calculators';
import { PackagePairs } from './package-pairs';

const SOURCE_OPTIONS = listSources().map((s) => ({ value: s.id, label: s.label }));
const MIC_OPTIONS = MIC_TYPES.map((m) => ({ value: m, label: MIC_TYPE_LABELS[m] }));
const PATTERN_OPTIONS = POLAR_PATTERNS.map((p) => ({ value: p, label: POLAR_PATTERN_LABELS[p] }));
const distanceValue = { setValueAs: (v: unknown) => (v === '' || v === null ? null : Number(v)) };

type Room = { id: string; name: string; inputs: number; currency: string };

/** Placement guidance beside a channel: its own entry (the general one is shown once for the whole list). */
function ChannelGuidance({ channel }: { channel: MicChannelInput }) {
  const own = guidanceFor(channel.source).filter((g) => g.id !== 'general');
  const hints = channelWarnings(channel);
  if (own.length === 0 && hints.length === 0) return null;
  return (
    <div className="space-y-2 text-sm">
      {own.map((g) => (
        <details key={g.id} className="rounded-lg bg-brand-50 px-3 py-2">
          <summary className="cursor-pointer font-medium text-brand-900">
            Placement: {g.title} ({g.basis})
          </summary>
          <ul className="mt-1 list-disc pl-5">
            {g.points.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </details>
      ))}
      {hints.map((h) => (
        <p key={h.code} className="rounded-lg border border-accent-400 bg-accent-100 px-3 py-2">
          {h.message} <span className="text-ink-muted">({h.basis})</span>
        </p>
      ))}
    </div>
  );
}

/**
 * The input-list editor: templates to start from, one row per channel with its guidance, reordering by
 * pointer (drag the handle) or by keys (Alt+Arrow Up/Down on a focused row, announced), and calculators
 * beside the list. The room's input count is part of the schema, so "too many channels" is a field error.
 */
export function PackageEditor({ room, initial, submitLabel, onSubmit }: { room: Room; initial: MicPackageInput; submitLabel: string; onSubmit: (input: MicPackageInput) => Promise<unknown> }) {
  const schema = useMemo(() => micPackageInputSchemaForRoom({ inputs: room.inputs }), [room.inputs]);
  // The form always holds every field (defaults are filled in), so the schema's input and output types agree here.
  const resolver = useMemo(() => zodResolver(schema) as unknown as Resolver<MicPackageInput>, [schema]);
  const form = useForm<MicPackageInput>({ resolver, defaultValues: initial, mode: 'onChange' });
  const { register, control, handleSubmit, watch, setError, trigger, formState } = form;
  const channels = useFieldArray({ control, name: 'channels' });
  const values = watch('channels');
  const currency = watch('currency');
  const [announcement, setAnnouncement] = useState('');
  const [formError, setFormError] = useState<string | null>(null);
  const [dragFrom, setDragFrom] = useState<number | null>(null);
  const [dragOver, setDragOver] = useState<number | null>(null);
  const rowRefs = useRef<(HTMLLIElement | null)[]>([]);
  const e = formState.errors;
  const listError = e.channels?.message ?? e.channels?.root?.message;

  function reorder(from: number, to: number, focus: boolean) {
    if (to < 0 || to >= values.length || from === to) return;
    const label = SOURCES[values[from].source].label;
    channels.replace(moveChannel(values, from, to));
    void trigger('channels');
    setAnnouncement(`${label} moved to position ${to + 1} of ${values.length}.`);
    if (focus) requestAnimationFrame(() => rowRefs.current[to]?.focus());
  }

  function onRowKey(ev: KeyboardEvent<HTMLLIElement>, index: number) {
    if (ev.target !== ev.currentTarget || !ev.altKey) return;
    if (ev.key === 'ArrowUp') {
      ev.preventDefault();
      reorder(index, index - 1, true);
    } else if (ev.key === 'ArrowDown') {
      ev.preventDefault();
      reorder(index, index + 1, true);
    }
  }

  // Pointer drag: the handle captures the pointer; the row under it is found by hit-testing, so mouse,
  // pen and touch all work the same way.
  const rowAt = (x: number, y: number) => {
    const row = document.elementFromPoint(x, y)?.closest('[data-channel-index]');
    return row ? Number(row.getAttribute('data-channel-index')) : null;
  };
  const onHandleDown = (ev: PointerEvent<HTMLButtonElement>, index: number) => {
    ev.currentTarget.setPointerCapture(ev.pointerId);
    setDragFrom(index);
    setDragOver(index);
  };
  const onHandleMove = (ev: PointerEvent<HTMLButtonElement>) => {
    if (dragFrom === null) return;
    const over = rowAt(ev.clientX, ev.clientY);
    if (over !== null) setDragOver(over);
  };
  const onHandleUp = () => {
    if (dragFrom !== null && dragOver !== null) reorder(dragFrom, dragOver, false);
    setDragFrom(null);
    setDragOver(null);
  };

  function applyTemplate(id: TemplateId) {
    channels.replace(templateChannels(id));
    void trigger('channels');
    setAnnouncement(`Started from the ${id.replace('_', ' ').replace('_channel', '')}-channel template.`);
  }

  const submit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await onSubmit(input);
    } catch (error) {
      if (isApiError(error)) for (const [path, message] of Object.entries(error.fields)) setError(path as Path<MicPackageInput>, { type: 'server', message });
      setFormError(error instanceof Error ? error.message : 'The package could not be saved');
    }
  });

  return (
    <form onSubmit={(ev) => void submit(ev)} noValidate className="space-y-6">
      <p aria-live="polite" className="sr-only" data-testid="reorder-announcement">
        {announcement}
      </p>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <Card className="grid gap-4 sm:grid-cols-3">
        <TextField label="Package name" {...register('name')} error={e.name?.message} className="sm:col-span-2" />
        <Controller
          control={control}
          name="priceMinor"
          render={({ field }) => <MoneyInput label="Price" currency={currency} value={field.value} onChange={field.onChange} error={e.priceMinor?.message} />}
        />
      </Card>

      <Card className="space-y-3">
        <h2 className="text-xl font-bold">Start from a template</h2>
        <div className="flex flex-wrap gap-2">
          {listTemplates().map((t) => (
            <Button key={t.id} variant="secondary" size="sm" onClick={() => applyTemplate(t.id)} title={t.description}>
              {t.label}
            </Button>
          ))}
        </div>
        <p className="text-sm text-ink-muted">The room has {room.inputs} inputs. Templates follow common practice for a rock or pop kit; edit every channel to fit.</p>
      </Card>

      <div className="grid gap-6 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <section aria-labelledby="channels-heading" className="space-y-3">
          <h2 id="channels-heading" className="text-xl font-bold">
            Input list ({values.length} channels)
          </h2>
          <p className="text-sm text-ink-muted">Reorder by dragging a row’s handle, or focus a row and press Alt+Arrow Up or Alt+Arrow Down.</p>
          {listError ? (
            <p role="alert" className="rounded-lg border border-danger-700/40 bg-danger-50 px-3 py-2 font-medium text-danger-800" data-testid="channels-error">
              {listError}
            </p>
          ) : null}
          <ol className="space-y-3">
            {channels.fields.map((field, i) => {
              const ch = values[i] ?? field;
              const ce = e.channels?.[i];
              return (
                <li
                  key={field.id}
                  ref={(el) => {
                    rowRefs.current[i] = el;
                  }}
                  data-channel-index={i}
                  tabIndex={0}
                  aria-label={`Channel ${ch.number}: ${SOURCES[ch.source]?.label ?? ch.source}. Alt+Arrow keys move it.`}
                  onKeyDown={(ev) => onRowKey(ev, i)}
                  className={`rounded-2xl border bg-canvas-raised p-4 focus:outline-none focus-visible:ring-2 focus-visible:ring-brand-700 ${dragOver === i && dragFrom !== null ? 'border-brand-700' : 'border-line'}`}
                >
                  <div className="flex items-start gap-3">
                    <button
                      type="button"
                      className="mt-7 cursor-grab touch-none rounded p-1 text-ink-muted hover:bg-canvas-sunken"
                      aria-label={`Drag to move channel ${ch.number}`}
                      onPointerDown={(ev) => onHandleDown(ev, i)}
                      onPointerMove={onHandleMove}
                      onPointerUp={onHandleUp}
                      onPointerCancel={() => {
                        setDragFrom(null);
                        setDragOver(null);
                      }}
                    >
                      <svg viewBox="0 0 20 20" className="size-5" aria-hidden="true">
                        <path fill="currentColor" d="M7 4h2v2H7zm4 0h2v2h-2zM7 9h2v2H7zm4 0h2v2h-2zm-4 5h2v2H7zm4 0h2v2h-2z" />
                      </svg>
                    </button>
                    <div className="grid flex-1 gap-3 sm:grid-cols-4">
                      <TextField label="Channel" type="number" {...register(`channels.${i}.number`, { valueAsNumber: true })} error={ce?.number?.message} />
                      <SelectField label="Source" options={SOURCE_OPTIONS} {...register(`channels.${i}.source`)} error={ce?.source?.message} />
                      <SelectField label="Mic type" options={MIC_OPTIONS} {...register(`channels.${i}.micType`)} error={ce?.micType?.message} />
                      <SelectField label="Pattern" options={PATTERN_OPTIONS} {...register(`channels.${i}.pattern`)} error={ce?.pattern?.message} />
                      <TextField label="Distance (cm)" inputMode="decimal" {...register(`channels.${i}.distanceCm`, distanceValue)} error={ce?.distanceCm?.message} />
                      <TextField label="Aim" {...register(`channels.${i}.aim`)} error={ce?.aim?.message} className="sm:col-span-3" />
                      <TextField label="Model (your own name for it)" {...register(`channels.${i}.model`)} error={ce?.model?.message} className="sm:col-span-2" />
                      <TextField label="Note" {...register(`channels.${i}.note`)} error={ce?.note?.message} className="sm:col-span-2" />
                      <div className="flex flex-wrap gap-4 sm:col-span-4">
                        <label className="inline-flex items-center gap-2">
                          <input type="checkbox" {...register(`channels.${i}.lowCut`)} /> Low-cut
                        </label>
                        <label className="inline-flex items-center gap-2">
                          <input type="checkbox" {...register(`channels.${i}.polarityInvert`)} /> Polarity invert
                        </label>
                        <Button variant="ghost" size="sm" onClick={() => channels.remove(i)}>
                          Remove channel {ch.number}
                        </Button>
                      </div>
                      <div className="sm:col-span-4">
                        <ChannelGuidance channel={ch} />
                      </div>
                    </div>
                  </div>
                </li>
              );
            })}
          </ol>
          <FieldError message={values.length === 0 ? 'Add at least one channel' : undefined} />
          <Button variant="secondary" size="sm" onClick={() => channels.append(newChannel('other', values.length + 1))}>
            Add a channel
          </Button>
        </section>

        <aside aria-label="Calculators and checks" className="space-y-4">
          <PackageCalculators channels={values} />
          <Card className="space-y-2">
            <h3 className="text-lg font-bold">Pairs the delivery check will compare</h3>
            <PackagePairs pairs={packagePairs(values)} />
          </Card>
          <GeneralCautions />
        </aside>
      </div>

      <Button type="submit" busy={formState.isSubmitting} busyLabel="Saving">
        {submitLabel}
      </Button>
      <p className="text-sm text-ink-muted">Saved to {room.name}.</p>
    </form>
  );
}

export function emptyPackage(room: Room): MicPackageInput {
  return { name: '', priceMinor: Number.NaN, currency: room.currency, channels: templateChannels('eight_channel') };
}


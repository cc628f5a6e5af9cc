import { useState } from 'react';
import { Controller, useFieldArray, useForm, type FieldErrors, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { computeAcoustics, READING_LABELS, SURFACE_IDS, SURFACE_LABELS, validateRoomGeometry } from '@shared/acoustics';
import { SUPPORTED_CURRENCIES } from '@shared/money';
import { roomInputSchema, toRoomGeometry, type RoomInput } from '@shared/schemas/rooms';
import { Alert, Button, Card, SelectField, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { timeZoneOptions } from '@/features/auth/components/time-zones';
import { isApiError } from '@/lib/api-client';
import { FinishPicker, type Finish } from './finish-picker';
import { MoneyInput } from './money-input';

const block = { kind: 'material', materialId: 'painted_block_wall' } as const;

export function emptyRoom(timeZone: string): RoomInput {
  return {
    name: '',
    town: '',
    timeZone,
    description: '',
    dayRateMinor: Number.NaN,
    halfDayRateMinor: Number.NaN,
    currency: 'USD',
    inputs: 16,
    dimensions: { unit: 'm', length: 6, width: 5, height: 3 },
    surfaces: {
      floor: { kind: 'material', materialId: 'wood_floor' },
      ceiling: { kind: 'material', materialId: 'gypsum_board_on_studs' },
      frontWall: block,
      backWall: block,
      leftWall: block,
      rightWall: block,
    },
    panels: [],
    openings: [],
  };
}

const SURFACE_OPTIONS = SURFACE_IDS.map((s) => ({ value: s, label: SURFACE_LABELS[s][0].toUpperCase() + SURFACE_LABELS[s].slice(1) }));
const num = { valueAsNumber: true } as const;
const fibre = { kind: 'material', materialId: 'glass_fibre_board_50mm' } as const;

/** The message react-hook-form keeps at a dotted path of the nested errors. */
function errorAt(errors: FieldErrors<RoomInput>, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[key];
  return (node as { message?: string } | undefined)?.message;
}

/** A live first look while typing, from the same pure module the server uses; shown once the geometry is usable. */
function LiveEstimate({ values }: { values: RoomInput }) {
  const geometry = toRoomGeometry(values);
  if (validateRoomGeometry(geometry).length > 0) return <p className="text-sm text-ink-muted">The estimate appears once the size and surfaces are complete.</p>;
  const a = computeAcoustics(geometry);
  return (
    <p aria-live="polite" className="text-sm">
      Estimate so far: mid-band RT60 {a.midBandRt60Sec.toFixed(2)} s ({a.recommended === 'eyring' ? 'Eyring' : 'Sabine'}), reads {READING_LABELS[a.reading]} for drums. The plots are on the room page after saving.
    </p>
  );
}

/** The engineer's room: details, rates, size and surfaces. The shared schema checks it here and on the server. */
export function RoomForm({ initial, submitLabel, onSubmit }: { initial: RoomInput; submitLabel: string; onSubmit: (input: RoomInput) => Promise<unknown> }) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<RoomInput>({ resolver: zodResolver(roomInputSchema), defaultValues: initial, mode: 'onTouched' });
  const { register, control, handleSubmit, watch, setError, formState } = form;
  const panels = useFieldArray({ control, name: 'panels' });
  const openings = useFieldArray({ control, name: 'openings' });
  const currency = watch('currency');
  const unit = watch('dimensions.unit');
  const e = formState.errors;

  const submit = handleSubmit(async (input) => {
    setFormError(null);
    try {
      await onSubmit(input);
    } catch (error) {
      if (isApiError(error) && Object.keys(error.fields).length > 0) {
        for (const [path, message] of Object.entries(error.fields)) setError(path as Path<RoomInput>, { type: 'server', message });
      }
      setFormError(error instanceof Error ? error.message : 'The room could not be saved');
    }
  });

  return (
    <form onSubmit={(ev) => void submit(ev)} noValidate className="space-y-6">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <Card className="grid gap-4 sm:grid-cols-2">
        <h2 className="text-xl font-bold sm:col-span-2">The room</h2>
        <TextField label="Name" {...register('name')} error={e.name?.message} />
        <TextField label="Town" {...register('town')} error={e.town?.message} />
        <SelectField label="Time zone" options={timeZoneOptions(initial.timeZone)} {...register('timeZone')} error={e.timeZone?.message} />
        <TextField label="Inputs (preamps)" type="number" min={1} {...register('inputs', num)} error={e.inputs?.message} hint="A mic package cannot use more channels than this." />
        <div className="space-y-1.5 sm:col-span-2">
          <label htmlFor="room-description" className="block font-medium">
            Description
          </label>
          <textarea id="room-description" rows={3} className={fieldClasses(Boolean(e.description))} {...register('description')} />
        </div>
      </Card>

      <Card className="grid gap-4 sm:grid-cols-3">
        <h2 className="text-xl font-bold sm:col-span-3">Rates</h2>
        <SelectField label="Currency" options={SUPPORTED_CURRENCIES.map((c) => ({ value: c, label: c }))} {...register('currency')} error={e.currency?.message} />
        <Controller
          control={control}
          name="dayRateMinor"
          render={({ field }) => <MoneyInput key={currency} label="Day rate" currency={currency} value={field.value} onChange={field.onChange} error={e.dayRateMinor?.message} />}
        />
        <Controller
          control={control}
          name="halfDayRateMinor"
          render={({ field }) => <MoneyInput key={currency} label="Half-day rate" currency={currency} value={field.value} onChange={field.onChange} error={e.halfDayRateMinor?.message} />}
        />
      </Card>

      <Card className="space-y-4">
        <h2 className="text-xl font-bold">Size</h2>
        <fieldset className="flex gap-4">
          <legend className="mb-1 font-medium">Unit</legend>
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="m" {...register('dimensions.unit')} /> metres
          </label>
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="ft" {...register('dimensions.unit')} /> feet (converted to metres for the estimate)
          </label>
        </fieldset>
        <div className="grid gap-4 sm:grid-cols-3">
          <TextField label={`Length (${unit})`} inputMode="decimal" {...register('dimensions.length', num)} error={errorAt(e, 'dimensions.length')} />
          <TextField label={`Width (${unit})`} inputMode="decimal" {...register('dimensions.width', num)} error={errorAt(e, 'dimensions.width')} />
          <TextField label={`Height (${unit})`} inputMode="decimal" {...register('dimensions.height', num)} error={errorAt(e, 'dimensions.height')} />
        </div>
      </Card>

      <Card className="space-y-4">
        <h2 className="text-xl font-bold">Surfaces</h2>
        <p className="text-sm text-ink-muted">Absorption coefficients per octave band, 0 (reflects everything) to 1 (absorbs everything).</p>
        {errorAt(e, 'surfaces') ? <Alert tone="error">{errorAt(e, 'surfaces')}</Alert> : null}
        <div className="grid gap-4 sm:grid-cols-2">
          {SURFACE_IDS.map((s) => (
            <Controller
              key={s}
              control={control}
              name={`surfaces.${s}`}
              render={({ field }) => (
                <FinishPicker label={SURFACE_OPTIONS.find((o) => o.value === s)!.label} value={field.value} onChange={(f) => field.onChange(f)} errors={e.surfaces?.[s] as never} />
              )}
            />
          ))}
        </div>
      </Card>

      <Card className="space-y-4">
        <h2 className="text-xl font-bold">Treatment panels</h2>
        {panels.fields.length === 0 ? <p className="text-ink-muted">No panels yet.</p> : null}
        {panels.fields.map((p, i) => (
          <fieldset key={p.id} className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-[1fr_1fr_2fr_auto] sm:items-start">
            <legend className="px-1 text-sm font-medium">Panel {i + 1}</legend>
            <SelectField label="On" options={SURFACE_OPTIONS} {...register(`panels.${i}.surface`)} />
            <TextField label="Area (m²)" inputMode="decimal" {...register(`panels.${i}.areaM2`, num)} error={errorAt(e, `panels.${i}.areaM2`)} />
            <Controller
              control={control}
              name={`panels.${i}.finish`}
              render={({ field }) => <FinishPicker label="Material" value={field.value} onChange={(f) => field.onChange(f)} errors={e.panels?.[i]?.finish as never} />}
            />
            <Button variant="ghost" size="sm" className="sm:mt-8" onClick={() => panels.remove(i)}>
              Remove panel {i + 1}
            </Button>
          </fieldset>
        ))}
        <Button variant="secondary" size="sm" onClick={() => panels.append({ surface: 'leftWall', areaM2: 2, finish: fibre })}>
          Add a panel
        </Button>
      </Card>

      <Card className="space-y-4">
        <h2 className="text-xl font-bold">Doors and windows</h2>
        {openings.fields.length === 0 ? <p className="text-ink-muted">No openings yet.</p> : null}
        {openings.fields.map((o, i) => (
          <fieldset key={o.id} className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-[1fr_1fr_1fr_2fr_auto] sm:items-start">
            <legend className="px-1 text-sm font-medium">Opening {i + 1}</legend>
            <SelectField label="Type" options={[{ value: 'door', label: 'Door' }, { value: 'window', label: 'Window' }]} {...register(`openings.${i}.type`)} />
            <SelectField label="On" options={SURFACE_OPTIONS} {...register(`openings.${i}.surface`)} />
            <TextField label="Area (m²)" inputMode="decimal" {...register(`openings.${i}.areaM2`, num)} error={errorAt(e, `openings.${i}.areaM2`)} />
            <Controller
              control={control}
              name={`openings.${i}.finish`}
              render={({ field }) => <FinishPicker label="Finish" allowOpen value={field.value as Finish} onChange={(f) => field.onChange(f)} errors={e.openings?.[i]?.finish as never} />}
            />
            <Button variant="ghost" size="sm" className="sm:mt-8" onClick={() => openings.remove(i)}>
              Remove opening {i + 1}
            </Button>
          </fieldset>
        ))}
        <Button variant="secondary" size="sm" onClick={() => openings.append({ type: 'door', surface: 'backWall', areaM2: 1.8, finish: { kind: 'material', materialId: 'plywood_panel_10mm' } })}>
          Add a door or window
        </Button>
      </Card>

      <LiveEstimate values={watch()} />
      <Button type="submit" busy={formState.isSubmitting} busyLabel="Saving">
        {submitLabel}
      </Button>
    </form>
  );
}

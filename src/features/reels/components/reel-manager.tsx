import { useRef, useState, type FormEvent } from 'react';
import { DRUM_STYLES, styleLabel, type ReelTrackSummary } from '@shared/schemas/profiles';
import { REEL_ACCEPT, REEL_MAX_BYTES, REEL_MAX_TRACKS, reelTrackFieldsInputSchema } from '@shared/schemas/reels';
import { Alert, Button, Card, EmptyState, FieldError, SelectField, TextField } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { useUploadReelTrack } from '../api/upload-reel-track';
import { useDeleteReelTrack } from '../api/delete-reel-track';
import { useReorderReelTracks } from '../api/reorder-reel-tracks';

const MB = 1024 * 1024;

function ReelUpload({ full }: { full: boolean }) {
  const upload = useUploadReelTrack();
  const fileRef = useRef<HTMLInputElement>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);

  const onSubmit = async (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    setDone(null);
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    const file = fileRef.current?.files?.[0];
    const fields = reelTrackFieldsInputSchema.safeParse({ title: form.get('title'), style: form.get('style'), tempo: form.get('tempo') });
    const next: Record<string, string> = {};
    if (!file) next.file = 'Choose a WAV or MP3 file';
    else if (file.size > REEL_MAX_BYTES) next.file = `That file is ${(file.size / MB).toFixed(1)} MB; the limit is ${REEL_MAX_BYTES / MB} MB`;
    if (!fields.success) for (const issue of fields.error.issues) next[String(issue.path[0])] ??= issue.message;
    setErrors(next);
    if (Object.keys(next).length || !file || !fields.success) return;
    try {
      const track = await upload.mutateAsync({ file, fields: fields.data });
      setDone(`“${track.title}” is on your reel.`);
      formEl.reset();
    } catch (err) {
      if (isApiError(err) && Object.keys(err.fields).length) setErrors(err.fields);
      else setErrors({ form: err instanceof Error ? err.message : 'The upload failed.' });
    }
  };

  if (full) return <Alert tone="info">Your reel holds {REEL_MAX_TRACKS} tracks, the most it can. Delete one to add another.</Alert>;
  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate className="space-y-4" aria-label="Add a reel track">
      <h3 className="text-lg font-bold">Add a track</h3>
      {errors.form ? <Alert tone="error">{errors.form}</Alert> : null}
      <div className="space-y-1.5">
        <label htmlFor="reel-file" className="block font-medium">
          Audio file
        </label>
        <p id="reel-file-hint" className="text-sm text-ink-muted">
          WAV or MP3, up to {REEL_MAX_BYTES / MB} MB. Each track gets a waveform.
        </p>
        <input ref={fileRef} id="reel-file" name="file" type="file" accept={REEL_ACCEPT} aria-describedby="reel-file-hint" aria-invalid={errors.file ? true : undefined} className={fieldClasses(Boolean(errors.file))} />
        <FieldError message={errors.file} />
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Title" name="title" error={errors.title} />
        <SelectField label="Style" name="style" defaultValue="" options={[{ value: '', label: 'No style' }, ...DRUM_STYLES.map((s) => ({ value: s, label: styleLabel(s) }))]} error={errors.style} />
        <TextField label="Tempo (BPM)" name="tempo" inputMode="numeric" error={errors.tempo} />
      </div>
      {upload.isPending ? (
        <div className="space-y-1">
          <label htmlFor="reel-progress" className="text-sm">
            Uploading… {Math.round(upload.progress * 100)} %
          </label>
          <progress id="reel-progress" max={1} value={upload.progress} className="w-full" />
        </div>
      ) : null}
      <div className="flex items-center gap-3">
        <Button type="submit" busy={upload.isPending} busyLabel="Uploading…">
          Upload track
        </Button>
        {done ? (
          <p role="status" className="text-success-700">
            {done}
          </p>
        ) : null}
      </div>
    </form>
  );
}

/** The owner's reel: order (move up/down), delete, and upload with progress. */
export function ReelManager({ tracks }: { tracks: ReelTrackSummary[] }) {
  const remove = useDeleteReelTrack();
  const reorder = useReorderReelTracks();
  const error = remove.error ?? reorder.error;

  const move = (index: number, by: -1 | 1) => {
    const ids = tracks.map((t) => t.id);
    const [id] = ids.splice(index, 1);
    ids.splice(index + by, 0, id);
    reorder.mutate(ids);
  };

  return (
    <Card className="space-y-5">
      <h2 className="text-xl font-bold">Reel</h2>
      {error ? <Alert tone="error">{error.message}</Alert> : null}
      {tracks.length === 0 ? (
        <EmptyState title="No reel tracks yet">Songwriters decide faster when they can hear you. Add one or two short tracks.</EmptyState>
      ) : (
        <ol className="divide-y divide-line">
          {tracks.map((t, i) => (
            <li key={t.id} className="flex flex-wrap items-center gap-3 py-3">
              <span className="grow font-medium">
                {i + 1}. {t.title}
                <span className="ml-2 text-sm font-normal text-ink-muted">
                  {[t.style ? styleLabel(t.style) : null, t.tempoBpm ? `${t.tempoBpm} BPM` : null, t.hasPeaks ? null : 'no waveform'].filter(Boolean).join(' · ')}
                </span>
              </span>
              <Button variant="ghost" size="sm" disabled={i === 0 || reorder.isPending} onClick={() => move(i, -1)}>
                Move up <span className="sr-only">{t.title}</span>
              </Button>
              <Button variant="ghost" size="sm" disabled={i === tracks.length - 1 || reorder.isPending} onClick={() => move(i, 1)}>
                Move down <span className="sr-only">{t.title}</span>
              </Button>
              <Button variant="danger" size="sm" disabled={remove.isPending} onClick={() => window.confirm(`Delete “${t.title}” from your reel?`) && remove.mutate(t.id)}>
                Delete <span className="sr-only">{t.title}</span>
              </Button>
            </li>
          ))}
        </ol>
      )}
      <ReelUpload full={tracks.length >= REEL_MAX_TRACKS} />
    </Card>
  );
}

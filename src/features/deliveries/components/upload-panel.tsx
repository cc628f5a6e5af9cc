import { useRef, useState, type DragEvent } from 'react';
import { DRUM_PARTS, getPart, isPartId, suggestPart, type PartId } from '@shared/stems/parts';
import { DELIVERY_ACCEPT, type DeliveryFileView, type DeliveryListView, type DeliveryView } from '@shared/schemas/deliveries';
import { Alert, Button, Card, cx } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { useUpdateDeliveryFile } from '../api/delivery-files';
import { useSubmitDelivery } from '../api/delivery-actions';
import { useStemUploads, type UploadState } from '../hooks/use-stem-uploads';
import { formatBytes, formatSpeed } from '../lib/format';

type InputList = DeliveryListView['inputList'];

/** The uploader's side of an open delivery: drop WAVs, watch each file go up, name the parts, submit. */
export function UploadPanel({ delivery, inputList }: { delivery: DeliveryView; inputList: InputList }) {
  const uploads = useStemUploads(delivery.id);
  const [error, setError] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const picker = useRef<HTMLInputElement>(null);
  const submit = useSubmitDelivery(delivery);

  async function addFiles(list: FileList | File[]) {
    setError(null);
    const chosen = [...list];
    if (delivery.files.length + chosen.length > delivery.maxFiles) {
      setError(`A delivery holds at most ${delivery.maxFiles} files.`);
      return;
    }
    for (const file of chosen) {
      if (!/\.(wav|wave|bwf)$/i.test(file.name)) {
        setError(`${file.name} is not a WAV file; only WAV stems are delivered.`);
        continue;
      }
      if (file.size > delivery.maxFileBytes) {
        setError(`${file.name} is larger than ${formatBytes(delivery.maxFileBytes)}.`);
        continue;
      }
      // The same file dropped again after an interruption resumes its own upload.
      const unfinished = delivery.files.find((f) => f.name === file.name && f.status === 'uploading' && f.sizeBytes === file.size && !uploads.states[f.id]);
      try {
        await uploads.add(file, partFor(file.name, inputList, delivery.files), unfinished?.id);
      } catch (e) {
        setError(isApiError(e) ? `${file.name}: ${e.message}` : `${file.name} could not be added.`);
      }
    }
  }

  function onDrop(event: DragEvent) {
    event.preventDefault();
    setDragging(false);
    void addFiles(event.dataTransfer.files);
  }

  return (
    <Card aria-labelledby="upload-title" className="space-y-4">
      <div>
        <h2 id="upload-title" className="text-lg font-bold">
          Stems for v{delivery.number}
        </h2>
        <p className="text-sm text-ink-muted">
          Up to {delivery.maxFiles} WAV files of at most {formatBytes(delivery.maxFileBytes)} each. An interrupted upload continues where it stopped.
        </p>
      </div>
      {inputList.length > 0 ? <ExpectedStems inputList={inputList} files={delivery.files} /> : null}
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={cx('rounded-xl border-2 border-dashed px-4 py-6 text-center', dragging ? 'border-brand-700 bg-brand-50' : 'border-line-strong')}
      >
        <p>Drop WAV stems here, or</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => picker.current?.click()}>
          Choose files
        </Button>
        <input
          ref={picker}
          type="file"
          multiple
          accept={DELIVERY_ACCEPT}
          className="sr-only"
          aria-label="Add WAV stems"
          onChange={(e) => {
            if (e.target.files) void addFiles(e.target.files);
            e.target.value = '';
          }}
        />
      </div>
      {error ? <Alert tone="error">{error}</Alert> : null}
      {delivery.files.length > 0 ? (
        <ul className="divide-y divide-line" aria-label="Files in this delivery">
          {delivery.files.map((f) => (
            <FileRow key={f.id} deliveryId={delivery.id} file={f} upload={uploads.states[f.id]} actions={uploads} />
          ))}
        </ul>
      ) : null}
      <div className="flex flex-wrap items-center gap-3 border-t border-line pt-4">
        <Button onClick={() => submit.mutate()} disabled={!delivery.can.submit} busy={submit.isPending} busyLabel="Submitting…">
          Submit for review
        </Button>
        {delivery.submitBlockedBy ? <span className="text-sm text-ink-muted">{delivery.submitBlockedBy}</span> : null}
        {submit.error ? <Alert tone="error">{submit.error.message}</Alert> : null}
      </div>
    </Card>
  );
}

function partFor(name: string, inputList: InputList, files: DeliveryFileView[]): PartId | null {
  const suggested = suggestPart(name);
  if (suggested) return suggested;
  // Nothing in the name: take the first package channel no file covers yet.
  const taken = new Set(files.map((f) => f.part));
  const free = inputList.find((c) => !taken.has(c.part))?.part;
  return free && isPartId(free) ? free : null;
}

function ExpectedStems({ inputList, files }: { inputList: InputList; files: DeliveryFileView[] }) {
  const parts = new Set(files.map((f) => f.part));
  return (
    <div>
      <h3 className="text-sm font-bold">Expected from the mic package</h3>
      <ul className="mt-1 flex flex-wrap gap-2 text-sm" aria-label="Expected stems">
        {inputList.map((c) => (
          <li key={c.number} className={cx('rounded-full border px-2.5 py-0.5', parts.has(c.part) ? 'border-success-700/40 bg-success-50' : 'border-line')}>
            {c.number}. {c.label}
            {parts.has(c.part) ? ' ✓' : ''}
          </li>
        ))}
      </ul>
    </div>
  );
}

type Actions = ReturnType<typeof useStemUploads>;

function FileRow({ deliveryId, file, upload, actions }: { deliveryId: string; file: DeliveryFileView; upload: UploadState | undefined; actions: Actions }) {
  const update = useUpdateDeliveryFile(deliveryId);
  const selectId = `part-${file.id}`;
  const done = file.status === 'uploaded';
  const sent = done ? file.sizeBytes : (upload?.sent ?? 0);
  const percent = Math.floor((sent / file.sizeBytes) * 100);
  return (
    <li className="grid gap-2 py-3 sm:grid-cols-[1fr_12rem]" data-testid="upload-row" data-file-name={file.name}>
      <div className="min-w-0">
        <p className="truncate font-medium">{file.name}</p>
        <p className="text-sm text-ink-muted">
          {formatBytes(file.sizeBytes)}
          {done ? ` · uploaded · SHA-256 ${file.sha256?.slice(0, 12)}…` : ''}
        </p>
        {!done ? (
          <div className="mt-1">
            <progress className="h-2 w-full" max={100} value={percent} aria-label={`Upload of ${file.name}`}>
              {percent}%
            </progress>
            <p className="flex flex-wrap items-center gap-2 text-sm" aria-live="polite">
              <span data-testid="upload-percent">{percent}%</span>
              <span className="text-ink-muted">{upload ? phaseWords(upload) : 'Interrupted: drop the same file again to continue.'}</span>
              {upload?.phase === 'uploading' ? <span className="text-ink-muted">{formatSpeed(upload.bytesPerSecond)}</span> : null}
            </p>
            {upload?.error ? <p className="text-sm text-danger-800">{upload.error}</p> : null}
            <div className="mt-1 flex gap-2">
              {upload && (upload.phase === 'uploading' || upload.phase === 'starting' || upload.phase === 'retrying') ? (
                <Button size="sm" variant="secondary" onClick={() => actions.pause(file.id)}>
                  Pause {file.name}
                </Button>
              ) : null}
              {upload && (upload.phase === 'paused' || upload.phase === 'failed') && actions.canResume(file.id) ? (
                <Button size="sm" variant="secondary" onClick={() => actions.resume(file.id)}>
                  {upload.phase === 'failed' ? 'Retry' : 'Resume'} {file.name}
                </Button>
              ) : null}
              <Button size="sm" variant="ghost" onClick={() => void actions.cancel(file.id)}>
                Cancel {file.name}
              </Button>
            </div>
          </div>
        ) : null}
      </div>
      <div>
        <label htmlFor={selectId} className="block text-sm font-medium">
          Part
        </label>
        <select
          id={selectId}
          className="mt-1 w-full rounded-lg border border-line-strong bg-canvas-raised px-2 py-1.5"
          value={file.part ?? ''}
          onChange={(e) => update.mutate({ fileId: file.id, part: e.target.value || null })}
        >
          <option value="">Not a drum part</option>
          {DRUM_PARTS.filter((p) => p.id !== 'other').map((p) => (
            <option key={p.id} value={p.id}>
              {p.label}
            </option>
          ))}
          <option value="other">{getPart('other')?.label}</option>
        </select>
        {done ? (
          <Button size="sm" variant="ghost" className="mt-1" onClick={() => void actions.cancel(file.id)}>
            Remove {file.name}
          </Button>
        ) : null}
      </div>
    </li>
  );
}

function phaseWords(u: UploadState): string {
  switch (u.phase) {
    case 'starting':
      return 'Starting…';
    case 'uploading':
      return `${formatBytes(u.sent)} of ${formatBytes(u.total)}`;
    case 'paused':
      return 'Paused';
    case 'retrying':
      return 'Reconnecting…';
    case 'done':
      return 'Uploaded, finishing…';
    case 'failed':
      return 'Stopped';
  }
}

import { useId, useState } from 'react';
import { GUIDE_MAX_BYTES } from '@shared/schemas/briefs';
import { Alert, Button } from '@/components/ui';
import { useUploadGuide } from '../api/upload-guide';

/** Picks and uploads a guide track (WAV or MP3, checked by content on the server) with a progress bar. */
export function GuideUpload({ briefId, hasGuide }: { briefId: string; hasGuide: boolean }) {
  const upload = useUploadGuide(briefId);
  const [file, setFile] = useState<File | null>(null);
  const [localError, setLocalError] = useState<string | null>(null);
  const id = useId();

  const onPick = (picked: File | null) => {
    setLocalError(null);
    upload.reset();
    if (picked && picked.size > GUIDE_MAX_BYTES) {
      setLocalError(`That file is larger than ${Math.round(GUIDE_MAX_BYTES / 1024 / 1024)} MB.`);
      setFile(null);
      return;
    }
    setFile(picked);
  };

  return (
    <div className="space-y-3">
      <label htmlFor={id} className="block font-medium">
        {hasGuide ? 'Replace the guide track' : 'Guide track'}
      </label>
      <p id={`${id}-hint`} className="text-sm text-ink-muted">
        Your demo with a click, as WAV or MP3 (up to {Math.round(GUIDE_MAX_BYTES / 1024 / 1024)} MB). Kitlane draws its waveform once it is uploaded.
      </p>
      <input
        id={id}
        type="file"
        accept=".wav,.mp3,audio/wav,audio/mpeg"
        aria-describedby={`${id}-hint`}
        onChange={(e) => onPick(e.target.files?.[0] ?? null)}
        className="block w-full text-sm file:mr-3 file:rounded-lg file:border file:border-line-strong file:bg-canvas-raised file:px-3 file:py-1.5 file:font-medium"
      />
      {localError ? <Alert tone="error">{localError}</Alert> : null}
      {upload.error ? <Alert tone="error">{upload.error.message}</Alert> : null}
      {upload.isSuccess ? <Alert tone="success">The guide track is uploaded.</Alert> : null}
      {upload.isPending ? (
        <div className="space-y-1">
          <progress max={1} value={upload.progress} className="h-2 w-full accent-brand-700" aria-label="Upload progress" />
          <p className="text-sm text-ink-muted">{Math.round(upload.progress * 100)} % sent{upload.progress >= 1 ? '; drawing the waveform…' : ''}</p>
        </div>
      ) : null}
      <Button variant="secondary" disabled={!file} busy={upload.isPending} busyLabel="Uploading…" onClick={() => file && upload.mutate(file)}>
        Upload guide track
      </Button>
    </div>
  );
}

import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { MESSAGE_ATTACHMENT_ACCEPT, MESSAGE_ATTACHMENT_MAX_BYTES, MESSAGE_BODY_MAX, messageFormSchema, type MessageFormInput } from '@shared/schemas/messages';
import { Alert, Button, FieldError } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { useSendMessage } from '../api/send-message';
import { formatBytes } from './format-when';

const MAX_MB = MESSAGE_ATTACHMENT_MAX_BYTES / 1024 / 1024;

/** Writes into one thread: text (Ctrl/⌘+Enter sends) and an optional small file, with upload progress. */
export function MessageComposer({ threadId, onSent }: { threadId: string; onSent?: () => void }) {
  const send = useSendMessage(threadId);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const ids = { body: useId(), file: useId(), fileHint: useId() };
  const form = useForm<MessageFormInput>({ resolver: zodResolver(messageFormSchema), defaultValues: { body: '', hasFile: false } });
  const bodyError = form.formState.errors.body?.message;

  function chooseFile(next: File | null) {
    setFileError(null);
    if (next && next.size > MESSAGE_ATTACHMENT_MAX_BYTES) {
      setFileError(`That file is ${formatBytes(next.size)}; attachments can be at most ${MAX_MB} MB.`);
      next = null;
      if (fileInput.current) fileInput.current.value = '';
    }
    setFile(next);
    form.setValue('hasFile', next !== null, { shouldValidate: form.formState.isSubmitted });
  }

  const submit = form.handleSubmit(async (values) => {
    try {
      await send.mutateAsync({ body: values.body, file });
      form.reset({ body: '', hasFile: false });
      setFile(null);
      if (fileInput.current) fileInput.current.value = '';
      onSent?.();
    } catch (error) {
      // The server's reason (file type by content, 413, rate limit) goes beside the field it concerns.
      if (isApiError(error) && error.fields.file) setFileError(error.fields.file);
      else if (isApiError(error) && error.fields.body) form.setError('body', { type: 'server', message: error.fields.body });
    }
  });

  function onKeyDown(e: KeyboardEvent<HTMLTextAreaElement>) {
    if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) {
      e.preventDefault();
      void submit();
    }
  }

  const sendFailed = send.isError && !(isApiError(send.error) && (send.error.fields.file || send.error.fields.body));
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-2xl border border-line bg-canvas-raised p-4">
      <div className="space-y-1.5">
        <label htmlFor={ids.body} className="block font-medium">
          Your message
        </label>
        <textarea
          id={ids.body}
          rows={3}
          maxLength={MESSAGE_BODY_MAX}
          aria-invalid={bodyError ? true : undefined}
          aria-describedby={bodyError ? `${ids.body}-error` : undefined}
          className={fieldClasses(Boolean(bodyError)) + ' resize-y'}
          onKeyDown={onKeyDown}
          {...form.register('body')}
        />
        <FieldError id={`${ids.body}-error`} message={bodyError} />
      </div>
      <div className="flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
        <div className="space-y-1">
          <label htmlFor={ids.file} className="block text-sm font-medium">
            Attach a file <span className="font-normal text-ink-muted">(optional)</span>
          </label>
          <input
            ref={fileInput}
            id={ids.file}
            type="file"
            accept={MESSAGE_ATTACHMENT_ACCEPT}
            aria-describedby={ids.fileHint + (fileError ? ` ${ids.file}-error` : '')}
            aria-invalid={fileError ? true : undefined}
            onChange={(e) => chooseFile(e.target.files?.[0] ?? null)}
            className="block text-sm file:mr-3 file:rounded-lg file:border file:border-line-strong file:bg-canvas-sunken file:px-3 file:py-1.5 file:font-medium file:text-ink"
          />
          <p id={ids.fileHint} className="text-sm text-ink-muted">
            PDF, PNG, JPEG, WebP, plain text, WAV or MP3, up to {MAX_MB} MB.
          </p>
          <FieldError id={`${ids.file}-error`} message={fileError ?? undefined} />
        </div>
        <Button type="submit" busy={send.isPending} busyLabel={file ? `Sending ${Math.round(send.progress * 100)} %` : 'Sending…'}>
          Send
        </Button>
      </div>
      {file && send.isPending ? (
        <progress className="h-2 w-full accent-brand-700" max={1} value={send.progress} aria-label="Upload progress" />
      ) : null}
      {sendFailed ? (
        <Alert tone="error" title="Not sent">
          {send.error instanceof Error ? send.error.message : 'Please try again.'}
        </Alert>
      ) : null}
    </form>
  );
}

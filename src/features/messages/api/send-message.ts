import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { MessageView, ThreadMessages } from '@shared/schemas/messages';
import { api, ApiError } from '@/lib/api-client';
import { messageKeys } from './keys';
import { mergeMessages } from './get-thread-messages';
import { threadsQueryOptions } from './get-threads';

export type SendMessageVars = { body: string; file?: File | null };
type ErrorBody = { error?: { code?: string; message?: string; fields?: Record<string, string> } };

function messagesUrl(threadId: string): string {
  return `/api/threads/${encodeURIComponent(threadId)}/messages`;
}

/**
 * A file goes as multipart through XMLHttpRequest, because fetch cannot report upload progress; its errors
 * become the same ApiError the api client throws. Text alone goes through the api client as JSON.
 */
function sendWithFile(threadId: string, body: string, file: File, onProgress: (fraction: number) => void): Promise<{ message: MessageView }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', messagesUrl(threadId));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'network', message: 'The message could not be sent. Check your connection and try again.' }));
    xhr.onload = () => {
      let parsed: unknown = null;
      try {
        parsed = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        parsed = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(parsed as { message: MessageView });
      const error = (parsed as ErrorBody | null)?.error;
      reject(
        new ApiError({
          status: xhr.status,
          code: error?.code ?? `http_${xhr.status}`,
          message: error?.message ?? `The message could not be sent (${xhr.status}). Please try again.`,
          fields: error?.fields,
        }),
      );
    };
    const form = new FormData();
    form.append('body', body);
    form.append('file', file);
    xhr.send(form);
  });
}

export function sendMessage(threadId: string, vars: SendMessageVars, onProgress: (fraction: number) => void = () => {}): Promise<{ message: MessageView }> {
  if (vars.file) return sendWithFile(threadId, vars.body, vars.file, onProgress);
  return api.post(messagesUrl(threadId), { body: vars.body });
}

export function useSendMessage(threadId: string) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (vars: SendMessageVars) => {
      setProgress(0);
      return sendMessage(threadId, vars, setProgress);
    },
    onSuccess: ({ message }) => {
      queryClient.setQueryData<ThreadMessages>(messageKeys.thread(threadId), (old) =>
        old ? { ...old, messages: mergeMessages(old.messages, [message]) } : old,
      );
      void queryClient.invalidateQueries({ queryKey: threadsQueryOptions().queryKey });
    },
  });
  return { ...mutation, progress };
}

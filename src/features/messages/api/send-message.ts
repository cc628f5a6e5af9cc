import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { MessageView, ThreadMessages } from '@shared/schemas/messages';
import { api } from '@/lib/api-client';
import { postForm } from '@/lib/post-form';
import { messageKeys } from './keys';
import { mergeMessages } from './get-thread-messages';
import { threadsQueryOptions } from './get-threads';

export type SendMessageVars = { body: string; file?: File | null };

function messagesUrl(threadId: string): string {
  return `/api/threads/${encodeURIComponent(threadId)}/messages`;
}

/** A file goes as multipart with upload progress; text alone goes through the api client as JSON. */
function sendWithFile(threadId: string, body: string, file: File, onProgress: (fraction: number) => void): Promise<{ message: MessageView }> {
  const form = new FormData();
  form.append('body', body);
  form.append('file', file);
  return postForm(messagesUrl(threadId), form, {
    onProgress,
    networkMessage: 'The message could not be sent. Check your connection and try again.',
    failureMessage: 'The message could not be sent',
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

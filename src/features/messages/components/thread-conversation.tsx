import { useEffect, useRef } from 'react';
import type { MessageView } from '@shared/schemas/messages';
import { EmptyState } from '@/components/ui';
import { MessageItem } from './message-item';

/**
 * The messages of one thread as a chat log (role=log announces new ones politely). The view follows the
 * newest message when one arrives, unless the reader has scrolled up to read older ones.
 */
export function ThreadConversation({ messages, myId }: { messages: MessageView[]; myId: string }) {
  const end = useRef<HTMLDivElement>(null);
  const box = useRef<HTMLDivElement>(null);
  const newestId = messages.at(-1)?.id;

  useEffect(() => {
    const el = box.current;
    if (!el || !newestId) return;
    const nearBottom = el.scrollHeight - el.scrollTop - el.clientHeight < 160;
    if (nearBottom || messages.at(-1)?.senderId === myId) end.current?.scrollIntoView?.({ block: 'end' });
    // Only a new newest message moves the view.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [newestId]);

  if (messages.length === 0) {
    return (
      <EmptyState title="No messages yet" className="my-2">
        Say hello, ask about the song, or attach a chart or a short audio note.
      </EmptyState>
    );
  }
  return (
    <div ref={box} role="log" aria-label="Conversation" tabIndex={0} className="max-h-[60vh] min-h-48 overflow-y-auto rounded-2xl bg-canvas-sunken/60 p-3 sm:p-4">
      <ol className="space-y-3">
        {messages.map((m) => (
          <MessageItem key={m.id} message={m} mine={m.senderId === myId} />
        ))}
      </ol>
      <div ref={end} />
    </div>
  );
}

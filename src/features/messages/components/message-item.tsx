import type { MessageView } from '@shared/schemas/messages';
import { cx } from '@/components/ui';
import { formatBytes, formatWhen } from './format-when';

function AttachmentLink({ attachment }: { attachment: NonNullable<MessageView['attachment']> }) {
  return (
    <a
      href={attachment.url}
      download={attachment.name}
      className="mt-2 inline-flex items-center gap-2 rounded-lg border border-line-strong bg-canvas-raised px-3 py-2 text-sm font-medium text-brand-800 underline-offset-2 hover:underline"
    >
      <svg viewBox="0 0 20 20" className="size-4 shrink-0" aria-hidden="true">
        <path fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" d="M13.5 6.5 7.8 12.2a1.6 1.6 0 0 0 2.3 2.3l6-6a3.2 3.2 0 0 0-4.6-4.6l-6 6a4.8 4.8 0 0 0 6.8 6.8l5-5" />
      </svg>
      <span className="truncate">{attachment.name}</span>
      <span className="shrink-0 text-ink-muted">({formatBytes(attachment.size)})</span>
    </a>
  );
}

/** One message; mine sit on the right in the brand tint, theirs on the left, both with sender and time in words. */
export function MessageItem({ message, mine }: { message: MessageView; mine: boolean }) {
  return (
    <li className={cx('flex', mine ? 'justify-end' : 'justify-start')}>
      <article
        aria-label={`${mine ? 'You' : message.senderName}, ${formatWhen(message.createdAt)}`}
        className={cx('max-w-[85%] rounded-2xl px-4 py-3 sm:max-w-[70%]', mine ? 'bg-brand-50 ring-1 ring-brand-300' : 'bg-canvas-raised ring-1 ring-line')}
      >
        <p className="flex flex-wrap items-baseline gap-x-2 text-sm">
          <span className="font-bold text-ink">{mine ? 'You' : message.senderName}</span>
          <time dateTime={message.createdAt} className="text-ink-muted">
            {formatWhen(message.createdAt)}
          </time>
        </p>
        {message.body ? <p className="mt-1 break-words whitespace-pre-wrap text-ink">{message.body}</p> : null}
        {message.attachment ? <AttachmentLink attachment={message.attachment} /> : null}
      </article>
    </li>
  );
}

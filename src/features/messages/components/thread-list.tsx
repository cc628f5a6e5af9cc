import { Link } from 'react-router-dom';
import type { ThreadSummary } from '@shared/schemas/messages';
import { Badge, cx } from '@/components/ui';
import { formatWhen } from './format-when';

function otherPeople(thread: ThreadSummary, myId: string): string {
  const names = thread.participants.filter((p) => p.id !== myId).map((p) => p.displayName);
  return names.length ? names.join(', ') : 'Only you so far';
}

function preview(thread: ThreadSummary, myId: string, myName: string): string {
  const last = thread.lastMessage;
  if (!last) return 'No messages yet';
  const who = last.senderName === myName && thread.participants.some((p) => p.id === myId) ? 'You' : last.senderName;
  const text = last.body || (last.attachmentName ? `sent ${last.attachmentName}` : '');
  return `${who}: ${text}`;
}

/** My conversations, newest first; unread ones stand out by weight and a count, not by colour alone. */
export function ThreadList({ threads, myId, myName, hrefOf }: { threads: ThreadSummary[]; myId: string; myName: string; hrefOf: (id: string) => string }) {
  return (
    <ul className="divide-y divide-line overflow-hidden rounded-2xl border border-line bg-canvas-raised">
      {threads.map((thread) => {
        const unread = thread.unread > 0;
        return (
          <li key={thread.id}>
            <Link to={hrefOf(thread.id)} className="flex gap-4 px-4 py-4 hover:bg-canvas-sunken focus-visible:bg-canvas-sunken sm:px-5">
              <div className="min-w-0 flex-1">
                <div className="flex flex-wrap items-baseline gap-x-2">
                  <span className={cx('truncate text-lg', unread ? 'font-bold' : 'font-medium')}>{otherPeople(thread, myId)}</span>
                  <span className="text-sm text-ink-muted">
                    {thread.kind === 'booking' ? 'Booking' : 'Brief'} · {thread.subject}
                  </span>
                </div>
                <p className={cx('mt-1 truncate', unread ? 'text-ink' : 'text-ink-muted')}>{preview(thread, myId, myName)}</p>
              </div>
              <div className="flex shrink-0 flex-col items-end gap-1">
                {thread.lastMessageAt ? (
                  <time dateTime={thread.lastMessageAt} className="text-sm text-ink-muted">
                    {formatWhen(thread.lastMessageAt)}
                  </time>
                ) : null}
                {unread ? (
                  <Badge tone="brand">
                    {thread.unread}
                    <span className="sr-only"> unread</span>
                  </Badge>
                ) : null}
              </div>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}

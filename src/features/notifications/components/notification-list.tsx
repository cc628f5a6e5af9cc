import { Link } from 'react-router-dom';
import type { NotificationItem } from '@shared/schemas/notifications';
import { cx } from '@/components/ui';
import { formatWhen } from '@/features/messages/components/format-when';

/** Notifications as links into the app; following one marks it read. Unread ones are bold and say so. */
export function NotificationList({ items, onOpen, compact = false }: { items: NotificationItem[]; onOpen: (item: NotificationItem) => void; compact?: boolean }) {
  return (
    <ul className={cx('divide-y divide-line', !compact && 'overflow-hidden rounded-2xl border border-line bg-canvas-raised')}>
      {items.map((item) => {
        const unread = item.readAt === null;
        return (
          <li key={item.id}>
            <Link to={item.link} onClick={() => onOpen(item)} className={cx('flex gap-3 hover:bg-canvas-sunken focus-visible:bg-canvas-sunken', compact ? 'px-4 py-3' : 'px-5 py-4')}>
              <span aria-hidden="true" className={cx('mt-2 size-2.5 shrink-0 rounded-full', unread ? 'bg-brand-700' : 'bg-transparent')} />
              <span className="min-w-0 flex-1">
                <span className={cx('block', unread ? 'font-bold text-ink' : 'font-medium text-ink')}>
                  {item.title}
                  {unread ? <span className="sr-only"> (unread)</span> : null}
                </span>
                {item.body ? <span className={cx('block text-ink-muted', compact && 'truncate')}>{item.body}</span> : null}
                <time dateTime={item.createdAt} className="block text-sm text-ink-muted">
                  {formatWhen(item.createdAt)}
                </time>
              </span>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}

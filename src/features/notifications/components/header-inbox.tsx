import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useUnread } from '../api/get-unread';
import { CountBadge } from './count-badge';
import { NotificationsBell } from './notifications-bell';

/**
 * What the header shows a signed-in person: unread messages (a link to the inbox) and the bell. The counts
 * come from one polled request, so new messages appear without a reload.
 */
export function HeaderInbox() {
  const unread = useUnread();
  const messages = unread.data?.messages ?? 0;
  return (
    <div className="flex items-center gap-1">
      <Link
        to={paths.messages.getHref()}
        className="relative flex size-10 items-center justify-center rounded-full text-white hover:bg-brand-800"
        data-testid="header-messages"
      >
        <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true">
          <path fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" d="M4 5h16v11H9l-5 4V5Z" />
        </svg>
        <CountBadge count={messages} />
        <span className="sr-only">{messages > 0 ? `Messages, ${messages} unread` : 'Messages'}</span>
      </Link>
      <NotificationsBell unread={unread.data?.notifications ?? 0} />
    </div>
  );
}

import { useEffect, useId, useRef, useState } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Spinner } from '@/components/ui';
import { useNotifications } from '../api/get-notifications';
import { useMarkNotificationsRead } from '../api/mark-notifications-read';
import { NotificationList } from './notification-list';
import { CountBadge } from './count-badge';

const DROPDOWN_SIZE = 8;

function BellIcon() {
  return (
    <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true">
      <path fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" d="M6 8a6 6 0 1 1 12 0c0 7 3 8 3 8H3s3-1 3-8Zm4.3 12a2 2 0 0 0 3.4 0" />
    </svg>
  );
}

/** The bell: unread count on the button, the latest notifications in a panel that links into the app. */
export function NotificationsBell({ unread }: { unread: number }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const location = useLocation();
  const list = useNotifications(DROPDOWN_SIZE, { enabled: open });
  const markRead = useMarkNotificationsRead();

  useEffect(() => setOpen(false), [location.pathname]);
  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!root.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const label = unread > 0 ? `Notifications, ${unread} unread` : 'Notifications';
  return (
    <div ref={root} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="relative flex size-10 items-center justify-center rounded-full text-white hover:bg-brand-800"
      >
        <BellIcon />
        <CountBadge count={unread} />
        <span className="sr-only">{label}</span>
      </button>
      {open ? (
        <div id={panelId} className="absolute right-0 z-30 mt-2 w-[min(22rem,calc(100vw-2rem))] overflow-hidden rounded-2xl border border-line bg-canvas-raised text-ink shadow-lg">
          <div className="flex items-center justify-between border-b border-line px-4 py-3">
            <h2 className="font-bold">Notifications</h2>
            {unread > 0 ? (
              <button type="button" className="text-sm font-medium text-brand-800 underline-offset-2 hover:underline" onClick={() => markRead.mutate({})}>
                Mark all read
              </button>
            ) : null}
          </div>
          <div className="max-h-96 overflow-y-auto">
            {list.isPending ? (
              <div className="flex justify-center p-6">
                <Spinner label="Loading notifications" />
              </div>
            ) : list.isError ? (
              <p role="alert" className="p-4 text-danger-800">
                Notifications could not be loaded. {list.error.message}
              </p>
            ) : list.data.items.length === 0 ? (
              <p className="p-6 text-center text-ink-muted">Nothing yet. Invitations, quotes and booking news will show up here.</p>
            ) : (
              <NotificationList compact items={list.data.items} onOpen={(item) => item.readAt === null && markRead.mutate({ id: item.id })} />
            )}
          </div>
          <div className="flex justify-between border-t border-line px-4 py-3 text-sm font-medium">
            <Link to={paths.notifications.getHref()} className="text-brand-800 underline-offset-2 hover:underline">
              All notifications
            </Link>
            <Link to={paths.notificationSettings.getHref()} className="text-brand-800 underline-offset-2 hover:underline">
              Mail settings
            </Link>
          </div>
        </div>
      ) : null}
    </div>
  );
}

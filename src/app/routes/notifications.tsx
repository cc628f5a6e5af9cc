import { paths } from '@/config/paths';
import { Alert, Button, ButtonLink, EmptyState, PageHeader, PageSpinner } from '@/components/ui';
import { useNotifications } from '@/features/notifications/api/get-notifications';
import { useMarkNotificationsRead } from '@/features/notifications/api/mark-notifications-read';
import { NotificationList } from '@/features/notifications/components/notification-list';
import { useDocumentTitle } from '@/lib/use-document-title';

const PAGE_SIZE = 100;

export function Component() {
  useDocumentTitle('Notifications');
  const list = useNotifications(PAGE_SIZE);
  const markRead = useMarkNotificationsRead();
  const unread = list.data?.unread ?? 0;

  return (
    <>
      <PageHeader
        title="Notifications"
        description="Invitations, quotes, bookings and payments. Each one links to where it happened."
        actions={
          <>
            {unread > 0 ? (
              <Button variant="secondary" busy={markRead.isPending} busyLabel="Marking…" onClick={() => markRead.mutate({})}>
                Mark all read
              </Button>
            ) : null}
            <ButtonLink variant="ghost" to={paths.notificationSettings.getHref()}>
              Mail settings
            </ButtonLink>
          </>
        }
      />
      {list.isPending ? (
        <PageSpinner label="Loading notifications" />
      ) : list.isError ? (
        <Alert tone="error" title="Notifications could not be loaded">
          <p>{list.error.message}</p>
          <Button variant="secondary" size="sm" className="mt-3" onClick={() => void list.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : list.data.items.length === 0 ? (
        <EmptyState title="Nothing here yet">When someone invites you to a brief, quotes, accepts or pays, it shows up here and under the bell.</EmptyState>
      ) : (
        <NotificationList items={list.data.items} onOpen={(item) => item.readAt === null && markRead.mutate({ id: item.id })} />
      )}
    </>
  );
}

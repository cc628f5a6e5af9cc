import { useSearchParams } from 'react-router-dom';
import { isNotificationKind, NOTIFICATION_KIND_LABELS, type NotificationKind } from '@shared/schemas/notifications';
import { Alert, Button, Card, PageHeader, PageSpinner } from '@/components/ui';
import { useNotificationSettings } from '@/features/notifications/api/get-notification-settings';
import { useUpdateNotificationSettings } from '@/features/notifications/api/update-notification-settings';
import { NotificationSettingsForm } from '@/features/notifications/components/notification-settings-form';
import { useDocumentTitle } from '@/lib/use-document-title';

/** The mail footer's link lands here with ?mute=<kind>: one button stops that kind. */
function StopOneKind({ kind, mutedKinds }: { kind: NotificationKind; mutedKinds: NotificationKind[] }) {
  const update = useUpdateNotificationSettings();
  const label = NOTIFICATION_KIND_LABELS[kind].toLowerCase();
  if (mutedKinds.includes(kind)) {
    return <Alert tone="success">You no longer get mails about {label}. They still show under the bell.</Alert>;
  }
  return (
    <Alert tone="info" title={`Stop mails about ${label}?`}>
      <p>You will still see them under the bell in Kitlane.</p>
      <Button className="mt-3" busy={update.isPending} busyLabel="Stopping…" onClick={() => update.mutate({ mutedKinds: [...mutedKinds, kind] })}>
        Stop these mails
      </Button>
      {update.isError ? <p className="mt-2 font-medium text-danger-800">{update.error.message}</p> : null}
    </Alert>
  );
}

export function Component() {
  useDocumentTitle('Mail settings');
  const [search] = useSearchParams();
  const mute = search.get('mute');
  const settings = useNotificationSettings();

  return (
    <>
      <PageHeader title="Mail settings" description="Choose which notifications Kitlane also sends by mail." />
      {settings.isPending ? (
        <PageSpinner label="Loading your mail settings" />
      ) : settings.isError ? (
        <Alert tone="error" title="Your settings could not be loaded">
          <p>{settings.error.message}</p>
          <Button variant="secondary" size="sm" className="mt-3" onClick={() => void settings.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : (
        <div className="space-y-6">
          {isNotificationKind(mute) ? <StopOneKind kind={mute} mutedKinds={settings.data.mutedKinds} /> : null}
          <Card>
            <NotificationSettingsForm mutedKinds={settings.data.mutedKinds} />
          </Card>
        </div>
      )}
    </>
  );
}

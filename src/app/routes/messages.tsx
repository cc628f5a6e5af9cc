import { paths } from '@/config/paths';
import { Alert, Button, ButtonLink, EmptyState, PageHeader, PageSpinner } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useThreads } from '@/features/messages/api/get-threads';
import { ThreadList } from '@/features/messages/components/thread-list';
import { useDocumentTitle } from '@/lib/use-document-title';

function StartHint({ roles }: { roles: string[] }) {
  if (roles.includes('songwriter')) {
    return <ButtonLink to={paths.myBriefs.getHref()}>Go to my briefs</ButtonLink>;
  }
  if (roles.includes('drummer')) {
    return <ButtonLink to={paths.openBriefs.getHref()}>Browse open briefs</ButtonLink>;
  }
  return <ButtonLink to={paths.bookings.getHref()}>See my bookings</ButtonLink>;
}

export function Component() {
  useDocumentTitle('Messages');
  const { user } = useMe();
  const threads = useThreads();

  return (
    <>
      <PageHeader title="Messages" description="Conversations about your briefs and bookings. New messages appear here on their own." />
      {!user ? null : threads.isPending ? (
        <PageSpinner label="Loading your conversations" />
      ) : threads.isError ? (
        <Alert tone="error" title="Your conversations could not be loaded">
          <p>{threads.error.message}</p>
          <Button variant="secondary" size="sm" className="mt-3" onClick={() => void threads.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : threads.data.items.length === 0 ? (
        <EmptyState title="No conversations yet" action={<StartHint roles={user.roles} />}>
          A conversation starts from a brief: a songwriter writes to a drummer, or a drummer asks about an open brief. After hiring, the booking gets its own thread.
        </EmptyState>
      ) : (
        <ThreadList threads={threads.data.items} myId={user.id} myName={user.displayName} hrefOf={paths.messageThread.getHref} />
      )}
    </>
  );
}

import { useEffect } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, Badge, Button, ButtonLink, EmptyState, PageSpinner } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useThreadMessages } from '@/features/messages/api/get-thread-messages';
import { useMarkThreadRead } from '@/features/messages/api/mark-thread-read';
import { ThreadConversation } from '@/features/messages/components/thread-conversation';
import { MessageComposer } from '@/features/messages/components/message-composer';
import { isApiError } from '@/lib/api-client';
import { useDocumentTitle } from '@/lib/use-document-title';

const ROLE_WORDS = { songwriter: 'Songwriter', drummer: 'Drummer', engineer: 'Engineer' } as const;

/** Marks the thread read whenever something unread is on screen and the tab is in front. */
function useReadWhileOpen(threadId: string, unread: number | undefined) {
  const markRead = useMarkThreadRead();
  const { mutate } = markRead;
  useEffect(() => {
    if (!unread) return;
    if (document.visibilityState === 'visible') mutate(threadId);
    const onVisible = () => document.visibilityState === 'visible' && mutate(threadId);
    document.addEventListener('visibilitychange', onVisible);
    return () => document.removeEventListener('visibilitychange', onVisible);
  }, [threadId, unread, mutate]);
}

function BackLink() {
  return (
    <Link to={paths.messages.getHref()} className="inline-flex items-center gap-1 font-medium text-brand-800 underline-offset-2 hover:underline">
      <span aria-hidden="true">←</span> All conversations
    </Link>
  );
}

/** Where the conversation's subject lives: the booking after hiring, the brief before. */
function AboutLink({ briefId, bookingId }: { briefId: string | null; bookingId: string | null }) {
  const href = bookingId ? paths.booking.getHref(bookingId) : briefId ? paths.brief.getHref(briefId) : null;
  if (!href) return null;
  return (
    <Link to={href} className="font-medium text-brand-800 underline underline-offset-2">
      {bookingId ? 'Open the booking' : 'Open the brief'}
    </Link>
  );
}

export function Component() {
  const { threadId = '' } = useParams();
  const { user } = useMe();
  const query = useThreadMessages(threadId);
  const thread = query.data?.thread;
  useDocumentTitle(thread ? `Messages · ${thread.subject}` : 'Messages');
  useReadWhileOpen(threadId, thread?.unread);

  if (!user) return null;
  if (query.isPending) return <PageSpinner label="Loading the conversation" />;
  if (query.isError && !query.data) {
    if (isApiError(query.error) && query.error.status === 404) {
      return (
        <EmptyState title="This conversation is not available" action={<ButtonLink to={paths.messages.getHref()}>Back to messages</ButtonLink>}>
          It does not exist, or you are not part of it.
        </EmptyState>
      );
    }
    return (
      <Alert tone="error" title="The conversation could not be loaded">
        <p>{query.error.message}</p>
        <Button variant="secondary" size="sm" className="mt-3" onClick={() => void query.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  const { thread: detail, messages } = query.data!;
  const others = detail.participants.filter((p) => p.id !== user.id);

  return (
    <div className="space-y-4">
      <BackLink />
      <header className="space-y-2">
        <h1 className="text-3xl font-bold tracking-tight text-ink">{detail.subject}</h1>
        <p className="flex flex-wrap items-center gap-2 text-ink-muted">
          <Badge tone="brand">{detail.kind === 'booking' ? 'Booking' : 'Brief'}</Badge>
          <AboutLink bookingId={detail.bookingId} briefId={detail.briefId} />
          <span>
            With{' '}
            {others.length
              ? others.map((p, i) => (
                  <span key={p.id}>
                    {i > 0 ? ', ' : ''}
                    <span className="font-medium text-ink">{p.displayName}</span> ({ROLE_WORDS[p.role].toLowerCase()})
                  </span>
                ))
              : 'nobody else yet'}
          </span>
        </p>
      </header>
      {query.isError ? (
        <Alert tone="warning">New messages could not be fetched just now; Kitlane keeps trying.</Alert>
      ) : null}
      <ThreadConversation messages={messages} myId={user.id} />
      <MessageComposer threadId={detail.id} />
    </div>
  );
}

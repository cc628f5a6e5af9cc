import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { BriefView } from '@shared/schemas/briefs';
import { paths } from '@/config/paths';
import { Alert, Badge, Button, ButtonLink, Card, PageHeader } from '@/components/ui';
import { useCan } from '@/features/auth/hooks/use-can';
import { useBrief } from '@/features/briefs/api/get-brief';
import { useChangeBriefStatus } from '@/features/briefs/api/change-brief-status';
import { BriefStatusBadge } from '@/features/briefs/components/brief-status-badge';
import { BriefSummary } from '@/features/briefs/components/brief-summary';
import { GuidePlayer } from '@/features/briefs/components/guide-player';
import { GuideUpload } from '@/features/briefs/components/guide-upload';
import { InviteDrummers } from '@/features/briefs/components/invite-drummers';
import { QueryState } from '@/features/briefs/components/query-state';
import { styleLabel } from '@/features/briefs/components/format';
import { useCreateQuote } from '@/features/quotes/api/create-quote';
import { QuoteForm } from '@/features/quotes/components/quote-form';
import { OpenThreadButton } from '@/features/messages/components/open-thread-button';
import { useDocumentTitle } from '@/lib/use-document-title';

function OwnerPanel({ brief }: { brief: BriefView }) {
  const change = useChangeBriefStatus();
  const [confirmWithdraw, setConfirmWithdraw] = useState(false);
  return (
    <Card className="space-y-5">
      <h2 className="text-xl font-bold">Your brief</h2>
      {change.error ? <Alert tone="error">{change.error.message}</Alert> : null}
      {brief.status === 'draft' ? (
        <>
          <GuideUpload briefId={brief.id} hasGuide={!!brief.guide} />
          <div className="flex flex-wrap gap-3 border-t border-line pt-4">
            <ButtonLink to={paths.editBrief.getHref(brief.id)} variant="secondary">
              Edit draft
            </ButtonLink>
            <Button busy={change.isPending} busyLabel="Publishing…" onClick={() => change.mutate({ id: brief.id, action: 'publish' })}>
              Publish brief
            </Button>
          </div>
          <p className="text-sm text-ink-muted">Drafts are private. Once published, drummers can see the brief and quote, and you can invite drummers; it can no longer be edited.</p>
        </>
      ) : null}
      {brief.status !== 'draft' ? (
        <p>
          <Link to={paths.compareQuotes.getHref(brief.id)} className="font-medium text-brand-800 underline">
            Compare {brief.viewer.quoteCount ?? 0} {brief.viewer.quoteCount === 1 ? 'quote' : 'quotes'}
          </Link>
        </p>
      ) : null}
      {brief.status === 'open' ? (
        <InviteDrummers brief={brief} />
      ) : brief.invitedDrummers?.length ? (
        <p className="text-sm">Invited: {brief.invitedDrummers.map((d) => d.displayName).join(', ')}</p>
      ) : null}
      {brief.status === 'draft' || brief.status === 'open' ? (
        confirmWithdraw ? (
          <div className="flex flex-wrap items-center gap-3">
            <span>Withdraw this brief? Quotes waiting on it are declined.</span>
            <Button variant="danger" size="sm" busy={change.isPending} onClick={() => change.mutate({ id: brief.id, action: 'withdraw' })}>
              Yes, withdraw
            </Button>
            <Button variant="ghost" size="sm" onClick={() => setConfirmWithdraw(false)}>
              Keep it
            </Button>
          </div>
        ) : (
          <Button variant="ghost" size="sm" onClick={() => setConfirmWithdraw(true)}>
            Withdraw brief
          </Button>
        )
      ) : null}
    </Card>
  );
}

/** A drummer's question before (or after) quoting goes to the songwriter's conversation about this brief. */
function AskSongwriter({ brief }: { brief: BriefView }) {
  if (brief.status !== 'open' && brief.status !== 'hired') return null;
  return (
    <div className="mt-4 border-t border-line pt-4">
      <OpenThreadButton target={{ briefId: brief.id }}>Message {brief.songwriterName}</OpenThreadButton>
    </div>
  );
}

function DrummerPanel({ brief }: { brief: BriefView }) {
  const canQuote = useCan('create:quote:own');
  const create = useCreateQuote();
  const navigate = useNavigate();
  if (brief.viewer.myQuoteId) {
    return (
      <Card>
        <h2 className="text-xl font-bold">Your quote</h2>
        <p className="mt-2">
          You quoted on this brief.{' '}
          <Link to={paths.quote.getHref(brief.viewer.myQuoteId)} className="font-medium text-brand-800 underline">
            See your quote
          </Link>
        </p>
        <AskSongwriter brief={brief} />
      </Card>
    );
  }
  if (brief.status !== 'open' || !canQuote) return null;
  return (
    <Card>
      <h2 className="text-xl font-bold">Send a quote</h2>
      <div className="mt-2 mb-5 space-y-2 border-b border-line pb-5">
        <p className="text-sm text-ink-muted">Something unclear in the brief? Ask before you quote.</p>
        <OpenThreadButton target={{ briefId: brief.id }}>Message {brief.songwriterName}</OpenThreadButton>
      </div>
      <QuoteForm
        brief={brief}
        busy={create.isPending}
        onSend={async (input) => {
          const quote = await create.mutateAsync({ briefId: brief.id, input });
          navigate(paths.quote.getHref(quote.id));
        }}
      />
    </Card>
  );
}

export function Component() {
  const { briefId = '' } = useParams();
  const brief = useBrief(briefId);
  useDocumentTitle(brief.data?.songTitle ?? 'Brief');
  return (
    <QueryState isPending={brief.isPending} error={brief.error} retry={() => void brief.refetch()} loadingLabel="Loading the brief" notFoundText="This brief does not exist, or it is not open to you.">
      {() => {
        const b = brief.data!;
        return (
          <>
            <PageHeader
              title={b.songTitle}
              description={
                <span className="flex flex-wrap items-center gap-2">
                  <BriefStatusBadge status={b.status} />
                  {b.viewer.invited ? <Badge tone="accent">You are invited</Badge> : null}
                  <span>
                    {styleLabel(b.style)} · by {b.songwriterName}
                  </span>
                </span>
              }
            />
            <div className="grid gap-6 lg:grid-cols-[1fr_minmax(0,28rem)]">
              <div className="space-y-6">
                <Card>
                  <h2 className="mb-3 text-xl font-bold">Guide track</h2>
                  {b.guide ? <GuidePlayer briefId={b.id} name={b.guide.name} hasPeaks={b.guide.hasPeaks} /> : <p className="text-ink-muted">No guide track yet.</p>}
                </Card>
                <Card>
                  <BriefSummary brief={b} />
                </Card>
              </div>
              <div className="space-y-6">{b.viewer.isOwner ? <OwnerPanel brief={b} /> : <DrummerPanel brief={b} />}</div>
            </div>
          </>
        );
      }}
    </QueryState>
  );
}

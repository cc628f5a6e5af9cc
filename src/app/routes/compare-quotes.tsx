import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { QuoteComparison } from '@shared/schemas/quotes';
import { paths } from '@/config/paths';
import { Alert, Button, Card, EmptyState, PageHeader, TextField } from '@/components/ui';
import { useBrief } from '@/features/briefs/api/get-brief';
import { QueryState } from '@/features/briefs/components/query-state';
import { useBriefQuotes } from '@/features/quotes/api/get-brief-quotes';
import { useAcceptQuote, useDeclineQuote } from '@/features/quotes/api/quote-actions';
import { QuoteStatusBadge } from '@/features/quotes/components/quote-status-badge';
import { LegalCaution, LineItems, RightsText } from '@/features/quotes/components/quote-terms';
import { dateText } from '@/features/briefs/components/format';
import { useDocumentTitle } from '@/lib/use-document-title';
import { QuotePackageSummary } from '@/features/mic-packages/components/quote-package-summary';
import { OpenThreadButton } from '@/features/messages/components/open-thread-button';

function QuoteColumn({ quote, briefOpen }: { quote: QuoteComparison; briefOpen: boolean }) {
  const accept = useAcceptQuote();
  const decline = useDeclineQuote();
  const navigate = useNavigate();
  const [declining, setDeclining] = useState(false);
  const [reason, setReason] = useState('');
  const canAct = briefOpen && quote.status === 'sent';
  return (
    <Card className="flex flex-col gap-4" aria-labelledby={`q-${quote.id}`}>
      <div className="flex items-start justify-between gap-2">
        <h2 id={`q-${quote.id}`} className="text-lg font-bold">
          {quote.drummerName}
        </h2>
        <QuoteStatusBadge status={quote.status} />
      </div>
      <LineItems items={quote.lineItems} totalMinor={quote.totalMinor} currency={quote.currency} extraRevisionMinor={quote.extraRevisionMinor} />
      <dl className="grid grid-cols-2 gap-2 text-sm">
        <dt className="text-ink-muted">Turnaround</dt>
        <dd>{quote.turnaroundDays} days</dd>
        <dt className="text-ink-muted">Revisions</dt>
        <dd>{quote.revisionsIncluded} included</dd>
        <dt className="text-ink-muted">Rating</dt>
        <dd>{quote.drummer.ratingAvg != null ? `${quote.drummer.ratingAvg.toFixed(1)} of 5 (${quote.drummer.ratingCount})` : 'No reviews yet'}</dd>
        {quote.recordingDate ? (
          <>
            <dt className="text-ink-muted">Records on</dt>
            <dd>{dateText(quote.recordingDate)}</dd>
          </>
        ) : null}
        <dt className="text-ink-muted">Valid until</dt>
        <dd>{new Date(quote.validUntil).toLocaleDateString()}</dd>
      </dl>
      <RightsText terms={quote.rightsTerms} points={quote.royaltyPoints} />
      {quote.engineer ? (
        <p className="text-sm">
          Engineer: {quote.engineer.displayName} ({quote.engineer.status})
        </p>
      ) : null}
      <QuotePackageSummary packageId={quote.packageId} />
      {quote.drummer.reelTrackId ? (
        <div className="text-sm">
          <p className="font-medium">Reel: {quote.drummer.reelTrackTitle}</p>
          <audio controls preload="none" src={`/api/reel-tracks/${encodeURIComponent(quote.drummer.reelTrackId)}/audio`} className="mt-1 w-full" aria-label={`Reel track of ${quote.drummerName}`} />
        </div>
      ) : null}
      {quote.message ? <blockquote className="border-l-4 border-line-strong pl-3 text-sm italic">{quote.message}</blockquote> : null}
      <OpenThreadButton target={{ briefId: quote.briefId, drummerId: quote.drummerId }} variant="ghost">
        Message {quote.drummerName}
      </OpenThreadButton>
      {quote.declineReason ? <p className="text-sm text-ink-muted">Declined: {quote.declineReason}</p> : null}
      {quote.blockedReason && quote.status === 'sent' ? <Alert tone="warning">{quote.blockedReason}</Alert> : null}
      {accept.error ? <Alert tone="error">{accept.error.message}</Alert> : null}
      {decline.error ? <Alert tone="error">{decline.error.message}</Alert> : null}
      {canAct ? (
        <div className="mt-auto space-y-3 border-t border-line pt-4">
          <Button
            className="w-full"
            disabled={quote.blockedReason !== null}
            busy={accept.isPending}
            busyLabel="Accepting…"
            onClick={() => accept.mutate(quote.id, { onSuccess: (booking) => navigate(paths.booking.getHref(booking.id)) })}
          >
            Accept {quote.drummerName}’s quote
          </Button>
          {declining ? (
            <div className="space-y-2">
              <TextField label="Reason (optional)" value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} />
              <div className="flex gap-2">
                <Button variant="danger" size="sm" busy={decline.isPending} onClick={() => decline.mutate({ id: quote.id, reason: reason.trim() || undefined })}>
                  Decline
                </Button>
                <Button variant="ghost" size="sm" onClick={() => setDeclining(false)}>
                  Cancel
                </Button>
              </div>
            </div>
          ) : (
            <Button variant="secondary" className="w-full" onClick={() => setDeclining(true)}>
              Decline…
            </Button>
          )}
        </div>
      ) : null}
    </Card>
  );
}

export function Component() {
  const { briefId = '' } = useParams();
  const brief = useBrief(briefId);
  const quotes = useBriefQuotes(briefId);
  useDocumentTitle(brief.data ? `Quotes for ${brief.data.songTitle}` : 'Quotes');
  return (
    <>
      <PageHeader
        title={brief.data ? `Quotes for ${brief.data.songTitle}` : 'Quotes'}
        description={
          <Link to={paths.brief.getHref(briefId)} className="underline">
            Back to the brief
          </Link>
        }
      />
      <QueryState isPending={quotes.isPending} error={quotes.error} retry={() => void quotes.refetch()} loadingLabel="Loading the quotes" notFoundText="Only the songwriter who wrote this brief can compare its quotes.">
        {() =>
          quotes.data!.items.length === 0 ? (
            <EmptyState title="No quotes yet">Drummers who find your brief send quotes here; you also get a notification and a mail for each.</EmptyState>
          ) : (
            <>
              {brief.data?.status === 'hired' ? <Alert tone="success" className="mb-4">You hired a drummer for this brief.</Alert> : null}
              <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
                {quotes.data!.items.map((q) => (
                  <QuoteColumn key={q.id} quote={q} briefOpen={brief.data?.status === 'open'} />
                ))}
              </div>
              <div className="mt-4">
                <LegalCaution />
              </div>
            </>
          )
        }
      </QueryState>
    </>
  );
}

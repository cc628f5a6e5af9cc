import { Link, useParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { paths } from '@/config/paths';
import { Alert, Button, Card, PageHeader } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { QueryState } from '@/features/briefs/components/query-state';
import { dateText } from '@/features/briefs/components/format';
import { useQuote } from '@/features/quotes/api/get-quote';
import { useRespondAsEngineer, useWithdrawQuote } from '@/features/quotes/api/quote-actions';
import { QuoteStatusBadge } from '@/features/quotes/components/quote-status-badge';
import { LegalCaution, LineItems, RightsText } from '@/features/quotes/components/quote-terms';
import { useDocumentTitle } from '@/lib/use-document-title';
import { QuotePackageSummary } from '@/features/mic-packages/components/quote-package-summary';

export function Component() {
  const { quoteId = '' } = useParams();
  const quote = useQuote(quoteId);
  const { user } = useMe();
  const withdraw = useWithdrawQuote();
  const respond = useRespondAsEngineer();
  useDocumentTitle(quote.data ? `Quote for ${quote.data.briefTitle}` : 'Quote');
  return (
    <QueryState isPending={quote.isPending} error={quote.error} retry={() => void quote.refetch()} loadingLabel="Loading the quote">
      {() => {
        const q = quote.data!;
        const isDrummer = user?.id === q.drummerId;
        const isEngineer = user?.id === q.engineer?.id;
        return (
          <>
            <PageHeader
              title={`Quote for ${q.briefTitle}`}
              description={
                <span className="flex flex-wrap items-center gap-2">
                  <QuoteStatusBadge status={q.status} /> by {q.drummerName} ·{' '}
                  <Link to={paths.brief.getHref(q.briefId)} className="underline">
                    the brief
                  </Link>
                </span>
              }
            />
            <div className="grid gap-6 lg:grid-cols-2">
              <Card className="space-y-4">
                <h2 className="text-xl font-bold">Price</h2>
                <LineItems items={q.lineItems} totalMinor={q.totalMinor} currency={q.currency} extraRevisionMinor={q.extraRevisionMinor} />
                {q.engineer ? (
                  <p>
                    Engineer {q.engineer.displayName}: {formatMoney(q.engineer.shareMinor, q.currency)} ({q.engineer.status})
                  </p>
                ) : null}
                <QuotePackageSummary packageId={q.packageId} />
              </Card>
              <Card className="space-y-3">
                <h2 className="text-xl font-bold">Terms</h2>
                <p>
                  {q.revisionsIncluded} revisions included · {q.turnaroundDays} days turnaround
                  {q.recordingDate ? ` · records on ${dateText(q.recordingDate)}` : ''}
                </p>
                <RightsText terms={q.rightsTerms} points={q.royaltyPoints} />
                <LegalCaution />
                {q.message ? <blockquote className="border-l-4 border-line-strong pl-3 italic">{q.message}</blockquote> : null}
                <p className="text-sm text-ink-muted">Valid until {new Date(q.validUntil).toLocaleDateString()}</p>
                {q.declineReason ? <p>Declined: {q.declineReason}</p> : null}
              </Card>
            </div>
            <div className="mt-6 space-y-3">
              {withdraw.error ? <Alert tone="error">{withdraw.error.message}</Alert> : null}
              {respond.error ? <Alert tone="error">{respond.error.message}</Alert> : null}
              {isDrummer && q.status === 'sent' ? (
                <Button variant="secondary" busy={withdraw.isPending} onClick={() => withdraw.mutate(q.id)}>
                  Withdraw my quote
                </Button>
              ) : null}
              {isEngineer && q.engineer?.status === 'pending' && q.status === 'sent' ? (
                <Card className="space-y-3">
                  <p>{q.drummerName} named you as the engineer (room and mic package) on this quote. The songwriter can accept it only once you confirm.</p>
                  <div className="flex gap-3">
                    <Button busy={respond.isPending} onClick={() => respond.mutate({ id: q.id, confirm: true })}>
                      Confirm
                    </Button>
                    <Button variant="danger" busy={respond.isPending} onClick={() => respond.mutate({ id: q.id, confirm: false })}>
                      Decline
                    </Button>
                  </div>
                </Card>
              ) : null}
            </div>
          </>
        );
      }}
    </QueryState>
  );
}

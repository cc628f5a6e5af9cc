import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import type { QuoteView } from '@shared/schemas/quotes';
import { paths } from '@/config/paths';
import { ButtonLink, Card, EmptyState, PageHeader } from '@/components/ui';
import { useCan } from '@/features/auth/hooks/use-can';
import { useMe } from '@/features/auth/hooks/use-me';
import { QueryState } from '@/features/briefs/components/query-state';
import { useEngineerRequests } from '@/features/quotes/api/get-engineer-requests';
import { useMyQuotes } from '@/features/quotes/api/get-my-quotes';
import { QuoteStatusBadge } from '@/features/quotes/components/quote-status-badge';
import { useDocumentTitle } from '@/lib/use-document-title';

function QuoteRow({ quote, who }: { quote: QuoteView; who: string }) {
  return (
    <Card className="flex flex-col gap-2 sm:flex-row sm:items-center sm:justify-between">
      <div>
        <h3 className="text-lg font-bold">
          <Link to={paths.quote.getHref(quote.id)} className="underline-offset-2 hover:underline">
            {quote.briefTitle}
          </Link>
        </h3>
        <p className="text-ink-muted">
          {who} · {formatMoney(quote.totalMinor, quote.currency)} · {quote.turnaroundDays} days
        </p>
      </div>
      <QuoteStatusBadge status={quote.status} />
    </Card>
  );
}

export function Component() {
  useDocumentTitle('My quotes');
  const isDrummer = useCan('create:quote:own');
  const { user } = useMe();
  const isEngineer = !!user?.roles.includes('engineer');
  const mine = useMyQuotes(isDrummer);
  const requests = useEngineerRequests(isEngineer);
  return (
    <>
      <PageHeader title="My quotes" description="The quotes you sent, and the ones that name you as the engineer." />
      {isDrummer ? (
        <section aria-labelledby="sent-heading" className="space-y-3">
          <h2 id="sent-heading" className="text-xl font-bold">
            Quotes you sent
          </h2>
          <QueryState isPending={mine.isPending} error={mine.error} retry={() => void mine.refetch()} loadingLabel="Loading your quotes">
            {() =>
              mine.data!.items.length === 0 ? (
                <EmptyState title="No quotes sent yet" action={<ButtonLink to={paths.openBriefs.getHref()}>See open briefs</ButtonLink>}>
                  Find a brief that fits your playing and send a quote with your price and turnaround.
                </EmptyState>
              ) : (
                <ul className="grid gap-3">
                  {mine.data!.items.map((q) => (
                    <li key={q.id}>
                      <QuoteRow quote={q} who="Your quote" />
                    </li>
                  ))}
                </ul>
              )
            }
          </QueryState>
        </section>
      ) : null}
      {isEngineer ? (
        <section aria-labelledby="engineer-heading" className="mt-8 space-y-3">
          <h2 id="engineer-heading" className="text-xl font-bold">
            Quotes that name you as the engineer
          </h2>
          <QueryState isPending={requests.isPending} error={requests.error} retry={() => void requests.refetch()} loadingLabel="Loading engineer requests">
            {() =>
              requests.data!.items.length === 0 ? (
                <EmptyState title="Nobody has named you yet">When a drummer quotes with your room and mic package, it shows here for you to confirm.</EmptyState>
              ) : (
                <ul className="grid gap-3">
                  {requests.data!.items.map((q) => (
                    <li key={q.id}>
                      <QuoteRow quote={q} who={`By ${q.drummerName}`} />
                    </li>
                  ))}
                </ul>
              )
            }
          </QueryState>
        </section>
      ) : null}
      {!isDrummer && !isEngineer ? <EmptyState title="Quotes are sent by drummers">Songwriters see the quotes on their briefs under My briefs.</EmptyState> : null}
    </>
  );
}

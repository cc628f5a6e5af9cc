import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ButtonLink, Card, EmptyState, PageHeader } from '@/components/ui';
import { useMyBriefs } from '@/features/briefs/api/get-my-briefs';
import { BriefStatusBadge } from '@/features/briefs/components/brief-status-badge';
import { budgetText, dateText, styleLabel, tempoText } from '@/features/briefs/components/format';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('My briefs');
  const briefs = useMyBriefs();
  return (
    <>
      <PageHeader title="My briefs" description="The songs you want drums for, and the quotes they received." actions={<ButtonLink to={paths.newBrief.getHref()}>New brief</ButtonLink>} />
      <QueryState isPending={briefs.isPending} error={briefs.error} retry={() => void briefs.refetch()} loadingLabel="Loading your briefs">
        {() =>
          briefs.data!.items.length === 0 ? (
            <EmptyState title="No briefs yet" action={<ButtonLink to={paths.newBrief.getHref()}>Write your first brief</ButtonLink>}>
              A brief tells drummers about your song: tempo, key, length, the feel you want and your budget. It stays a private draft until you publish it.
            </EmptyState>
          ) : (
            <ul className="grid gap-4">
              {briefs.data!.items.map((b) => (
                <li key={b.id}>
                  <Card className="flex flex-col gap-2 sm:flex-row sm:items-center sm:justify-between">
                    <div>
                      <h2 className="text-lg font-bold">
                        <Link to={paths.brief.getHref(b.id)} className="underline-offset-2 hover:underline">
                          {b.songTitle}
                        </Link>
                      </h2>
                      <p className="text-ink-muted">
                        {styleLabel(b.style)} · {tempoText(b)} · {budgetText(b)} · due {dateText(b.deadline)}
                      </p>
                    </div>
                    <div className="flex items-center gap-3">
                      <BriefStatusBadge status={b.status} />
                      {b.status !== 'draft' ? (
                        <Link to={paths.compareQuotes.getHref(b.id)} className="font-medium text-brand-800 underline">
                          {b.quoteCount ?? 0} {b.quoteCount === 1 ? 'quote' : 'quotes'}
                        </Link>
                      ) : null}
                    </div>
                  </Card>
                </li>
              ))}
            </ul>
          )
        }
      </QueryState>
    </>
  );
}

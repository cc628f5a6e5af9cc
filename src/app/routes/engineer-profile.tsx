import { Link, useParams } from 'react-router-dom';
import { ENGINEER_SERVICE_LABELS, type EngineerService } from '@shared/schemas/profiles';
import { Card, EmptyState, PageHeader } from '@/components/ui';
import { paths } from '@/config/paths';
import { useEngineer } from '@/features/profiles/api/get-engineer';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { engineerId = '' } = useParams();
  const engineer = useEngineer(engineerId);
  useDocumentTitle(engineer.data ? engineer.data.displayName : 'Engineer');
  return (
    <QueryState isPending={engineer.isPending} error={engineer.error} retry={() => void engineer.refetch()} loadingLabel="Loading the profile" notFoundText="This engineer has no public profile yet.">
      {() => {
        const e = engineer.data!;
        return (
          <>
            <PageHeader title={e.displayName} description={e.headline} />
            <div className="grid gap-6 lg:grid-cols-2">
              <Card className="space-y-3">
                <h2 className="text-xl font-bold">About</h2>
                {e.bio ? <p className="whitespace-pre-line">{e.bio}</p> : <p className="text-ink-muted">No description yet.</p>}
                <p className="text-ink-muted">{[e.town, e.country, e.timeZone.replace(/_/g, ' ')].filter(Boolean).join(' · ')}</p>
                {e.isDrummer ? (
                  <p>
                    Also a drummer:{' '}
                    <Link to={paths.drummer.getHref(e.id)} className="font-medium text-brand-800 underline">
                      hear the reel
                    </Link>
                  </p>
                ) : null}
              </Card>
              <Card className="space-y-3">
                <h2 className="text-xl font-bold">Services</h2>
                {e.services.length ? (
                  <ul className="list-disc pl-5">
                    {e.services.map((s) => (
                      <li key={s}>{ENGINEER_SERVICE_LABELS[s as EngineerService] ?? s}</li>
                    ))}
                  </ul>
                ) : (
                  <p className="text-ink-muted">No services listed yet.</p>
                )}
              </Card>
              <Card className="space-y-3 lg:col-span-2">
                <h2 className="text-xl font-bold">Rooms and mic packages</h2>
                <EmptyState title="Rooms are listed separately">
                  Browse <Link to={paths.rooms.getHref()} className="underline">rooms and mic packages</Link> to see what engineers offer.
                </EmptyState>
              </Card>
            </div>
          </>
        );
      }}
    </QueryState>
  );
}

import { Link, useParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { styleLabel } from '@shared/schemas/profiles';
import { Badge, Card, EmptyState, PageHeader } from '@/components/ui';
import { paths } from '@/config/paths';
import { useDrummer } from '@/features/profiles/api/get-drummer';
import { ReelPlayer } from '@/features/reels/components/reel-player';
import { ratingText } from '@/features/search/components/drummer-card';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { drummerId = '' } = useParams();
  const drummer = useDrummer(drummerId);
  useDocumentTitle(drummer.data ? drummer.data.displayName : 'Drummer');
  return (
    <QueryState isPending={drummer.isPending} error={drummer.error} retry={() => void drummer.refetch()} loadingLabel="Loading the profile" notFoundText="This drummer's profile is not published.">
      {() => {
        const d = drummer.data!;
        const place = [d.town, d.country].filter(Boolean).join(', ');
        return (
          <>
            <PageHeader
              title={d.displayName}
              description={d.headline}
              actions={d.takingWork ? <Badge tone="success">Taking work</Badge> : <Badge>Booked up for now</Badge>}
            />
            <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
              <div className="space-y-6">
                <Card className="space-y-4">
                  <h2 className="text-xl font-bold">Reel</h2>
                  {d.reelTracks.length === 0 ? (
                    <EmptyState title="No reel tracks yet">This drummer has not uploaded any tracks.</EmptyState>
                  ) : (
                    <ul className="space-y-6">
                      {d.reelTracks.map((t) => (
                        <li key={t.id}>
                          <ReelPlayer track={{ ...t, style: t.style ? styleLabel(t.style) : '' }} />
                        </li>
                      ))}
                    </ul>
                  )}
                </Card>
                {d.bio ? (
                  <Card className="space-y-2">
                    <h2 className="text-xl font-bold">About</h2>
                    <p className="whitespace-pre-line">{d.bio}</p>
                  </Card>
                ) : null}
                {d.kit ? (
                  <Card className="space-y-2">
                    <h2 className="text-xl font-bold">Kit</h2>
                    <p className="whitespace-pre-line">{d.kit}</p>
                  </Card>
                ) : null}
              </div>
              <Card className="space-y-3 self-start">
                <h2 className="text-xl font-bold">Rates and terms</h2>
                <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
                  <dt className="text-ink-muted">Per song</dt>
                  <dd>{formatMoney(d.baseRateMinor, d.currency)}</dd>
                  <dt className="text-ink-muted">Turnaround</dt>
                  <dd>usually {d.turnaroundDays} days</dd>
                  <dt className="text-ink-muted">Revisions</dt>
                  <dd>{d.revisionsIncluded} included</dd>
                  <dt className="text-ink-muted">Rating</dt>
                  <dd>{ratingText(d.ratingAvg, d.ratingCount)}</dd>
                  <dt className="text-ink-muted">Where</dt>
                  <dd>{[place, d.timeZone.replace(/_/g, ' ')].filter(Boolean).join(' · ')}</dd>
                </dl>
                <div className="flex flex-wrap gap-1">
                  {d.styles.map((s) => (
                    <Badge key={s} tone="brand">
                      {styleLabel(s)}
                    </Badge>
                  ))}
                  {d.tags.map((t) => (
                    <Badge key={t}>{t}</Badge>
                  ))}
                </div>
                {d.isEngineer ? (
                  <p>
                    Also an engineer:{' '}
                    <Link to={paths.engineer.getHref(d.id)} className="font-medium text-brand-800 underline">
                      see rooms and services
                    </Link>
                  </p>
                ) : null}
              </Card>
            </div>
          </>
        );
      }}
    </QueryState>
  );
}

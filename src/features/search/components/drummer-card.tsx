import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { styleLabel, type DrummerSearchItem } from '@shared/schemas/profiles';
import { Badge, Card } from '@/components/ui';
import { paths } from '@/config/paths';

export function ratingText(avg: number | null, count: number): string {
  return avg === null || count === 0 ? 'No reviews yet' : `${avg.toFixed(1)} / 5 from ${count} ${count === 1 ? 'review' : 'reviews'}`;
}

export function DrummerCard({ drummer }: { drummer: DrummerSearchItem }) {
  const place = [drummer.town, drummer.country].filter(Boolean).join(', ');
  return (
    <Card className="space-y-2">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="text-lg font-bold">
          <Link to={paths.drummer.getHref(drummer.id)} className="underline-offset-2 hover:underline">
            {drummer.displayName}
          </Link>
        </h2>
        {drummer.takingWork ? <Badge tone="success">Taking work</Badge> : <Badge>Booked up</Badge>}
        {drummer.reelTrackId ? <Badge tone="brand">Has a reel</Badge> : null}
      </div>
      <p>{drummer.headline}</p>
      <p className="text-ink-muted">
        {formatMoney(drummer.baseRateMinor, drummer.currency)} per song · usually {drummer.turnaroundDays} {drummer.turnaroundDays === 1 ? 'day' : 'days'} · {ratingText(drummer.ratingAvg, drummer.ratingCount)}
      </p>
      <p className="text-sm text-ink-muted">
        {drummer.styles.map(styleLabel).join(', ')}
        {place ? ` · ${place}` : ''} · {drummer.timeZone.replace(/_/g, ' ')}
      </p>
    </Card>
  );
}

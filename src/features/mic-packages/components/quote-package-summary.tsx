import { Link } from 'react-router-dom';
import { READING_LABELS } from '@shared/acoustics';
import { paths } from '@/config/paths';
import { Spinner } from '@/components/ui';
import { useRoom } from '@/features/rooms/api/get-room';
import { useMicPackage } from '../api/get-mic-package';

/** The room and mic package a quote names, for the quote and compare views (a small, self-loading block). */
export function QuotePackageSummary({ packageId }: { packageId: string | null }) {
  const pkg = useMicPackage(packageId);
  const room = useRoom(pkg.data?.roomId ?? '');
  if (!packageId) return null;
  if (pkg.isPending) return <Spinner label="Loading the mic package" />;
  if (pkg.error || !pkg.data) return <p className="text-sm text-ink-muted">The mic package named on this quote is not available.</p>;
  const p = pkg.data;
  const r = room.data;
  return (
    <div className="space-y-1 rounded-lg bg-canvas-sunken px-3 py-2 text-sm" data-testid="quote-package">
      <p>
        <span className="font-medium">Room:</span>{' '}
        <Link className="underline" to={paths.room.getHref(p.roomId)}>
          {p.roomName}
        </Link>{' '}
        in {p.roomTown}
        {r ? ` · ${r.volumeM3.toFixed(0)} m³, reads ${READING_LABELS[r.reading]} (RT60 ${r.midRt60Sec.toFixed(2)} s)` : ''}
      </p>
      <p>
        <span className="font-medium">Mic package:</span> {p.name} · {p.channels.length} channels by {p.engineerName}
      </p>
    </div>
  );
}

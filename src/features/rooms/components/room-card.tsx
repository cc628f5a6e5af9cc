import { Link } from 'react-router-dom';
import { READING_LABELS } from '@shared/acoustics';
import { formatMoney } from '@shared/money';
import type { RoomSummary } from '@shared/schemas/rooms';
import { paths } from '@/config/paths';
import { Badge, Card } from '@/components/ui';

export function RoomCard({ room }: { room: RoomSummary }) {
  return (
    <Card className="flex gap-4">
      {room.thumbUrl ? (
        <img src={room.thumbUrl} alt="" className="size-24 shrink-0 rounded-lg object-cover" loading="lazy" />
      ) : (
        <div className="flex size-24 shrink-0 items-center justify-center rounded-lg bg-canvas-sunken text-xs text-ink-muted" aria-hidden="true">
          no photo
        </div>
      )}
      <div className="min-w-0 space-y-1">
        <h3 className="text-lg font-bold">
          <Link to={paths.room.getHref(room.id)} className="hover:underline">
            {room.name}
          </Link>
        </h3>
        <p className="text-sm text-ink-muted">
          {room.town} · {room.timeZone.replace(/_/g, ' ')} · by {room.engineerName}
        </p>
        <p className="flex flex-wrap items-center gap-2 text-sm">
          <Badge tone="brand">{READING_LABELS[room.reading]}</Badge>
          <span>RT60 {room.midRt60Sec.toFixed(2)} s</span>
          <span>{room.volumeM3.toFixed(0)} m³</span>
          <span>{room.inputs} inputs</span>
          <span>
            {formatMoney(room.dayRateMinor, room.currency)} a day · {formatMoney(room.halfDayRateMinor, room.currency)} half day
          </span>
          <span>
            {room.packageCount} mic package{room.packageCount === 1 ? '' : 's'}
          </span>
        </p>
      </div>
    </Card>
  );
}

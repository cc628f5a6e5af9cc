import { Card } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useRoomAcoustics } from '../api/get-room-acoustics';
import { ModesChart } from './modes-chart';
import { Rt60Chart } from './rt60-chart';
import { RoomReading } from './room-reading';

export function RoomAcousticsPanel({ roomId }: { roomId: string }) {
  const acoustics = useRoomAcoustics(roomId);
  return (
    <section aria-labelledby="acoustics-heading" className="space-y-4">
      <h2 id="acoustics-heading" className="text-2xl font-bold">
        How the room sounds (estimate)
      </h2>
      <QueryState isPending={acoustics.isPending} error={acoustics.error} retry={() => void acoustics.refetch()} loadingLabel="Working out the acoustics">
        {() => (
          <div className="grid gap-6 lg:grid-cols-2">
            <Card className="space-y-3">
              <h3 className="text-lg font-bold">Reverberation time per band</h3>
              <Rt60Chart acoustics={acoustics.data!} />
            </Card>
            <Card className="space-y-3">
              <h3 className="text-lg font-bold">Room modes</h3>
              <ModesChart acoustics={acoustics.data!} />
            </Card>
            <Card className="lg:col-span-2">
              <h3 className="mb-2 text-lg font-bold">What it means for drums</h3>
              <RoomReading acoustics={acoustics.data!} />
            </Card>
          </div>
        )}
      </QueryState>
    </section>
  );
}

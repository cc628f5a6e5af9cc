import { useNavigate, useParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { paths } from '@/config/paths';
import { Alert, Badge, Button, ButtonLink, Card, EmptyState, PageHeader, Spinner } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useRoomPackages } from '@/features/mic-packages/api/get-room-packages';
import { PackageSummary } from '@/features/mic-packages/components/package-summary';
import { useArchiveRoom } from '@/features/rooms/api/archive-room';
import { useRoom } from '@/features/rooms/api/get-room';
import { useSetBlockedDates } from '@/features/rooms/api/set-blocked-dates';
import { BlockedDatesCalendar } from '@/features/rooms/components/blocked-dates-calendar';
import { RoomAcousticsPanel } from '@/features/rooms/components/room-acoustics-panel';
import { RoomPhotos } from '@/features/rooms/components/room-photos';
import { GeneralCautions } from '@/features/safety/components/general-cautions';
import { HearingSafetyPanel } from '@/features/safety/components/hearing-safety-panel';
import { useDocumentTitle } from '@/lib/use-document-title';

function Packages({ roomId, mine }: { roomId: string; mine: boolean }) {
  const packages = useRoomPackages(roomId);
  if (packages.isPending) return <Spinner label="Loading mic packages" />;
  if (packages.error) return <Alert tone="error">{packages.error.message}</Alert>;
  if (packages.data.items.length === 0) {
    return (
      <EmptyState title="No mic packages yet" action={mine ? <ButtonLink to={paths.newMicPackage.getHref(roomId)}>Make a mic package</ButtonLink> : undefined}>
        {mine ? 'A package is your input list: which mic goes where. Drummers name it in their quotes.' : 'The engineer has not listed an input list for this room yet.'}
      </EmptyState>
    );
  }
  return (
    <div className="space-y-4">
      {packages.data.items.map((p) => (
        <PackageSummary key={p.id} pkg={p} />
      ))}
      {mine ? <ButtonLink to={paths.newMicPackage.getHref(roomId)}>Make another mic package</ButtonLink> : null}
    </div>
  );
}

export function Component() {
  const { roomId = '' } = useParams();
  const room = useRoom(roomId);
  const blocked = useSetBlockedDates(roomId);
  const archive = useArchiveRoom();
  const navigate = useNavigate();
  useDocumentTitle(room.data?.name ?? 'Room');
  return (
    <QueryState isPending={room.isPending} error={room.error} retry={() => void room.refetch()} loadingLabel="Loading the room" notFoundText="This room does not exist or is no longer listed.">
      {() => {
        const r = room.data!;
        return (
          <div className="space-y-8">
            <PageHeader
              title={r.name}
              description={
                <span className="flex flex-wrap items-center gap-2">
                  {r.town} · by {r.engineerName} · {r.inputs} inputs · {formatMoney(r.dayRateMinor, r.currency)} a day, {formatMoney(r.halfDayRateMinor, r.currency)} half day
                  {r.archived ? <Badge>removed</Badge> : null}
                </span>
              }
              actions={
                r.mine && !r.archived ? (
                  <>
                    <ButtonLink to={paths.editRoom.getHref(r.id)} variant="secondary">
                      Edit room
                    </ButtonLink>
                    <Button variant="danger" busy={archive.isPending} onClick={() => archive.mutate(r.id, { onSuccess: () => navigate(paths.myRooms.getHref()) })}>
                      Remove room
                    </Button>
                  </>
                ) : undefined
              }
            />
            {archive.error ? <Alert tone="error">{archive.error.message}</Alert> : null}
            {r.description ? <p className="max-w-3xl text-lg">{r.description}</p> : null}
            <section aria-labelledby="photos-heading" className="space-y-3">
              <h2 id="photos-heading" className="text-2xl font-bold">
                Photos
              </h2>
              <RoomPhotos room={r} />
            </section>
            <RoomAcousticsPanel roomId={r.id} />
            <section aria-labelledby="packages-heading" className="space-y-3">
              <h2 id="packages-heading" className="text-2xl font-bold">
                Mic packages
              </h2>
              <Packages roomId={r.id} mine={r.mine && !r.archived} />
            </section>
            <div className="grid items-start gap-6 lg:grid-cols-2">
              <Card className="space-y-3">
                <h2 className="text-xl font-bold">Calendar</h2>
                <BlockedDatesCalendar
                  key={r.blockedDates.join(',')}
                  timeZone={r.timeZone}
                  blocked={r.blockedDates}
                  editable={r.mine && !r.archived}
                  saving={blocked.isPending}
                  error={blocked.error?.message ?? null}
                  onSave={(dates) => blocked.mutate(dates)}
                />
              </Card>
              <div className="space-y-6">
                <HearingSafetyPanel />
                <GeneralCautions />
              </div>
            </div>
          </div>
        );
      }}
    </QueryState>
  );
}

import { paths } from '@/config/paths';
import { ButtonLink, EmptyState, PageHeader } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useMyRooms } from '@/features/rooms/api/get-my-rooms';
import { RoomCard } from '@/features/rooms/components/room-card';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('My rooms');
  const rooms = useMyRooms();
  return (
    <>
      <PageHeader title="My rooms" description="Your rooms and mic packages, with their acoustics." actions={<ButtonLink to={paths.newRoom.getHref()}>List a room</ButtonLink>} />
      <QueryState isPending={rooms.isPending} error={rooms.error} retry={() => void rooms.refetch()} loadingLabel="Loading your rooms">
        {() =>
          rooms.data!.items.length === 0 ? (
            <EmptyState title="No rooms yet" action={<ButtonLink to={paths.newRoom.getHref()}>List your first room</ButtonLink>}>
              List a room with its size and surfaces; Kitlane estimates how it sounds and songwriters can find it.
            </EmptyState>
          ) : (
            <ul className="space-y-3">
              {rooms.data!.items.map((r) => (
                <li key={r.id}>
                  <RoomCard room={r} />
                </li>
              ))}
            </ul>
          )
        }
      </QueryState>
    </>
  );
}

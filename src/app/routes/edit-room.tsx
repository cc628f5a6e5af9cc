import { useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, PageHeader } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useRoom } from '@/features/rooms/api/get-room';
import { useUpdateRoom } from '@/features/rooms/api/update-room';
import { RoomForm } from '@/features/rooms/components/room-form';
import { roomInputOfView } from '@/features/rooms/components/room-input';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { roomId = '' } = useParams();
  const room = useRoom(roomId);
  const update = useUpdateRoom();
  const navigate = useNavigate();
  useDocumentTitle(room.data ? `Edit ${room.data.name}` : 'Edit room');
  return (
    <QueryState isPending={room.isPending} error={room.error} retry={() => void room.refetch()} loadingLabel="Loading the room">
      {() => (
        <>
          <PageHeader title={`Edit ${room.data!.name}`} />
          {room.data!.mine ? (
            <RoomForm
              initial={roomInputOfView(room.data!)}
              submitLabel="Save changes"
              onSubmit={async (input) => {
                await update.mutateAsync({ id: roomId, input });
                navigate(paths.room.getHref(roomId));
              }}
            />
          ) : (
            <Alert tone="info">Only the engineer who listed this room can change it.</Alert>
          )}
        </>
      )}
    </QueryState>
  );
}

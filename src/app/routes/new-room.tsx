import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, PageHeader } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useCan } from '@/features/auth/hooks/use-can';
import { useCreateRoom } from '@/features/rooms/api/create-room';
import { emptyRoom, RoomForm } from '@/features/rooms/components/room-form';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('List a room');
  const { user } = useMe();
  const canList = useCan('create:room:own');
  const create = useCreateRoom();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title="List a room" description="Its size and surfaces give an estimate of how it sounds; songwriters see it on the room page." />
      {canList ? (
        <RoomForm
          initial={emptyRoom(user?.timeZone ?? 'UTC')}
          submitLabel="Save the room"
          onSubmit={async (input) => {
            const room = await create.mutateAsync(input);
            navigate(paths.room.getHref(room.id));
          }}
        />
      ) : (
        <Alert tone="info">Only engineers list rooms. Add the engineer role on your account page.</Alert>
      )}
    </>
  );
}

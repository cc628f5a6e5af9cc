import { useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, PageHeader } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useCreateMicPackage } from '@/features/mic-packages/api/create-mic-package';
import { emptyPackage, PackageEditor } from '@/features/mic-packages/components/package-editor';
import { useRoom } from '@/features/rooms/api/get-room';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { roomId = '' } = useParams();
  const room = useRoom(roomId);
  const create = useCreateMicPackage();
  const navigate = useNavigate();
  useDocumentTitle('New mic package');
  return (
    <QueryState isPending={room.isPending} error={room.error} retry={() => void room.refetch()} loadingLabel="Loading the room">
      {() => {
        const r = room.data!;
        return (
          <>
            <PageHeader title="New mic package" description={`An input list for ${r.name} (${r.inputs} inputs).`} />
            {r.mine ? (
              <PackageEditor
                room={r}
                initial={emptyPackage(r)}
                submitLabel="Save the package"
                onSubmit={async (input) => {
                  await create.mutateAsync({ roomId: r.id, input });
                  navigate(paths.room.getHref(r.id));
                }}
              />
            ) : (
              <Alert tone="info">Only the engineer who listed this room can add packages to it.</Alert>
            )}
          </>
        );
      }}
    </QueryState>
  );
}

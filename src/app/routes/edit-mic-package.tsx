import { useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, Button, PageHeader } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useArchiveMicPackage } from '@/features/mic-packages/api/archive-mic-package';
import { useMicPackage } from '@/features/mic-packages/api/get-mic-package';
import { useUpdateMicPackage } from '@/features/mic-packages/api/update-mic-package';
import { PackageEditor } from '@/features/mic-packages/components/package-editor';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { packageId = '' } = useParams();
  const pkg = useMicPackage(packageId);
  const update = useUpdateMicPackage();
  const archive = useArchiveMicPackage();
  const navigate = useNavigate();
  useDocumentTitle(pkg.data ? `Edit ${pkg.data.name}` : 'Edit mic package');
  return (
    <QueryState isPending={pkg.isPending} error={pkg.error} retry={() => void pkg.refetch()} loadingLabel="Loading the mic package">
      {() => {
        const p = pkg.data!;
        const room = { id: p.roomId, name: p.roomName, inputs: p.roomInputs, currency: p.currency };
        return (
          <>
            <PageHeader
              title={`Edit ${p.name}`}
              description={`An input list for ${p.roomName} (${p.roomInputs} inputs).`}
              actions={
                p.mine && !p.archived ? (
                  <Button variant="danger" busy={archive.isPending} onClick={() => archive.mutate(p.id, { onSuccess: () => navigate(paths.room.getHref(p.roomId)) })}>
                    Remove package
                  </Button>
                ) : undefined
              }
            />
            {archive.error ? <Alert tone="error">{archive.error.message}</Alert> : null}
            {p.mine && !p.archived ? (
              <PackageEditor
                room={room}
                initial={{ name: p.name, priceMinor: p.priceMinor, currency: p.currency, channels: p.channels }}
                submitLabel="Save changes"
                onSubmit={async (input) => {
                  await update.mutateAsync({ id: p.id, input });
                  navigate(paths.room.getHref(p.roomId));
                }}
              />
            ) : (
              <Alert tone="info">Only the engineer who made this package can change it.</Alert>
            )}
          </>
        );
      }}
    </QueryState>
  );
}

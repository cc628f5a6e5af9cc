import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui';
import { paths } from '@/config/paths';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { DisputeCase } from '@/features/admin/components/dispute-case';
import { useDisputeCase } from '@/features/admin/api/get-dispute-case';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { disputeId = '' } = useParams();
  const file = useDisputeCase(disputeId);
  useDocumentTitle(file.data ? `Dispute: ${file.data.dispute.songTitle}` : 'Dispute');
  return (
    <>
      <PageHeader
        title={file.data ? `Dispute on “${file.data.dispute.songTitle}”` : 'Dispute'}
        description={
          <Link to={paths.adminDesk.getHref()} className="underline">
            Back to the queue
          </Link>
        }
      />
      <AdminNav />
      <QueryState isPending={file.isPending} error={file.error} retry={() => void file.refetch()} loadingLabel="Loading the case" notFoundText="This dispute does not exist.">
        {() => <DisputeCase file={file.data!} />}
      </QueryState>
    </>
  );
}

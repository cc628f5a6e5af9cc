import { useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, ButtonLink, Card, PageHeader } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useBrief } from '@/features/briefs/api/get-brief';
import { useUpdateBrief } from '@/features/briefs/api/update-brief';
import { BriefForm } from '@/features/briefs/components/brief-form';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  const { briefId = '' } = useParams();
  const brief = useBrief(briefId);
  const update = useUpdateBrief();
  const navigate = useNavigate();
  const { user } = useMe();
  useDocumentTitle(brief.data ? `Edit ${brief.data.songTitle}` : 'Edit brief');
  return (
    <>
      <PageHeader title="Edit brief" />
      <QueryState isPending={brief.isPending} error={brief.error} retry={() => void brief.refetch()} loadingLabel="Loading the brief">
        {() =>
          brief.data!.status !== 'draft' || !brief.data!.viewer.isOwner ? (
            <Alert tone="warning" title="Only drafts can be edited">
              <p>This brief is {brief.data!.status}; what drummers saw stays as it was.</p>
              <ButtonLink to={paths.brief.getHref(briefId)} variant="secondary" size="sm" className="mt-3">
                Back to the brief
              </ButtonLink>
            </Alert>
          ) : (
            <Card>
              <BriefForm
                brief={brief.data!}
                timeZone={user?.timeZone ?? brief.data!.timeZone}
                submitLabel="Save changes"
                busy={update.isPending}
                onSave={async (input) => {
                  await update.mutateAsync({ id: briefId, input });
                  navigate(paths.brief.getHref(briefId));
                }}
              />
            </Card>
          )
        }
      </QueryState>
    </>
  );
}

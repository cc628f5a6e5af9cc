import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Card, PageHeader } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useCreateBrief } from '@/features/briefs/api/create-brief';
import { BriefForm } from '@/features/briefs/components/brief-form';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('New brief');
  const { user } = useMe();
  const create = useCreateBrief();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title="New brief" description="Saved as a private draft. Add a guide track next, then publish it for drummers." />
      <Card>
        <BriefForm
          brief={null}
          timeZone={user?.timeZone ?? 'UTC'}
          submitLabel="Save draft"
          busy={create.isPending}
          onSave={async (input) => {
            const brief = await create.mutateAsync(input);
            navigate(paths.brief.getHref(brief.id));
          }}
        />
      </Card>
    </>
  );
}

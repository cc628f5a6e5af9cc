import { useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, ButtonLink } from '@/components/ui';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token');
  useDocumentTitle('Choose a new password');
  return (
    <AuthPageLayout title="Choose a new password">
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <div className="space-y-4">
          <Alert tone="error" title="This link is incomplete">
            Open the link from the mail again, or ask for a new one.
          </Alert>
          <ButtonLink to={paths.forgotPassword.getHref()} variant="secondary">
            Ask for a new link
          </ButtonLink>
        </div>
      )}
    </AuthPageLayout>
  );
}

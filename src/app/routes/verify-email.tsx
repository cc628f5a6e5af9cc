import { useEffect, useRef } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, ButtonLink, SpinnerIcon } from '@/components/ui';
import { useVerifyEmail } from '@/features/auth/api/verify-email';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

const GO_ON_AFTER_MS = 2500;

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const verify = useVerifyEmail();
  const navigate = useNavigate();
  // A link works once: guard against React running the effect twice (StrictMode) and posting it again.
  const sent = useRef(false);
  useDocumentTitle('Confirm your email');

  const { mutate } = verify;
  useEffect(() => {
    if (!token || sent.current) return;
    sent.current = true;
    mutate(token);
  }, [token, mutate]);

  useEffect(() => {
    if (!verify.isSuccess) return;
    const timer = setTimeout(() => navigate(paths.home.getHref(), { replace: true }), GO_ON_AFTER_MS);
    return () => clearTimeout(timer);
  }, [verify.isSuccess, navigate]);

  return (
    <AuthPageLayout title="Confirm your email">
      {!token ? (
        <Alert tone="error" title="This link is incomplete">
          Open the link from the mail again, or ask for a new one on your account page.
        </Alert>
      ) : verify.isError ? (
        <div className="space-y-4">
          <Alert tone="error" title="We could not confirm your email">
            {verify.error.message}
          </Alert>
          <ButtonLink to={paths.account.getHref()} variant="secondary">
            Ask for a new link
          </ButtonLink>
        </div>
      ) : verify.isSuccess ? (
        <div className="space-y-4">
          <Alert tone="success" title="Your email is confirmed">
            Welcome, {verify.data.user.displayName}. You are signed in; taking you on…
          </Alert>
          <ButtonLink to={paths.home.getHref()}>Continue</ButtonLink>
        </div>
      ) : (
        <p role="status" className="flex items-center gap-2 text-brand-800">
          <SpinnerIcon /> Confirming your email…
        </p>
      )}
    </AuthPageLayout>
  );
}

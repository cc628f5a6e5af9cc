import { paths } from '@/config/paths';
import { Alert, ButtonLink, EmptyState } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { ResendVerificationButton } from '@/features/auth/components/resend-verification-button';
import { useConfig } from '@/features/config/api/get-config';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

export function Component() {
  const { user } = useMe();
  const { data: config } = useConfig();
  useDocumentTitle('Check your inbox');

  if (!user) {
    return (
      <AuthPageLayout title="Check your inbox">
        <EmptyState title="You are not signed in" action={<ButtonLink to={paths.signIn.getHref()}>Sign in</ButtonLink>}>
          Sign in to send yourself a new confirmation link.
        </EmptyState>
      </AuthPageLayout>
    );
  }
  if (user.emailVerified) {
    return (
      <AuthPageLayout title="Check your inbox">
        <Alert tone="success" title="Your email is already confirmed">
          You are all set.
        </Alert>
        <ButtonLink to={paths.home.getHref()} className="mt-4">
          Continue
        </ButtonLink>
      </AuthPageLayout>
    );
  }
  return (
    <AuthPageLayout title="Check your inbox" description="Your account is ready. One more step: confirm your email address.">
      <div className="space-y-5">
        <p>
          We sent a link to <strong className="break-all">{user.email}</strong>. Open it to confirm the address; it works for 48 hours.
        </p>
        {config?.mailInboxUrl ? (
          <Alert tone="info">
            This is a local build: mail goes to the{' '}
            <a href={config.mailInboxUrl} className="font-medium underline underline-offset-2">
              local mail inbox
            </a>{' '}
            instead of the real world.
          </Alert>
        ) : null}
        <p className="text-ink-muted">Nothing arrived after a few minutes? Look in the spam folder, or send it again.</p>
        <ResendVerificationButton email={user.email} />
      </div>
    </AuthPageLayout>
  );
}

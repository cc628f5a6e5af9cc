import { paths } from '@/config/paths';
import { Badge, ButtonLink, Card, EmptyState, PageHeader } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { ProfileForm } from '@/features/auth/components/profile-form';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { EmailStatus } from '@/features/auth/components/email-status';
import { useDocumentTitle } from '@/lib/use-document-title';
import { PayoutSection } from '@/features/payments/components/payout-section';

function Section({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby={id}>
      <Card>
        <h2 id={id} className="mb-4 text-xl font-bold">
          {title}
        </h2>
        {children}
      </Card>
    </section>
  );
}

export function Component() {
  const { user } = useMe();
  useDocumentTitle('Account');

  // The loader sends signed-out visitors to sign-in; this covers a session that ends while the page is open.
  if (!user) {
    return (
      <>
        <PageHeader title="Account" />
        <EmptyState title="You are signed out" action={<ButtonLink to={paths.signIn.getHref(paths.account.getHref())}>Sign in</ButtonLink>}>
          Sign in again to see and edit your account.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="Account"
        description={
          <>
            Signed in as {user.displayName}
            {user.roles.includes('admin') ? (
              <Badge tone="brand" className="ml-2 align-middle">
                Admin
              </Badge>
            ) : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <div className="space-y-6">
          <Section id="profile-title" title="Profile">
            <ProfileForm user={user} />
          </Section>
          {user.roles.some((r) => r === 'drummer' || r === 'engineer') ? (
            <div id="payouts">
              <Section id="payouts-title" title="Payouts">
                <PayoutSection />
              </Section>
            </div>
          ) : null}
        </div>
        <div className="space-y-6">
          <Section id="email-title" title="Email">
            <EmailStatus user={user} />
          </Section>
          <Section id="password-title" title="Password">
            <ChangePasswordForm />
          </Section>
        </div>
      </div>
    </>
  );
}

import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

export function Component() {
  useDocumentTitle('Join Kitlane');
  return (
    <AuthPageLayout title="Join Kitlane" description="One account for everything you do here: write, play, or run a room — or all three.">
      <SignUpForm />
    </AuthPageLayout>
  );
}

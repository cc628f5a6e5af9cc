import { useSearchParams } from 'react-router-dom';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

export function Component() {
  const [params] = useSearchParams();
  useDocumentTitle('Sign in');
  return (
    <AuthPageLayout title="Sign in" description="Welcome back. Your briefs, quotes and bookings are where you left them.">
      <SignInForm next={params.get('next')} />
    </AuthPageLayout>
  );
}

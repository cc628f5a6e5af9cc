import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { useDocumentTitle } from '@/lib/use-document-title';
import { AuthPageLayout } from './auth-page-layout';

export function Component() {
  useDocumentTitle('Forgot your password');
  return (
    <AuthPageLayout title="Forgot your password?" description="Tell us the address you signed up with and we will mail you a link.">
      <ForgotPasswordForm />
      <p className="mt-5 text-ink-muted">
        Remembered it?{' '}
        <Link to={paths.signIn.getHref()} className="font-medium text-brand-800 underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </AuthPageLayout>
  );
}

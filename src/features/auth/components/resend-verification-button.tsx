import { Alert, Button } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { useResendVerification } from '../api/resend-verification';

function resendErrorText(error: unknown): string {
  if (isApiError(error) && error.status === 429) {
    return `Too many mails asked for. Try again in ${error.retryAfterSeconds ?? 60} s.`;
  }
  return isApiError(error) ? error.message : 'The mail could not be sent. Please try again.';
}

export function ResendVerificationButton({ email }: { email: string }) {
  const resend = useResendVerification();
  return (
    <div className="space-y-3">
      <Button variant="secondary" busy={resend.isPending} busyLabel="Sending…" onClick={() => resend.mutate()}>
        Send the link again
      </Button>
      {resend.isSuccess ? <Alert tone="success">A new link is on its way to {email}.</Alert> : null}
      {resend.isError ? <Alert tone="error">{resendErrorText(resend.error)}</Alert> : null}
    </div>
  );
}
